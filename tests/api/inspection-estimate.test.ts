import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { repairOrSalvage } from '@shared/domain/inspection'
import { ruleSetSchema } from '@shared/schemas/rule-sets'
import californiaJson from '../../server/rule-sets/samples/california.json' with { type: 'json' }
import floridaJson from '../../server/rule-sets/samples/florida.json' with { type: 'json' }
import { makeTestApp, type TestApp } from '../helpers/app'
import { line, put, sampleVersionId, teardownFixture, type Fixture } from '../helpers/inspection'

let app: TestApp
beforeAll(async () => {
  app = await makeTestApp()
})
afterAll(() => app.close())

async function started(vehicle: Partial<typeof t.vehicles.$inferInsert> = {}) {
  const f = await teardownFixture(app, vehicle)
  await f.tech.post(f.base).expect(201)
  return f
}

const values = (f: Fixture, actualCashValueCents: number, salvageValueCents: number) =>
  put(f.tech, `${f.base}/values`, { actualCashValueCents, actualCashValueSource: 'Price guide', salvageValueCents, salvageValueSource: 'Buyer’s offer' }).expect(200)

describe('estimate totals in integer cents (labour = hours × the yard rate, half-up to the cent on each line)', () => {
  it('threeLines_at$123.45anHour_addUpToTheCent', async () => {
    const f = await started()
    await f.tech.post(`${f.base}/lines`, line({ quantity: 2, unitPriceCents: 8_999, labourHours: 1.5 })).expect(201)
    await f.tech.post(`${f.base}/lines`, line({ part: 'Tie rod end', unitPriceCents: 41_200, labourHours: 0.33 })).expect(201)
    const res = await f.tech.post(`${f.base}/lines`, line({ part: 'Boot clamp', quantity: 3, unitPriceCents: 1_250, labourHours: 0.5 })).expect(201)
    expect(res.body.inspection.lines.map((l: { partsCents: number; labourCents: number; totalCents: number }) => [l.partsCents, l.labourCents, l.totalCents])).toEqual([
      [17_998, 18_518, 36_516], // 1.5 h × $123.45 = $185.175 → $185.18
      [41_200, 4_074, 45_274], // 0.33 h × $123.45 = $40.7385 → $40.74
      [3_750, 6_173, 9_923], // 0.5 h × $123.45 = $61.725 → $61.73 (half-up, not half-even)
    ])
    expect(res.body.inspection.totals).toEqual({ partsCents: 62_948, labourCents: 28_765, totalCents: 91_713 })
  })

  it('aLine_keepsTheLabourRateItWasPricedAt_whenTheYardChangesItsRate', async () => {
    const f = await started()
    const first = await f.tech.post(`${f.base}/lines`, line({ unitPriceCents: 0, labourHours: 1 })).expect(201)
    await app.db.update(t.yards).set({ labourRateCents: 10_000 }).where(eq(t.yards.id, f.staff.yard.id))
    const lineId = first.body.inspection.lines[0].id
    await put(f.tech, `${f.base}/lines/${lineId}`, line({ unitPriceCents: 0, labourHours: 2 })).expect(200)
    const res = await f.tech.post(`${f.base}/lines`, line({ unitPriceCents: 0, labourHours: 1 })).expect(201)
    expect(res.body.inspection.lines.map((l: { labourRateCents: number; labourCents: number }) => [l.labourRateCents, l.labourCents])).toEqual([
      [12_345, 24_690],
      [10_000, 10_000],
    ])
    expect(res.body.labourRateCents).toBe(10_000)
  })

  it('removingALine_takesItOutOfTheTotal_andTheHistoryKeepsWhatItWas', async () => {
    const f = await started()
    const a = await f.tech.post(`${f.base}/lines`, line({ unitPriceCents: 5_000, labourHours: 0 })).expect(201)
    await f.tech.post(`${f.base}/lines`, line({ unitPriceCents: 7_000, labourHours: 0 })).expect(201)
    const res = await f.tech.del(`${f.base}/lines/${a.body.inspection.lines[0].id}`).expect(200)
    expect(res.body.inspection.totals.totalCents).toBe(7_000)
    const history = (await f.tech.get(`/api/vehicles/${f.vehicle.id}/history`)).body.events
    expect(history.at(-1)).toMatchObject({ kind: 'estimate_line_removed', before: { part: 'Ball joint', totalCents: 5_000 } })
  })
})

