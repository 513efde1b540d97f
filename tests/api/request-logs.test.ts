import { Writable } from 'node:stream'
import { eq, sql } from 'drizzle-orm'
import { pino } from 'pino'
import request from 'supertest'
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { makeStaff } from '../helpers/factories'
import { DEMO_RATES, GOOD_VIN, sampleRuleSet, towInBody } from '../helpers/tow-in'

// OWASP ASVS 5.0 V16 (security logging): nothing that grants access, and no personal data from the
// database, reaches the log. The app gets a logger writing into `lines`, as a log collector would read it.
let lines: string[] = []
const captured = new Writable({
  write(chunk, _encoding, done) {
    lines.push(...String(chunk).split('\n').filter(Boolean))
    done()
  },
})
interface LogEntry {
  msg?: string
  req: { method?: string; url?: string; headers: Record<string, unknown> }
  res: { statusCode?: number; headers?: Record<string, unknown> }
  err?: { message: string }
  [field: string]: unknown
}
const entries = () => lines.map((l) => JSON.parse(l) as LogEntry)
const logText = () => lines.join('\n')

let app: TestApp
let staff: Awaited<ReturnType<typeof makeStaff>>
beforeAll(async () => {
  app = await makeTestApp({ log: pino({ level: 'info' }, captured) })
})
afterAll(() => app.close())
beforeEach(async () => {
  staff = await makeStaff(app.db)
  await app.db.update(t.yards).set({ towRates: DEMO_RATES, ruleSetId: await sampleRuleSet(app.db) }).where(eq(t.yards.id, staff.yard.id))
  lines = []
})

describe('request logs', () => {
  it('log each request line without the session cookie, the CSRF token or the password', async () => {
    const d = await signedIn(app.app, staff.dispatcher)
    const created = await d.post('/api/vehicles', towInBody(staff.dispatcher.id))
    expect(created.status).toBe(201)

    const cookie = (await d.get('/api/session')).headers['set-cookie']![0]!.split(';')[0]!
    const value = cookie.slice(cookie.indexOf('=') + 1)
    const sessionId = decodeURIComponent(value).replace(/^s:/, '').split('.')[0]!
    expect(sessionId.length).toBeGreaterThan(20)
    for (const secret of [value, decodeURIComponent(value), sessionId, d.csrf, staff.dispatcher.password]) {
      expect(logText()).not.toContain(secret)
    }

    const line = entries().find((e) => e.req?.method === 'POST' && e.req?.url === '/api/vehicles')
    expect(line).toMatchObject({ msg: 'request completed', res: { statusCode: 201 } })
    // Their presence is still visible, which is what a person reading the log needs.
    expect(line!.req.headers).toMatchObject({ cookie: '[Redacted]', 'x-csrf-token': '[Redacted]' })
    const signIn = entries().find((e) => e.req?.method === 'POST' && e.req?.url === '/api/session')
    expect(signIn!.res).toMatchObject({ statusCode: 200, headers: { 'set-cookie': '[Redacted]' } })
  })

  it('log owner-link and gate-pass paths, token query parameters, referers and authorization without the token', async () => {
    const token = 'oWnErLiNkToKeN-9f8e7d6c5b4a39281706f5e4d3c2b1a0'
    // A 43-character base64url token (32 random bytes) on a path the list does not name yet.
    const unlisted = 'Qm9hdFRyYWlsZXJfR2F0ZVBhc3NfMDEyMzQ1Njc4OWFi'
    await request(app.app).get(`/api/owner/${token}/decision?code=482913&lang=es`).set('referer', `http://yard.example/o/${token}`).set('authorization', `Bearer ${token}`)
    await request(app.app).get(`/o/${token}`)
    await request(app.app).get(`/API/Owner/${token}`)
    await request(app.app).get(`/api/gate-passes/${unlisted}/scan?access_token=${unlisted}`)

    for (const secret of [token, unlisted, '482913']) expect(logText()).not.toContain(secret)
    const requestLines = entries().filter((e) => e.msg === 'request completed')
    expect(requestLines.map((e) => [e.req.method, e.req.url, e.res.statusCode])).toEqual([
      ['GET', '/api/owner/[Redacted]/decision?code=[Redacted]&lang=es', 401],
      ['GET', '/o/[Redacted]', 404],
      // The owner's page is public (paths match in any case): a key that opens nothing is "not found".
      ['GET', '/API/Owner/[Redacted]', 404],
      ['GET', '/api/gate-passes/[Redacted]/scan?access_token=[Redacted]', 401],
    ])
    expect(requestLines[0]!.req.headers).toMatchObject({ referer: 'http://yard.example/o/[Redacted]', authorization: '[Redacted]' })
  })

  it('log a failed query on a 500 with its statement but without the values it carried', async () => {
    // A constraint this file's own database gets, so that one insert fails inside the database.
    await app.db.execute(sql.raw(`alter table vehicles add constraint refuse_for_log_test check (vin is distinct from '${GOOD_VIN}') not valid`))
    try {
      const d = await signedIn(app.app, staff.dispatcher)
      lines = []
      const res = await d.post('/api/vehicles', towInBody(staff.dispatcher.id))
      expect(res.status).toBe(500)
      expect(res.body.error).toMatch(/went wrong on the server/)

      const failed = entries().find((e) => e.msg === 'request failed')
      expect(failed).toMatchObject({ level: 50, url: '/api/vehicles', method: 'POST' })
      expect(failed!.err!.message).toMatch(/insert into "vehicles"/)
      expect(failed!.err!.message).toMatch(/refuse_for_log_test/)
      const body = towInBody(staff.dispatcher.id)
      for (const value of [GOOD_VIN, body.vehicle.ownerName!, body.vehicle.plate!, body.tow.driver!, 'Sparrow']) {
        expect(logText()).not.toContain(value)
      }
      expect(entries().find((e) => e.msg === 'request errored')).toMatchObject({ req: { url: '/api/vehicles' }, res: { statusCode: 500 } })
    } finally {
      await app.db.execute(sql.raw('alter table vehicles drop constraint refuse_for_log_test'))
    }
  })
})
