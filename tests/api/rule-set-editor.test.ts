import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { historyOf } from '@db/history'
import * as t from '@db/schema'
import type { RuleSetInput } from '@shared/schemas/rule-sets'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { makeStaff } from '../helpers/factories'
import { anotherVehicle, DEMO_RATES, sampleRuleSet, towInBody } from '../helpers/tow-in'

let app: TestApp
let staff: Awaited<ReturnType<typeof makeStaff>>
beforeAll(async () => {
  app = await makeTestApp()
})
afterAll(() => app.close())
beforeEach(async () => {
  staff = await makeStaff(app.db)
  await app.db.update(t.yards).set({ towRates: DEMO_RATES, ruleSetId: await sampleRuleSet(app.db) }).where(eq(t.yards.id, staff.yard.id))
})

type Line = { code: string; unitCents: number }
const storageRate = async (s: Awaited<ReturnType<typeof signedIn>>, vehicleId: string) =>
  ((await s.get(`/api/vehicles/${vehicleId}/invoice`).expect(200)).body.invoice.lines as Line[]).find((l) => l.code === 'storage')!.unitCents

async function copyOfCalifornia(s: Awaited<ReturnType<typeof signedIn>>) {
  const res = await s.post('/api/settings/rule-sets/california-sample/copy', { name: 'Our Fresno rates' })
  expect(res.status).toBe(201)
  return res.body as { id: string; version: number; ruleSet: { vehicleClasses: { code: string; dailyRateCents: number; placeholder: boolean }[] } & Record<string, unknown> }
}

function withRate<T extends { ruleSet: { vehicleClasses: { code: string; dailyRateCents: number; placeholder: boolean }[] } }>(copy: T, cents: number) {
  const ruleSet = structuredClone(copy.ruleSet)
  const standard = ruleSet.vehicleClasses.find((c) => c.code === 'standard')!
  standard.dailyRateCents = cents
  standard.placeholder = false
  return ruleSet
}

describe('rule-set versions', () => {
  it('save_ofTheYardsRuleSet_billsNewTowInsAtTheNewRateAndKeepsOldVehiclesOnTheirVersion', async () => {
    const m = await signedIn(app.app, staff.manager)
    const d = await signedIn(app.app, staff.dispatcher)
    const copy = await copyOfCalifornia(m)
    await m.put('/api/settings/yard-rule-set', { ruleSetId: copy.id }).expect(200)
    const old = (await d.post('/api/vehicles', towInBody(staff.dispatcher.id)).expect(201)).body.id as string
    const v1Rate = copy.ruleSet.vehicleClasses.find((c) => c.code === 'standard')!.dailyRateCents

    const saved = await m.put(`/api/settings/rule-sets/${copy.id}`, { version: 1, ruleSet: withRate(copy, 7_700), reason: 'New city rate' })
    expect(saved.status).toBe(200)
    expect(saved.body.version).toBe(2)
    const fresh = (await d.post('/api/vehicles', towInBody(staff.dispatcher.id, anotherVehicle)).expect(201)).body.id as string

    expect(await storageRate(m, old)).toBe(v1Rate)
    expect(await storageRate(m, fresh)).toBe(7_700)
    // The "sample — set your rate" note goes once the yard's own rule set sets the rate, and stays on the old bill.
    const warnings = async (id: string) => (await m.get(`/api/vehicles/${id}/invoice`).expect(200)).body.invoice.warnings as string[]
    const note = 'Passenger car or light truck storage: the amount is a sample — set your rate.'
    expect(await warnings(old)).toContain(note)
    expect(await warnings(fresh)).not.toContain(note)
    const [towedIn] = await historyOf(app.db, fresh)
    expect(towedIn).toMatchObject({ kind: 'towed_in', after: expect.objectContaining({ ruleSet: 'Our Fresno rates', ruleSetVersion: 2 }) })
  })

  it('moveToLatestVersion_byAManagerWithAReason_billsAtTheNewRateAndTheHistorySaysWhich', async () => {
    const m = await signedIn(app.app, staff.manager)
    const d = await signedIn(app.app, staff.dispatcher)
    const copy = await copyOfCalifornia(m)
    await m.put('/api/settings/yard-rule-set', { ruleSetId: copy.id }).expect(200)
    const old = (await d.post('/api/vehicles', towInBody(staff.dispatcher.id)).expect(201)).body.id as string
    await m.put(`/api/settings/rule-sets/${copy.id}`, { version: 1, ruleSet: withRate(copy, 7_700) }).expect(200)

    const listed = (await m.get(`/api/settings/rule-sets/${copy.id}/older-vehicles`).expect(200)).body
    expect(listed).toMatchObject({ latest: 2, vehicles: [{ id: old, version: 1 }] })
    await m.post(`/api/vehicles/${old}/rule-set-version`, { version: 1 }).expect(400)
    const moved = await m.post(`/api/vehicles/${old}/rule-set-version`, { version: listed.vehicles[0].vehicleVersion, reason: 'Owner agreed to the new rate' })
    expect(moved.status).toBe(200)
    expect(await storageRate(m, old)).toBe(7_700)
    const events = await historyOf(app.db, old)
    expect(events.at(-1)).toMatchObject({
      kind: 'rule_set_changed',
      reason: 'Owner agreed to the new rate',
      before: { ruleSet: 'Our Fresno rates', version: 1 },
      after: { ruleSet: 'Our Fresno rates', version: 2 },
    })
    await m.post(`/api/vehicles/${old}/rule-set-version`, { version: moved.body.version, reason: 'again' }).expect(422)
  })

  it('save_fromAnOlderVersion_isAConflictAndWritesNothing', async () => {
    const m = await signedIn(app.app, staff.manager)
    const copy = await copyOfCalifornia(m)
    await m.put(`/api/settings/rule-sets/${copy.id}`, { version: 1, ruleSet: withRate(copy, 7_000) }).expect(200)
    const before = await app.db.select().from(t.ruleSetVersions)
    await m.put(`/api/settings/rule-sets/${copy.id}`, { version: 1, ruleSet: withRate(copy, 7_100) }).expect(409)
    expect(await app.db.select().from(t.ruleSetVersions)).toHaveLength(before.length)
  })

  it('save_ofASample_isRefused', async () => {
    const m = await signedIn(app.app, staff.manager)
    const sample = (await m.get('/api/settings/rule-sets/california-sample').expect(200)).body
    expect(sample).toMatchObject({ own: false, inUse: true })
    await m.put('/api/settings/rule-sets/california-sample', { version: sample.version, ruleSet: withRate(sample, 1) }).expect(403)
  })
})