describe('recommendation: the core’s repairOrSalvage on the estimate, with the vehicle’s rule set', () => {
  const florida = ruleSetSchema.parse(floridaJson)
  const california = ruleSetSchema.parse(californiaJson)

  it.each([
    // Fla. Stat. § 319.30(3)(a): total loss at 80 % of the value [V, older text]; $3,000 car → $2,400 threshold.
    { slug: 'florida-sample', rules: florida, value: 300_000, salvage: 40_000, parts: 239_999, hours: 0, expected: 'repair' },
    { slug: 'florida-sample', rules: florida, value: 300_000, salvage: 40_000, parts: 240_000, hours: 0, expected: 'salvage' },
    // Total Loss Formula, California sample (Cal. Veh. Code § 544, "uneconomical to repair") [S]:
    // $1,276.55 parts + 1 h × $123.45 = $1,400.00; with $400 salvage it reaches the $1,800 value.
    { slug: 'california-sample', rules: california, value: 180_000, salvage: 40_000, parts: 127_655, hours: 1, expected: 'salvage' },
    { slug: 'california-sample', rules: california, value: 180_000, salvage: 40_000, parts: 127_654, hours: 1, expected: 'repair' },
  ])('recommendation_$slug $parts¢ parts + $hours h on a $value¢ value_is $expected', async ({ slug, rules, value, salvage, parts, hours, expected }) => {
    const f = await started({ ruleSetVersionId: await sampleVersionId(app.db, slug) })
    await f.tech.post(`${f.base}/lines`, line({ unitPriceCents: parts, labourHours: hours })).expect(201)
    const res = await values(f, value, salvage)
    const estimate = res.body.inspection.totals.totalCents
    expect(res.body.recommendation.recommendation).toBe(expected)
    expect(res.body.recommendation).toEqual(repairOrSalvage(estimate, value, salvage, rules))
    expect(res.body.recommendationMissing).toBeNull()
  })

  it('noValuesYet_saysWhatIsMissingInPlainWords', async () => {
    const f = await started()
    const res = await f.tech.get(f.base).expect(200)
    expect(res.body.recommendation).toBeNull()
    expect(res.body.recommendationMissing).toBe("Enter the vehicle's value and its salvage value to compare them with the estimate.")
  })

  it('aVehicleWithNoRuleSet_getsNoRecommendation_andIsToldWhy', async () => {
    const f = await started({ ruleSetVersionId: null })
    const res = await values(f, 200_000, 10_000)
    expect(res.body.recommendation).toBeNull()
    expect(res.body.recommendationMissing).toContain('no rule set')
  })
})

describe('roll-ability drives the pickup badge (pickupNeeds, common trade practice)', () => {
  it.each([
    { why: 'rollsSteersBrakesWithKeys', marks: { rolls: true, steers: true, brakes: true, keys: true }, label: 'Wheel-lift', equipment: ['wheel-lift'] },
    { why: 'doesNotRoll', marks: { rolls: false, steers: true, brakes: true, keys: true }, label: 'Flatbed or dollies', equipment: ['flatbed', 'dollies-or-skates'] },
    { why: 'doesNotSteer', marks: { rolls: true, steers: false, brakes: true, keys: true }, label: 'Flatbed', equipment: ['flatbed'] },
    { why: 'noKeys', marks: { rolls: true, steers: true, brakes: true, keys: false }, label: 'Wheel-lift + dollies', equipment: ['wheel-lift', 'dollies-or-skates'] },
  ])('rollAbility $why showsTheBadge $label', async ({ marks, label, equipment }) => {
    const f = await started()
    await f.tech.post(`${f.base}/safety`).expect(200)
    const res = await f.tech.patch(`${f.base}/roll-ability`, marks).expect(200)
    expect(res.body.pickup).toMatchObject({ label, equipment })
  })

  it('theBoardCard_carriesTheSameBadge_fromBeforeTheMarksToAfterThem', async () => {
    const f = await started()
    const cardOf = async () => {
      const board = (await f.tech.get('/api/board').expect(200)).body
      return board.columns.flatMap((c: { cards: { id: string }[] }) => c.cards).find((c: { id: string }) => c.id === f.vehicle.id)
    }
    expect((await cardOf()).pickup).toBeNull()
    await f.tech.post(`${f.base}/safety`).expect(200)
    const res = await f.tech.patch(`${f.base}/roll-ability`, { rolls: false, steers: true, brakes: true }).expect(200)
    // The card carries the badge's words; the reasons behind it are the vehicle page's and the teardown's.
    const { label, code, technicianFirst } = res.body.pickup
    expect((await cardOf()).pickup).toEqual({ label, code, technicianFirst })
    expect((await cardOf()).pickup.label).toBe('Flatbed or dollies')
  })

  it('aWheelRefittedToMakeItRoll_recordsTheMakersTorque_andTheBadgeFollowsTheNewMarks', async () => {
    const f = await started()
    await f.tech.post(`${f.base}/safety`).expect(200)
    await f.tech.patch(`${f.base}/roll-ability`, { rolls: false, steers: true, brakes: true }).expect(200)
    expect((await f.tech.get(f.base)).body.pickup.label).toBe('Flatbed or dollies')
    const res = await f.tech.patch(`${f.base}/roll-ability`, { rolls: true, wheelRefitted: true, lugTorqueFtLbf: 80 }).expect(200)
    expect(res.body.pickup.label).toBe('Wheel-lift')
    expect(res.body.inspection).toMatchObject({ wheelRefitted: true, lugTorqueFtLbf: 80 })
    const history = (await f.tech.get(`/api/vehicles/${f.vehicle.id}/history`)).body.events
    expect(history.at(-1)).toMatchObject({ kind: 'roll_ability_marked', before: { rolls: false, wheelRefitted: null }, after: { rolls: true, wheelRefitted: true, lugTorqueFtLbf: 80 } })
  })
})
