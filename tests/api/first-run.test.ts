import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { browserSession, makeTestApp, type TestApp } from '../helpers/app'

// Issue 12, "Settings": a fresh install without the demo is set up from the browser. The first manager
// makes the company, its first yard with its spaces, and their own account; once any company exists
// the route refuses (409), and two first runs at once make exactly one company.

let app: TestApp
beforeAll(async () => {
  app = await makeTestApp()
}, 120_000)
afterAll(() => app.close())

const firstRun = (over: Record<string, unknown> = {}) => ({
  companyName: 'Quarry Road Towing',
  yardName: 'Quarry Road lot',
  code: 'QR',
  address: '1 Quarry Road, Sample Town',
  lat: 36.41,
  lng: -119.35,
  timeZone: 'America/Los_Angeles',
  rows: 3,
  perRow: 10,
  name: 'Rosa Quarry',
  email: 'rosa@quarry-road.example',
  password: 'gravel-pit-owl-93',
  ...over,
})

const companiesNow = () => app.db.$count(t.companies)

describe('first run', () => {
  it('firstRun_badInput_isRefusedNamingEachField_andWritesNothing', async () => {
    const s = await browserSession(app.app)
    expect((await s.get('/api/first-run').expect(200)).body).toEqual({ needed: true })
    const res = await s.post('/api/first-run', firstRun({ companyName: ' ', code: 'Q1', timeZone: 'Mars/Olympus', rows: 0, email: 'not-an-address', password: 'short' })).expect(400)
    const paths = (res.body.issues as { path: string }[]).map((i) => i.path).sort()
    expect(paths).toEqual(['code', 'companyName', 'email', 'password', 'rows', 'timeZone'])
    // The password rules of adding a person: the most common passwords are refused too.
    const common = await s.post('/api/first-run', firstRun({ password: 'password1234' })).expect(400)
    expect(common.body.issues).toEqual([expect.objectContaining({ path: 'password' })])
    expect(await companiesNow()).toBe(0)
    expect(await app.db.$count(t.users)).toBe(0)
  })

  it('firstRun_twoAtOnce_makeExactlyOneCompany_theOtherIs409', async () => {
    const [a, b] = await Promise.all([browserSession(app.app), browserSession(app.app)])
    const answers = await Promise.all([
      a.post('/api/first-run', firstRun()),
      b.post('/api/first-run', firstRun({ companyName: 'Other Towing', code: 'OT', email: 'other@other.example' })),
    ])
    expect(answers.map((r) => r.status).sort()).toEqual([201, 409])
    const refused = answers.find((r) => r.status === 409)!
    expect(refused.body).toMatchObject({ error: 'This Holdfast is already set up. Sign in with your account.', code: 'alreadySetUp' })
    expect(await companiesNow()).toBe(1)
    expect(await app.db.$count(t.users)).toBe(1)
    expect(await app.db.$count(t.yards)).toBe(1)
  })

  it('firstRun_afterwards_theManagerSignsInToTheNewYard_withItsSpaces_andAFurtherRunIs409', async () => {
    const [company] = await app.db.select().from(t.companies)
    const [yard] = await app.db.select().from(t.yards).where(eq(t.yards.companyId, company!.id))
    const [user] = await app.db.select().from(t.users).where(eq(t.users.companyId, company!.id))
    expect(user).toMatchObject({ role: 'manager', active: true, allYards: true })
    // 3 rows × 10 numbers: A-1 … C-10.
    expect(await app.db.$count(t.yardSpaces, eq(t.yardSpaces.yardId, yard!.id))).toBe(30)
    const [audit] = await app.db.select().from(t.settingsChanges).where(eq(t.settingsChanges.subjectId, yard!.id))
    expect(audit).toMatchObject({ area: 'yard', action: 'yard-added', actorId: user!.id })

    const s = await browserSession(app.app)
    expect((await s.get('/api/first-run').expect(200)).body).toEqual({ needed: false })
    await s.post('/api/first-run', firstRun({ companyName: 'Late Towing', code: 'LT', email: 'late@late.example' })).expect(409)
    expect(await companiesNow()).toBe(1)

    const signIn = await s.signIn(user!.email, 'gravel-pit-owl-93')
    expect(signIn.status).toBe(200)
    const board = await s.get('/api/board').expect(200)
    expect(board.body.yard.name).toBe(yard!.name)
    // Either first run may have won the race: the yard is the one that was made.
    expect((await s.get('/api/yards/current').expect(200)).body.yard).toMatchObject({ id: yard!.id, name: 'Quarry Road lot', code: yard!.code, timeZone: 'America/Los_Angeles' })
    expect(['QR', 'OT']).toContain(yard!.code)
  })
})