describe('refusals name the field and write nothing', () => {
  it.each([
    ['a negative rate', (r: RuleSetInput) => (r.vehicleClasses[0]!.dailyRateCents = -100), 'ruleSet.vehicleClasses.0.dailyRateCents'],
    ['a negative fee', (r: RuleSetInput) => (r.fees[0]!.amountCents = -1), 'ruleSet.fees.0.amountCents'],
    ['a cap below a day\'s rate', (r: RuleSetInput) => (r.storage.cap = { maxStorageCents: 100, source: { citation: 'test', confidence: 'none' as const } }), 'ruleSet.storage.cap.maxStorageCents'],
    ['a deadline counted back from the arrival', (r: RuleSetInput) => Object.assign(r.timeline[0]!, { from: 'stored', direction: 'before', days: 5 }), 'ruleSet.timeline.0.direction'],
    ['a tax rate over 30 percent', (r: RuleSetInput) => (r.tax.ratePercent = 200), 'ruleSet.tax.ratePercent'],
    ['a negative tax rate', (r: RuleSetInput) => (r.tax.ratePercent = -1), 'ruleSet.tax.ratePercent'],
    ['a step met by the arrival before it starts', (r: RuleSetInput) => Object.assign(r.timeline[0]!, { from: 'owner-notice-mailed', direction: 'after', doneBy: 'stored' }), 'ruleSet.timeline.0.doneBy'],
    ['a step due before its start, met by the sale', (r: RuleSetInput) => Object.assign(r.timeline[0]!, { from: 'owner-notice-mailed', direction: 'before', days: 10, doneBy: 'lien-sale-held' }), 'ruleSet.timeline.0.direction'],
    ['a value band no vehicle falls in', (r: RuleSetInput) => (r.timeline[0]!.when = { valueCents: { over: 400_000, atMost: 100_000 } }), 'ruleSet.timeline.0.when.valueCents.atMost'],
    ['an age band no vehicle falls in', (r: RuleSetInput) => (r.timeline[0]!.when = { ageYears: { over: 10, atMost: 10 } }), 'ruleSet.timeline.0.when.ageYears.atMost'],
    ['a negative day count', (r: RuleSetInput) => (r.timeline[0]!.days = -3), 'ruleSet.timeline.0.days'],
    ['a police clock of no hours', (r: RuleSetInput) => (r.policeNotice!.hours = 0), 'ruleSet.policeNotice.hours'],
    ['a police clock for no kind of tow', (r: RuleSetInput) => (r.policeNotice!.towReasons = []), 'ruleSet.policeNotice.towReasons'],
    ['a total-loss share over 100 percent', (r: RuleSetInput) => (r.totalLoss = { rule: 'percent-of-value', percent: 120, source: { citation: 'test', confidence: 'none' as const } }), 'ruleSet.totalLoss.percent'],
    ['business days under no calendar', (r: RuleSetInput) => (r.businessDays = { skip: 'closed-by-every-calendar', calendars: [], source: { citation: 'test', confidence: 'none' as const } }), 'ruleSet.businessDays.calendars'],
    ['post offices closed every weekday', (r: RuleSetInput) => (r.mailDeadlines!.closedWeekdays = [0, 1, 2, 3, 4, 5, 6]), 'ruleSet.mailDeadlines.closedWeekdays'],
    ['an arrival that records a sale', (r: RuleSetInput) => (r.arrivalEvents = { kinds: ['stored', 'lien-sale-held'], source: { citation: 'test', confidence: 'none' as const } }), 'ruleSet.arrivalEvents.kinds'],
    ['a holiday calendar nobody knows', (r: RuleSetInput) => (r.holidayCalendar = { country: 'US', state: 'ZZ' }), 'ruleSet.holidayCalendar'],
    ['a Spanish name over 120 characters', (r: RuleSetInput) => (r.es = { ...r.es, name: 'Tarifas de Fresno '.repeat(7) }), 'ruleSet.es.name'],
    ['a business-day calendar nobody knows', (r: RuleSetInput) => (r.businessDays = { skip: 'closed-by-every-calendar', calendars: [{ country: 'US' }, { country: 'QQ' }], source: { citation: 'test', confidence: 'none' as const } }), 'ruleSet.businessDays.calendars'],
  ])('save_with%s_is400NamingTheField', async (_what, spoil, path) => {
    const m = await signedIn(app.app, staff.manager)
    const copy = await copyOfCalifornia(m)
    const ruleSet = structuredClone(copy.ruleSet) as unknown as RuleSetInput
    spoil(ruleSet)
    const versions = (await app.db.select().from(t.ruleSetVersions)).length
    const audit = (await app.db.select().from(t.settingsChanges)).length
    const res = await m.put(`/api/settings/rule-sets/${copy.id}`, { version: 1, ruleSet })
    expect(res.status).toBe(400)
    expect(res.body.issues.map((i: { path: string }) => i.path)).toContain(path)
    // Each refusal has its words in both catalogs, by code.
    const issue = res.body.issues.find((i: { path: string }) => i.path === path)
    expect(issue.code, JSON.stringify(issue)).toMatch(/^(ruleSets|ruleSetEditor)\./)
    expect(await app.db.select().from(t.ruleSetVersions)).toHaveLength(versions)
    expect(await app.db.select().from(t.settingsChanges)).toHaveLength(audit)
  })

  it('save_withNothingChanged_is422', async () => {
    const m = await signedIn(app.app, staff.manager)
    const copy = await copyOfCalifornia(m)
    await m.put(`/api/settings/rule-sets/${copy.id}`, { version: 1, ruleSet: copy.ruleSet }).expect(422)
  })
})

