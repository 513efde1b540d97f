import { pino } from 'pino'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { signInFailures } from '@db/schema'
import { createApp } from '../../server/app'
import { localFileStore } from '../../server/files/index'
import { makeTestApp, type TestApp, TEST_HISTORY_KEY } from '../helpers/app'
import { makeStaff } from '../helpers/factories'

// OWASP ASVS 5.0 V6.3.1 and V6.1.1: brute force is slowed without handing attackers a lockout; the
// known-device idea is OWASP's "Slow Down Online Guessing Attacks with Device Cookies".
const WRONG = 'not the password at all'
let clock = Date.now()
const logLines: string[] = []
let t: TestApp
beforeAll(async () => {
  t = await makeTestApp({
    trustProxy: 'loopback',
    signInLimits: { perAccount: 5, perIp: 20, windowMs: 15 * 60_000, now: () => clock },
    log: pino({ level: 'info' }, { write: (line: string) => void logLines.push(line) }),
  })
})
afterAll(() => t.close())

/** A browser (its own cookies) at an address. */
async function browserAt(ip: string, app = t.app) {
  const agent = request.agent(app)
  let csrf: string = (await agent.get('/api/session').set('x-forwarded-for', ip).expect(200)).body.csrfToken
  return {
    agent,
    async signIn(email: string, password: string) {
      const res = await agent.post('/api/session').set('x-forwarded-for', ip).set('x-csrf-token', csrf).send({ email, password })
      if (res.body.csrfToken) csrf = res.body.csrfToken
      return res
    },
    async signOut() {
      await agent.delete('/api/session').set('x-forwarded-for', ip).set('x-csrf-token', csrf).expect(204)
      csrf = (await agent.get('/api/session').set('x-forwarded-for', ip)).body.csrfToken
    },
  }
}

let address = 10
const nextAddress = () => `198.51.100.${address++}`

async function fail(browser: Awaited<ReturnType<typeof browserAt>>, email: string, times: number) {
  for (let i = 0; i < times; i++) expect((await browser.signIn(email, WRONG)).status).toBe(401)
}

