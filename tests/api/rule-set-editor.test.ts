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