describe('the settings audit', () => {
  it('save_recordsWhoWhenAndOnlyTheValuesThatChangedBeforeAndAfter', async () => {
    const m = await signedIn(app.app, staff.manager)
    const copy = await copyOfCalifornia(m)
    const standard = copy.ruleSet.vehicleClasses.findIndex((c) => c.code === 'standard')
    const was = copy.ruleSet.vehicleClasses[standard]!.dailyRateCents
    await m.put(`/api/settings/rule-sets/${copy.id}`, { version: 1, ruleSet: withRate(copy, was + 500), reason: 'Council raised the cap' }).expect(200)
    const { changes, total } = (await m.get('/api/settings/audit').expect(200)).body
    expect(total).toBe(2)
    expect(changes[0]).toMatchObject({
      actor: staff.manager.name,
      area: 'rule-set',
      action: 'saved',
      subjectId: copy.id,
      reason: 'Council raised the cap',
      before: { [`vehicleClasses.${standard}.dailyRateCents`]: was, [`vehicleClasses.${standard}.placeholder`]: true },
      after: { [`vehicleClasses.${standard}.dailyRateCents`]: was + 500, [`vehicleClasses.${standard}.placeholder`]: false },
    })
    // The class is named as a person reads it, so the record can say "Car — daily rate".
    expect(changes[0].names).toEqual({ [`vehicleClasses.${standard}`]: (copy.ruleSet.vehicleClasses[standard] as { label?: string }).label })
    expect(Date.now() - Date.parse(changes[0].at)).toBeLessThan(60_000)
    expect(changes[1]).toMatchObject({ action: 'copied', subjectLabel: 'Our Fresno rates' })
  })

  it('chooseYardRuleSet_recordsTheYardsRuleSetBeforeAndAfter', async () => {
    const m = await signedIn(app.app, staff.manager)
    const copy = await copyOfCalifornia(m)
    await m.put('/api/settings/yard-rule-set', { ruleSetId: copy.id, reason: 'Our own rates' }).expect(200)
    const { changes } = (await m.get('/api/settings/audit').expect(200)).body
    expect(changes[0]).toMatchObject({ area: 'yard', action: 'rule-set-chosen', subjectId: staff.yard.id, before: { ruleSet: 'California (sample)' }, after: { ruleSet: 'Our Fresno rates', version: 1 }, reason: 'Our own rates' })
  })

  it('audit_ofAnotherCompany_isNeverShown', async () => {
    const m = await signedIn(app.app, staff.manager)
    await copyOfCalifornia(m)
    const other = await makeStaff(app.db)
    const o = await signedIn(app.app, other.manager)
    expect((await o.get('/api/settings/audit').expect(200)).body.total).toBe(0)
  })
})