describe('sign-in throttling without a lockout', () => {
  it('five wrong passwords from one address do not lock the account: the right password from another address signs in', async () => {
    const staff = await makeStaff(t.db)
    await fail(await browserAt(nextAddress()), staff.office.email, 5)
    expect((await (await browserAt(nextAddress())).signIn(staff.office.email, staff.office.password)).status).toBe(200)
  })

  it('the address that failed waits a short while, then the right password goes through', async () => {
    const staff = await makeStaff(t.db)
    const here = await browserAt(nextAddress())
    await fail(here, staff.office.email, 5)
    const held = await here.signIn(staff.office.email, staff.office.password)
    expect(held.status).toBe(429)
    expect(held.body.error).toMatch(/Too many failed sign-ins.*Wait \d+ seconds?/)
    const wait = Number(held.headers['retry-after'])
    expect(wait).toBeGreaterThan(0)
    expect(wait).toBeLessThanOrEqual(60)
    clock += wait * 1000
    expect((await here.signIn(staff.office.email, staff.office.password)).status).toBe(200)
  })

  it('each further failure from the same address doubles the wait; attempts made while waiting are not counted', async () => {
    const staff = await makeStaff(t.db)
    const here = await browserAt(nextAddress())
    await fail(here, staff.office.email, 5)
    const first = Number((await here.signIn(staff.office.email, WRONG)).headers['retry-after'])
    clock += first * 1000
    await fail(here, staff.office.email, 1)
    const second = Number((await here.signIn(staff.office.email, WRONG)).headers['retry-after'])
    expect(second).toBe(first * 2)
  })

  it('a browser that signed in to the account before (a known device) gets through while the address is held', async () => {
    const staff = await makeStaff(t.db)
    const ip = nextAddress()
    const desk = await browserAt(ip)
    expect((await desk.signIn(staff.office.email, staff.office.password)).status).toBe(200)
    await desk.signOut()
    const attacker = await browserAt(ip)
    await fail(attacker, staff.office.email, 5)
    expect((await attacker.signIn(staff.office.email, staff.office.password)).status).toBe(429)
    expect((await desk.signIn(staff.office.email, staff.office.password)).status).toBe(200)
  })

  it("a known device's own wrong passwords slow it down too, so its cookie is no licence to guess", async () => {
    const staff = await makeStaff(t.db)
    const desk = await browserAt(nextAddress())
    expect((await desk.signIn(staff.office.email, staff.office.password)).status).toBe(200)
    await desk.signOut()
    await fail(desk, staff.office.email, 5)
    expect((await desk.signIn(staff.office.email, staff.office.password)).status).toBe(429)
  })

  it('a device cookie earned by one account does not help another, and a forged one is ignored', async () => {
    const staff = await makeStaff(t.db)
    const ip = nextAddress()
    const desk = await browserAt(ip)
    expect((await desk.signIn(staff.dispatcher.email, staff.dispatcher.password)).status).toBe(200)
    await desk.signOut()
    await fail(await browserAt(ip), staff.office.email, 5)
    expect((await desk.signIn(staff.office.email, staff.office.password)).status).toBe(429)

    const forged = await browserAt(ip)
    forged.agent.jar.setCookie(`holdfast.device=${Math.floor(clock / 1000).toString(36)}.bm90LWEtcmVhbC1ub25jZQ.c2lnbmVkLWJ5LW5vLW9uZQ; Path=/api/session`, '127.0.0.1', '/api/session')
    expect((await forged.signIn(staff.office.email, staff.office.password)).status).toBe(429)
  })

  it('successful sign-ins are not counted: a yard behind one address signs in as often as it needs', async () => {
    const staff = await makeStaff(t.db)
    const ip = nextAddress()
    for (let i = 0; i < 25; i++) expect((await (await browserAt(ip)).signIn(staff.office.email, staff.office.password)).status).toBe(200)
  })

  it('wrong passwords from one address across many accounts hold that address for new devices, not others', async () => {
    const staff = await makeStaff(t.db)
    const ip = nextAddress()
    const sprayer = await browserAt(ip)
    for (let i = 0; i < 20; i++) expect((await sprayer.signIn(`nobody-${i}@test.example`, WRONG)).status).toBe(401)
    expect((await sprayer.signIn(staff.manager.email, staff.manager.password)).status).toBe(429)
    expect((await (await browserAt(nextAddress())).signIn(staff.manager.email, staff.manager.password)).status).toBe(200)
  })

  it('the counters live in the database: a second app server on it holds the same address', async () => {
    const staff = await makeStaff(t.db)
    const ip = nextAddress()
    await fail(await browserAt(ip), staff.office.email, 5)
    expect(await t.db.$count(signInFailures)).toBeGreaterThan(0)
    const other = createApp({
      historyKey: TEST_HISTORY_KEY,
      db: t.db,
      log: pino({ level: 'silent' }),
      sessionSecret: 'test-secret-that-is-long-enough-for-signing',
      version: 'test',
      trustProxy: 'loopback',
      signInLimits: { perAccount: 5, perIp: 20, windowMs: 15 * 60_000, now: () => clock },
      files: localFileStore(t.filesDir),
    })
    expect((await (await browserAt(ip, other)).signIn(staff.office.email, staff.office.password)).status).toBe(429)
  })

  it('repeated failures are logged with the account and address, never the password', async () => {
    const staff = await makeStaff(t.db)
    const ip = nextAddress()
    const secretGuess = 'hunter2-guess-that-must-not-be-logged'
    const b = await browserAt(ip)
    for (let i = 0; i < 5; i++) await b.signIn(staff.technician.email, secretGuess)
    const warned = logLines.map((l) => JSON.parse(l) as Record<string, unknown>).filter((l) => l.msg === 'repeated failed sign-ins' && l.email === staff.technician.email)
    expect(warned.length).toBeGreaterThan(0)
    expect(warned[0]).toMatchObject({ level: 40, ip, email: staff.technician.email })
    expect(logLines.join('\n')).not.toContain(secretGuess)
  })
})

describe('pruning', () => {
  it('pruneSignInFailures deletes counters whose window and wait are both over', async () => {
    const staff = await makeStaff(t.db)
    await fail(await browserAt(nextAddress()), staff.office.email, 2)
    const { pruneSignInFailures } = await import('../../server/session/index')
    const count = () => t.db.$count(signInFailures)
    expect(await count()).toBeGreaterThan(0)
    await pruneSignInFailures(t.db, 15 * 60_000, new Date(clock + 16 * 60_000 + 60 * 60_000))
    expect(await count()).toBe(0)
  })
})
