import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { sessions } from '@db/schema'
import { pruneExpiredSessions } from '../../server/session/index'
import { browserSession, makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { makeStaff, makeUser } from '../helpers/factories'

let t: TestApp
// One database per file; each test makes its own company, so tests do not see each other's data.
beforeAll(async () => {
  t = await makeTestApp()
})
afterAll(() => t.close())

describe('session API', () => {
  it('GET /api/session when signed out returns no user and a CSRF token', async () => {
    const res = await request(t.app).get('/api/session').expect(200)
    expect(res.body.user).toBeNull()
    expect(res.body.csrfToken).toMatch(/^[\w.-]{40,}$/)
  })

  it('POST /api/session with the right password returns the user and regenerates the session id', async () => {
    const staff = await makeStaff(t.db)
    const s = await browserSession(t.app)
    const sid = (r: { headers: Record<string, unknown> }) => ((r.headers['set-cookie'] as string[] | undefined) ?? []).find((c) => c.startsWith('holdfast.sid='))
    const before = sid(await s.get('/api/session'))
    const res = await s.signIn(staff.office.email, staff.office.password)
    expect(res.status).toBe(200)
    expect(res.body.user).toEqual({ id: staff.office.id, email: staff.office.email, name: staff.office.name, role: 'office' })
    const after = sid(res)
    expect(after).toBeDefined()
    expect(after!.split(';')[0]).not.toBe(before?.split(';')[0])
    expect(after).toMatch(/HttpOnly/)
    expect(after).toMatch(/SameSite=Lax/)
    expect((await s.get('/api/session')).body.user.role).toBe('office')
  })

  it('POST /api/session gives the same message for an unknown e-mail and a wrong password', async () => {
    const staff = await makeStaff(t.db)
    const s = await browserSession(t.app)
    const unknown = await s.signIn('nobody@test.example', 'whatever password')
    const wrong = await s.signIn(staff.manager.email, 'not the password')
    expect(unknown.status).toBe(401)
    expect(wrong.status).toBe(401)
    expect(unknown.body.error).toBe(wrong.body.error)
    // One code too, for the reader's language: it tells no more than the sentence does.
    expect([unknown.body.code, wrong.body.code]).toEqual(['signInRefused', 'signInRefused'])
  })

  it('POST /api/session refuses a deactivated account with the same message', async () => {
    const { company } = await makeStaff(t.db)
    const gone = await makeUser(t.db, company.id, 'dispatcher', { active: false })
    const s = await browserSession(t.app)
    const res = await s.signIn(gone.email, gone.password)
    expect(res.status).toBe(401)
    expect(res.body.error).toMatch(/do not match an active account/)
  })

  it('POST /api/session without the CSRF header is refused and signs nobody in', async () => {
    const staff = await makeStaff(t.db)
    const agent = request.agent(t.app)
    await agent.get('/api/session')
    const res = await agent.post('/api/session').send({ email: staff.manager.email, password: staff.manager.password })
    expect(res.status).toBe(403)
    expect((await agent.get('/api/session')).body.user).toBeNull()
  })

  it('a state-changing request from another origin is refused even with the token', async () => {
    const staff = await makeStaff(t.db)
    const s = await browserSession(t.app)
    const res = await s.agent
      .post('/api/session')
      .set('x-csrf-token', s.csrf)
      .set('origin', 'https://elsewhere.example')
      .send({ email: staff.manager.email, password: staff.manager.password })
    expect(res.status).toBe(403)
    expect(res.body.error).toMatch(/another site/)
  })

  it('POST /api/session with a missing password answers 400 naming the field', async () => {
    const s = await browserSession(t.app)
    const res = await s.post('/api/session', { email: 'a@b.example' })
    expect(res.status).toBe(400)
    expect(res.body.issues).toEqual([{ path: 'password', message: 'Enter your password.', code: 'session.enterYourPassword' }])
  })

  it('DELETE /api/session signs out and removes the session row', async () => {
    const staff = await makeStaff(t.db)
    const s = await signedIn(t.app, staff.technician)
    await s.del('/api/session').expect(204)
    expect((await s.get('/api/session')).body.user).toBeNull()
    const rows = await t.db.select().from(sessions)
    expect(rows.every((r) => r.userId !== staff.technician.id)).toBe(true)
  })

  it('sessions are kept in the database, not in memory', async () => {
    const staff = await makeStaff(t.db)
    await signedIn(t.app, staff.manager)
    const rows = await t.db.select().from(sessions)
    expect(rows.some((r) => r.userId === staff.manager.id)).toBe(true)
  })
})

describe('behind a TLS-terminating proxy (HOLDFAST_HTTPS=1 with HOLDFAST_TRUST_PROXY)', () => {
  it('a sign-in through the proxy gets a Secure session cookie that keeps it signed in', async () => {
    const https = await makeTestApp({ https: true, trustProxy: 'loopback' })
    try {
      const staff = await makeStaff(https.db)
      // Secure cookies, sent back by hand: supertest speaks plain HTTP to the app, as the proxy does.
      const first = await request(https.app).get('/api/session').set('x-forwarded-proto', 'https').expect(200)
      const csrf = (first.headers['set-cookie'] as unknown as string[]).find((c) => c.startsWith('holdfast.csrf='))!
      expect(csrf).toMatch(/; Secure/)
      const res = await request(https.app)
        .post('/api/session')
        .set('x-forwarded-proto', 'https')
        .set('cookie', csrf.split(';')[0]!)
        .set('x-csrf-token', first.body.csrfToken)
        .send({ email: staff.office.email, password: staff.office.password })
      expect(res.status).toBe(200)
      const sid = (res.headers['set-cookie'] as unknown as string[]).find((c) => c.startsWith('holdfast.sid='))!
      expect(sid).toMatch(/; Secure/)
      const cookie = sid.split(';')[0]!
      const me = await request(https.app).get('/api/session').set('x-forwarded-proto', 'https').set('cookie', cookie)
      expect(me.body.user.id).toBe(staff.office.id)
    } finally {
      await https.close()
    }
  })
})

describe('anonymous visits', () => {
  it('GET /api/session when signed out writes no session row, however often it is asked', async () => {
    const before = await t.db.$count(sessions)
    for (let i = 0; i < 30; i++) await request(t.app).get('/api/session').expect(200)
    expect(await t.db.$count(sessions)).toBe(before)
  })

  it('one browser keeps one anonymous token across page loads, so two tabs agree', async () => {
    const agent = request.agent(t.app)
    const first = (await agent.get('/api/session')).body.csrfToken
    expect((await agent.get('/api/session')).body.csrfToken).toBe(first)
  })

  it('the anonymous token must come back in the header and in its own cookie: the header alone is refused', async () => {
    const staff = await makeStaff(t.db)
    const { csrfToken } = (await request(t.app).get('/api/session')).body
    const res = await request(t.app).post('/api/session').set('x-csrf-token', csrfToken).send({ email: staff.manager.email, password: staff.manager.password })
    expect(res.status).toBe(403)
  })

  it('a made-up token sent as both header and cookie is refused: the server signs the ones it hands out', async () => {
    const staff = await makeStaff(t.db)
    const made = `${Date.now().toString(36)}.bWFkZS11cC1ub25jZS1mb3ItdGVzdA.c2lnbmF0dXJlLXRoYXQtaXMtbm90LXJlYWw`
    const res = await request(t.app)
      .post('/api/session')
      .set('cookie', `holdfast.csrf=${made}`)
      .set('x-csrf-token', made)
      .send({ email: staff.manager.email, password: staff.manager.password })
    expect(res.status).toBe(403)
  })
})

describe('pruning', () => {
  it('pruneExpiredSessions deletes expired session rows and keeps live ones', async () => {
    const staff = await makeStaff(t.db)
    const sid = (s: string) => `prune-test-${s}-${staff.company.id}`
    await t.db.insert(sessions).values([
      { sid: sid('old'), userId: staff.office.id, data: {}, expiresAt: new Date(Date.now() - 1_000) },
      { sid: sid('live'), userId: staff.office.id, data: {}, expiresAt: new Date(Date.now() + 60_000) },
    ])
    await pruneExpiredSessions(t.db)
    const left = (await t.db.select().from(sessions)).map((r) => r.sid)
    expect(left).toContain(sid('live'))
    expect(left).not.toContain(sid('old'))
  })
})

describe('sign-in rate limits', () => {
  it('after five failures for one account from one browser and address, the next attempt waits (429), even with the right password', async () => {
    const limited = await makeTestApp({ signInLimits: { perAccount: 5, perIp: 100, windowMs: 60_000 } })
    try {
      const staff = await makeStaff(limited.db)
      const s = await browserSession(limited.app)
      for (let i = 0; i < 5; i++) expect((await s.signIn(staff.manager.email, 'wrong password')).status).toBe(401)
      const res = await s.signIn(staff.manager.email, staff.manager.password)
      expect(res.status).toBe(429)
      expect(res.body.error).toMatch(/Too many failed sign-ins/)
      const wait = Number(/Wait (\d+)/.exec(res.body.error)![1])
      expect(res.body).toMatchObject(/minutes/.test(res.body.error) ? { code: 'signInWaitMinutes', params: { n: wait } } : wait === 1 ? { code: 'signInWaitSecond' } : { code: 'signInWaitSeconds', params: { n: wait } })
    } finally {
      await limited.close()
    }
  })

  it('failures past the per-IP limit make that address wait, whatever the account', async () => {
    const limited = await makeTestApp({ signInLimits: { perAccount: 100, perIp: 3, windowMs: 60_000 } })
    try {
      const s = await browserSession(limited.app)
      for (let i = 0; i < 3; i++) await s.signIn(`user${i}@test.example`, 'wrong password')
      expect((await s.signIn('another@test.example', 'wrong password')).status).toBe(429)
    } finally {
      await limited.close()
    }
  })
})

describe('a person’s own language', () => {
  it('PUT /api/session/locale saves it with the account: the session answers with it, and the next sign-in too', async () => {
    const staff = await makeStaff(t.db)
    const s = await signedIn(t.app, staff.technician)
    expect((await s.get('/api/session')).body.user.locale).toBeUndefined()

    const res = await s.put('/api/session/locale', { locale: 'es' })
    expect(res.status).toBe(200)
    expect(res.body.user).toMatchObject({ id: staff.technician.id, locale: 'es' })
    expect((await s.get('/api/session')).body.user.locale).toBe('es')

    const elsewhere = await browserSession(t.app)
    const again = await elsewhere.signIn(staff.technician.email, staff.technician.password)
    expect(again.body.user.locale).toBe('es')
  })

  it('PUT /api/session/locale reaches every session the person holds, not only the one that asked', async () => {
    const staff = await makeStaff(t.db)
    const phone = await signedIn(t.app, staff.dispatcher)
    const desk = await signedIn(t.app, staff.dispatcher)
    await phone.put('/api/session/locale', { locale: 'es' }).expect(200)
    expect((await desk.get('/api/session')).body.user.locale).toBe('es')
  })

  it('PUT /api/session/locale refuses a language Holdfast does not speak, and a visitor not signed in', async () => {
    const staff = await makeStaff(t.db)
    const s = await signedIn(t.app, staff.office)
    const wrong = await s.put('/api/session/locale', { locale: 'fr' })
    expect(wrong.status).toBe(400)
    expect(wrong.body.issues[0]).toMatchObject({ path: 'locale', message: 'Choose English or Spanish.' })

    const visitor = await browserSession(t.app)
    expect((await visitor.put('/api/session/locale', { locale: 'es' })).status).toBe(401)
  })

  // Issue 16 item 13: an ended session was answered "The page is out of date… Reload" (the CSRF check
  // ran first), so the page could not tell the person to sign in again.
  it('a write after the session ended answers 401 "signed out", not a stale page, and writes nothing', async () => {
    const staff = await makeStaff(t.db)
    const s = await signedIn(t.app, staff.dispatcher)
    const sid = await t.db.select({ sid: sessions.sid }).from(sessions).then((rows) => rows.map((r) => r.sid))
    await t.db.delete(sessions)
    const res = await s.agent.post('/api/vehicles').set('x-csrf-token', s.csrf).send({})
    expect(res.status).toBe(401)
    expect(res.body.error).toMatch(/session has ended/)
    expect(sid.length).toBeGreaterThan(0)
    expect(await t.db.select().from(sessions)).toEqual([])
  })
})