describe('who may change settings', () => {
  it.each(['dispatcher', 'technician', 'office'] as const)('settings_for%s_are403AndWriteNothing', async (role) => {
    const m = await signedIn(app.app, staff.manager)
    const copy = await copyOfCalifornia(m)
    const s = await signedIn(app.app, staff[role])
    await s.get('/api/settings/rule-sets').expect(403)
    await s.get('/api/settings/audit').expect(403)
    await s.post('/api/settings/rule-sets/california-sample/copy', { name: 'Mine' }).expect(403)
    await s.put(`/api/settings/rule-sets/${copy.id}`, { version: 1, ruleSet: withRate(copy, 1) }).expect(403)
    await s.put('/api/settings/yard-rule-set', { ruleSetId: copy.id }).expect(403)
    expect((await app.db.select().from(t.ruleSetVersions).innerJoin(t.ruleSets, eq(t.ruleSets.id, t.ruleSetVersions.ruleSetId)).where(eq(t.ruleSets.slug, copy.id)))).toHaveLength(1)
  })

  it('ruleSet_ofAnotherCompany_isNotFound', async () => {
    const m = await signedIn(app.app, staff.manager)
    const copy = await copyOfCalifornia(m)
    const other = await makeStaff(app.db)
    const o = await signedIn(app.app, other.manager)
    await o.get(`/api/settings/rule-sets/${copy.id}`).expect(404)
    await o.put(`/api/settings/rule-sets/${copy.id}`, { version: 1, ruleSet: withRate(copy, 1) }).expect(404)
    await o.put('/api/settings/yard-rule-set', { ruleSetId: copy.id }).expect(422)
  })
})

