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

  it('firstRun_choices_offerEveryShippedSample_withItsJurisdictionAndCaution_andAMapBeforeSignIn', async () => {
    const s = await browserSession(app.app)
    const { ruleSets, map } = (await s.get('/api/first-run/choices').expect(200)).body
    // The samples as shipped in server/rule-sets/samples, in file order (the first is the fallback default).
    expect(ruleSets.map((r: { id: string }) => r.id)).toEqual(['california-sample', 'florida-sample', 'ordinance-24h-template'])
    expect(ruleSets[1]).toMatchObject({ name: 'Florida (sample)', jurisdiction: 'State of Florida, USA', timeZone: 'America/New_York' })
    for (const r of ruleSets) {
      expect(r.caution).toMatch(/^Sample — verify with your local code\./)
      expect(r.cautionEs).toMatch(/verifique/i)
    }
    // Each sample's Spanish name, as the sample files give it.
    expect(ruleSets.map((r: { nameEs: string | null }) => r.nameEs)).toEqual(['California (ejemplo)', 'Florida (ejemplo)', 'Plantilla de ordenanza municipal (cada período de 24 horas)'])
    // The built-in geocoder is staff-only; the first run reaches it through its own public door.
    expect(map).toMatchObject({ tileUrl: '/api/fakes/tiles/{z}/{x}/{y}.png', geocoderUrl: '/api/first-run/geocoder' })
    const found = (await s.get('/api/first-run/geocoder/search?q=45%20Cinder&format=json').expect(200)).body
    expect(found[0]).toMatchObject({ display_name: '45 Cinder Ln, Orrin Flats', lat: '36.410900', lon: '-119.345500' })
    await s.get('/api/fakes/geocoder/search?q=45%20Cinder').expect(401)
  })

  it('firstRun_unknownRuleSet_isRefusedNamingRuleSet_andWritesNothing', async () => {
    const s = await browserSession(app.app)
    for (const ruleSet of ['nevada-sample', '']) {
      const res = await s.post('/api/first-run', firstRun({ ruleSet })).expect(400)
      expect(res.body.issues).toEqual([expect.objectContaining({ path: 'ruleSet', code: 'yardSettings.unknownRuleSet', message: 'Choose one of the rule sets listed.' })])
    }
    expect(await companiesNow()).toBe(0)
    expect(await app.db.$count(t.users)).toBe(0)
    expect(await app.db.$count(t.yards)).toBe(0)
    expect(await app.db.$count(t.ruleSets)).toBe(0)
  })

  it('firstRun_twoAtOnce_makeExactlyOneCompany_theOtherIs409', async () => {
    const [a, b] = await Promise.all([browserSession(app.app), browserSession(app.app)])
    const answers = await Promise.all([
      a.post('/api/first-run', firstRun({ ruleSet: 'florida-sample' })),
      b.post('/api/first-run', firstRun({ companyName: 'Other Towing', code: 'OT', email: 'other@other.example', ruleSet: 'florida-sample' })),
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

    // The yard starts from the sample chosen.
    const [set] = await app.db.select().from(t.ruleSets).where(eq(t.ruleSets.id, yard!.ruleSetId!))
    expect(set!.slug).toBe('florida-sample')

    const s = await browserSession(app.app)
    expect((await s.get('/api/first-run').expect(200)).body).toEqual({ needed: false })
    await s.post('/api/first-run', firstRun({ companyName: 'Late Towing', code: 'LT', email: 'late@late.example' })).expect(409)
    // What only the first run offers closes with it.
    await s.get('/api/first-run/choices').expect(409)
    await s.get('/api/first-run/geocoder/search?q=Cinder').expect(409)
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