describe('the calendars the editor offers', () => {
  it('holidayCalendars_forAManager_listsCountriesAndStatesTheHolidaySourceKnows', async () => {
    const m = await signedIn(app.app, staff.manager)
    const { calendars } = (await m.get('/api/settings/holiday-calendars').expect(200)).body
    // The English as date-holidays names them; the country's Spanish is CLDR's (Intl.DisplayNames), and
    // date-holidays has no Spanish for a US state's name, so California's stays as it is.
    expect(calendars).toContainEqual({ country: 'US', countryName: 'United States of America', es: { countryName: 'Estados Unidos' } })
    expect(calendars).toContainEqual({ country: 'US', state: 'CA', countryName: 'United States of America', stateName: 'California', es: { countryName: 'Estados Unidos' } })
  })

  // date-holidays' data names the federal holidays in Spanish: Columbus Day is "Descubrimiento de América".
  it('draftHolidays_carryEachHolidaysSpanishNameBesideItsEnglish', async () => {
    const m = await signedIn(app.app, staff.manager)
    const federal = (await m.get('/api/settings/holidays?calendars=US&from=2025&to=2025').expect(200)).body.holidays as { date: string }[]
    expect(federal).toContainEqual({ date: '2025-10-13', name: 'Columbus Day', es: { name: 'Descubrimiento de América' } })
    expect(federal).toContainEqual({ date: '2025-07-04', name: 'Independence Day', es: { name: 'Día de la Independencia' } })
  })

  // 5 U.S.C. § 6103(a): Columbus Day, the second Monday in October (13 October 2025), is a federal holiday;
  // California's calendar (Cal. Gov. Code § 6700) has no Columbus Day, so a day both close excludes it.
  it('draftHolidays_ofSeveralCalendars_areOnlyTheDaysEveryOneCloses', async () => {
    const m = await signedIn(app.app, staff.manager)
    const federal = (await m.get('/api/settings/holidays?calendars=US&from=2025&to=2025').expect(200)).body.holidays as { date: string }[]
    const both = (await m.get(`/api/settings/holidays?calendars=${encodeURIComponent('US/CA,US')}&from=2025&to=2025`).expect(200)).body.holidays as { date: string }[]
    expect(federal.map((h) => h.date)).toContain('2025-10-13')
    expect(both.map((h) => h.date)).not.toContain('2025-10-13')
    // Independence Day (5 U.S.C. § 6103(a)) is closed under both.
    expect(both.map((h) => h.date)).toContain('2025-07-04')
  })

  it('draftHolidays_withBadCalendarsOrYears_is400NamingTheField', async () => {
    const m = await signedIn(app.app, staff.manager)
    const bad = await m.get('/api/settings/holidays?calendars=united&from=2025&to=2025')
    expect(bad.status).toBe(400)
    expect(bad.body.issues.map((i: { path: string }) => i.path)).toContain('calendars.0')
    const years = await m.get('/api/settings/holidays?calendars=US&from=2025&to=2040')
    expect(years.status).toBe(400)
    expect(years.body.issues.map((i: { path: string }) => i.path)).toContain('to')
  })

  it.each(['dispatcher', 'office'] as const)('calendars_for%s_are403', async (role) => {
    const s = await signedIn(app.app, staff[role])
    await s.get('/api/settings/holiday-calendars').expect(403)
    await s.get('/api/settings/holidays?calendars=US&from=2025&to=2025').expect(403)
  })
})

describe('the new values are saved', () => {
  it('save_ofABranchTheCalendarsThePoliceClockAndTheTotalLoss_keepsEachValue', async () => {
    const m = await signedIn(app.app, staff.manager)
    const copy = await copyOfCalifornia(m)
    const ruleSet = structuredClone(copy.ruleSet) as unknown as RuleSetInput
    ruleSet.timeline[0]!.when = { valueCents: { over: 250_000 } }
    ruleSet.businessDays = { skip: 'closed-by-every-calendar', calendars: [{ country: 'US', state: 'CA' }, { country: 'US' }], source: { citation: 'Yard counsel memo (invented demo)', confidence: 'none' } }
    ruleSet.policeNotice = { ...ruleSet.policeNotice!, hours: 2, from: 'tow-completed' }
    ruleSet.totalLoss = { rule: 'percent-of-value', percent: 70, source: { citation: 'Yard policy (common trade practice)', confidence: 'none' } }
    ruleSet.es = { caution: 'Ejemplo — verifique con su código local.' }
    const res = await m.put(`/api/settings/rule-sets/${copy.id}`, { version: 1, ruleSet })
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    const saved = (await m.get(`/api/settings/rule-sets/${copy.id}`).expect(200)).body.ruleSet
    expect(saved.timeline[0].when).toEqual({ valueCents: { over: 250_000 } })
    expect(saved.businessDays.calendars).toEqual([{ country: 'US', state: 'CA' }, { country: 'US' }])
    expect(saved.policeNotice).toMatchObject({ hours: 2, from: 'tow-completed' })
    expect(saved.totalLoss).toMatchObject({ rule: 'percent-of-value', percent: 70 })
    expect(saved.es).toEqual({ caution: 'Ejemplo — verifique con su código local.' })
  })
})
