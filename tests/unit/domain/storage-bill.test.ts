import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import californiaJson from '../../../server/rule-sets/samples/california.json' with { type: 'json' }
import floridaJson from '../../../server/rule-sets/samples/florida.json' with { type: 'json' }
import ordinanceJson from '../../../server/rule-sets/samples/ordinance-24h.json' with { type: 'json' }
import { storageBill } from '@shared/domain/billing'
import { type RuleSet, ruleSetSchema } from '@shared/schemas/rule-sets'

const california = ruleSetSchema.parse(californiaJson)
const florida = ruleSetSchema.parse(floridaJson)
const ordinance = ruleSetSchema.parse(ordinanceJson)
const source = { citation: 'test rule', confidence: 'C' as const }
const HOUR = 3_600_000
const DAY = 24 * HOUR

const stay = { arrivedAt: '2026-05-04T09:00:00-07:00', vehicleClass: 'standard' }

describe('storageBill refuses impossible stays', () => {
  it.each([
    { why: 'release before arrival', input: { ...stay, releasedAt: '2026-05-04T08:59:00-07:00' }, asOf: '2026-05-05T00:00:00Z', code: 'release-before-arrival', field: 'releasedAt' },
    { why: 'as-of before arrival', input: stay, asOf: '2026-05-04T08:00:00-07:00', code: 'as-of-before-arrival', field: 'asOf' },
    { why: 'unknown vehicle class', input: { ...stay, vehicleClass: 'boat' }, asOf: '2026-05-05T00:00:00Z', code: 'unknown-vehicle-class', field: 'vehicleClass' },
    { why: 'a stay over 20 years', input: { ...stay, arrivedAt: '1999-01-01T00:00:00Z' }, asOf: '2026-05-05T00:00:00Z', code: 'stay-too-long', field: 'arrivedAt' },
    { why: 'an arrival without offset', input: { ...stay, arrivedAt: '2026-05-04T09:00:00' }, asOf: '2026-05-05T00:00:00Z', code: 'invalid-instant', field: 'arrivedAt' },
    { why: 'a fee the rule set lacks', input: { ...stay, feeEvents: [{ fee: 'car-wash', at: '2026-05-04T10:00:00-07:00' }] }, asOf: '2026-05-05T00:00:00Z', code: 'unknown-fee', field: 'feeEvents' },
    { why: 'a once-per-stay fee recorded as an event', input: { ...stay, feeEvents: [{ fee: 'impound', at: '2026-05-04T10:00:00-07:00' }] }, asOf: '2026-05-05T00:00:00Z', code: 'unknown-fee', field: 'feeEvents' },
    { why: 'a fee dated before arrival', input: { ...stay, feeEvents: [{ fee: 'owner-notice', at: '2026-05-03T10:00:00-07:00' }] }, asOf: '2026-05-05T00:00:00Z', code: 'fee-before-arrival', field: 'feeEvents' },
  ])('storageBill_$why_throwsItsCode', ({ input, asOf, code, field }) => {
    expect(() => storageBill(input, california, asOf)).toThrow(expect.objectContaining({ code, field }))
  })

  it('storageBill_unknownClass_namesTheClassesThereAre', () => {
    expect(() => storageBill({ ...stay, vehicleClass: 'boat' }, california, '2026-05-05T00:00:00Z')).toThrow(/Motorcycle/)
  })
})

describe('storageBill lines', () => {
  it('storageBill_floridaThreeDaysWithAGateRelease_taxesStoragePerLine', () => {
    const bill = storageBill(
      {
        arrivedAt: '2026-05-04T09:00:00-04:00',
        releasedAt: '2026-05-06T18:00:00-04:00',
        vehicleClass: 'standard',
        feeEvents: [{ fee: 'after-hours-gate', at: '2026-05-06T18:00:00-04:00' }],
      },
      florida,
      '2026-06-01T00:00:00Z',
    )
    // 57 hours → 3 periods of 24 h; 3 × $50.00 = $150.00, 6 % tax $9.00; intake $75; gate $50.
    expect(bill.lines.map((l) => [l.code, l.quantity, l.amountCents, l.taxCents])).toEqual([
      ['storage', 3, 15_000, 900],
      ['impound', 1, 7_500, 0],
      ['after-hours-gate', 1, 5_000, 0],
    ])
    expect(bill).toMatchObject({ subtotalCents: 27_500, taxCents: 900, totalCents: 28_400, endedBy: 'release' })
  })

  it('storageBill_feeRecordedAfterAsOf_isNotYetCharged', () => {
    const bill = storageBill({ ...stay, feeEvents: [{ fee: 'owner-notice', at: '2026-05-20T10:00:00-07:00' }] }, california, '2026-05-10T00:00:00Z')
    expect(bill.lines.map((l) => l.code)).toEqual(['storage', 'impound'])
    expect(bill.endedBy).toBe('as-of')
  })

  it('storageBill_sampleRates_warnThatEachIsAPlaceholder', () => {
    const bill = storageBill(stay, california, '2026-05-10T00:00:00Z')
    expect(bill.warnings).toEqual([
      'Passenger car or light truck storage: the amount is a sample — set your rate.',
      'Impound and storage intake: the amount is a sample — set your rate.',
    ])
    expect(bill.caution).toContain('Sample — verify with your local code')
  })

  it('storageBill_yardZoneOverride_countsDaysOnTheYardsCalendar', () => {
    // 20:00 to 23:30 in Los Angeles is 23:00 to 02:30 in New York: one calendar day there, two here.
    const night = { arrivedAt: '2026-05-04T20:00:00-07:00', releasedAt: '2026-05-04T23:30:00-07:00', vehicleClass: 'standard' }
    const calendarOnly: RuleSet = { ...california, storage: { counting: california.storage.counting, taxable: false } }
    expect(storageBill(night, calendarOnly, night.releasedAt).days).toBe(1)
    expect(storageBill(night, calendarOnly, night.releasedAt, { timeZone: 'America/New_York' }).days).toBe(2)
  })
})

describe('storageBill day rules', () => {
  const base: RuleSet = { ...ordinance, storage: { counting: { method: 'rolling-24h', source }, taxable: false } }

  it.each([
    { rules: { grace: { hours: 2, source } }, stayHours: 25.5, days: 1, why: 'a second period begun 1.5 h before release is within 2 h of grace' },
    { rules: { grace: { hours: 2, source } }, stayHours: 26.5, days: 2, why: 'a second period begun 2.5 h before release is past the grace' },
    { rules: { cap: { maxDays: 30, source } }, stayHours: 24 * 45, days: 30, why: 'a 45-day stay stops at a 30-day cap' },
    { rules: { noChargeUnder: { hours: 6, source } }, stayHours: 5.99, days: 0, why: 'no charge under 6 hours' },
  ])('storageBill_$why', ({ rules, stayHours, days }) => {
    const ruleSet = { ...base, storage: { ...base.storage, ...rules } }
    const release = new Date(Date.parse(stay.arrivedAt) + stayHours * HOUR).toISOString()
    const bill = storageBill({ ...stay, releasedAt: release }, ruleSet, release)
    expect(bill.days).toBe(days)
  })

  it('storageBill_chargeCap_limitsTheStorageLineAndSaysSo', () => {
    const ruleSet = { ...base, storage: { ...base.storage, cap: { maxStorageCents: 50_000, source } } }
    const line = storageBill(stay, ruleSet, '2026-07-01T00:00:00Z').lines[0]
    expect(line).toMatchObject({ code: 'storage', amountCents: 50_000 })
    expect(line?.reason).toContain('capped')
  })

  it('storageBill_zeroTimeInStorage_chargesNoStorage', () => {
    expect(storageBill(stay, base, stay.arrivedAt).days).toBe(0)
  })
})

// Property tests over the shipped samples and variants of them.
const rolling = { ...florida, storage: { counting: { method: 'rolling-24h' as const, source }, taxable: true } }
const calendar = { ...california, storage: { counting: { method: 'calendar-day' as const, source }, taxable: true }, tax: { ...california.tax, ratePercent: 8.875 } }
const withGraceAndCap = { ...ordinance, storage: { ...ordinance.storage, grace: { hours: 3, source }, cap: { maxDays: 20, maxStorageCents: 60_000, source } } }
const everyRuleSet = [california, florida, ordinance, rolling, calendar, withGraceAndCap]
// Grace and minimum-stay rules give a short stay away by law (two 5-hour Florida stays are both
// free), so splitting is held to the counting rules themselves.
const countingOnly = [ordinance, rolling, calendar]

const arrival = fc.integer({ min: Date.UTC(2024, 0, 1), max: Date.UTC(2027, 0, 1) })
const span = fc.integer({ min: 0, max: 400 * DAY })
const stayOf = (ruleSet: RuleSet, arrivedAt: number, releasedAt?: number) => ({
  arrivedAt,
  ...(releasedAt === undefined ? {} : { releasedAt }),
  vehicleClass: 'heavy',
  feeEvents: ruleSet.fees.some((f) => f.code === 'after-hours-gate') ? [{ fee: 'after-hours-gate', at: arrivedAt + HOUR }] : [],
})

describe('storageBill properties (fast-check)', () => {
  it('storageBill_asOfMovesLater_neverDecreases', () => {
    fc.assert(
      fc.property(fc.constantFrom(...everyRuleSet), arrival, span, span, (ruleSet, a, first, more) => {
        const s = stayOf(ruleSet, a)
        expect(storageBill(s, ruleSet, a + first + more).totalCents).toBeGreaterThanOrEqual(storageBill(s, ruleSet, a + first).totalCents)
      }),
      { numRuns: 400 },
    )
  })

  it('storageBill_anyStay_isNeverNegative', () => {
    fc.assert(
      fc.property(fc.constantFrom(...everyRuleSet), arrival, span, (ruleSet, a, length) => {
        const bill = storageBill(stayOf(ruleSet, a, a + length), ruleSet, a + length)
        expect(bill.totalCents).toBeGreaterThanOrEqual(0)
        for (const line of bill.lines) expect(Math.min(line.amountCents, line.taxCents)).toBeGreaterThanOrEqual(0)
      }),
      { numRuns: 400 },
    )
  })

  it('storageBill_splitIntoTwoStays_neverChargesLessThanTheWhole', () => {
    fc.assert(
      fc.property(fc.constantFrom(...countingOnly), arrival, span, span, (ruleSet, a, first, second) => {
        const b = a + first
        const c = b + second
        const whole = storageBill(stayOf(ruleSet, a, c), ruleSet, c).totalCents
        const parts = storageBill(stayOf(ruleSet, a, b), ruleSet, b).totalCents + storageBill(stayOf(ruleSet, b, c), ruleSet, c).totalCents
        expect(parts).toBeGreaterThanOrEqual(whole)
      }),
      { numRuns: 400 },
    )
  })

  it('storageBill_anyStay_totalIsTheSumOfItsLinesToTheCent', () => {
    fc.assert(
      fc.property(fc.constantFrom(...everyRuleSet), arrival, span, (ruleSet, a, length) => {
        const bill = storageBill(stayOf(ruleSet, a, a + length), ruleSet, a + length)
        const amounts = bill.lines.reduce((sum, l) => sum + l.amountCents, 0)
        const taxes = bill.lines.reduce((sum, l) => sum + l.taxCents, 0)
        expect([bill.subtotalCents, bill.taxCents, bill.totalCents]).toEqual([amounts, taxes, amounts + taxes])
        for (const line of bill.lines) expect(Number.isInteger(line.amountCents) && Number.isInteger(line.taxCents)).toBe(true)
      }),
      { numRuns: 400 },
    )
  })
})

describe('storageBill where the law is not additive', () => {
  it('storageBill_twoFloridaStaysUnderSixHours_areBothFreeThoughOneElevenHourStayIsNot (713.78)', () => {
    const a = Date.parse('2026-05-04T08:00:00-04:00')
    const days = (from: number, to: number) => storageBill({ arrivedAt: from, releasedAt: to, vehicleClass: 'standard' }, florida, to).days
    expect(days(a, a + 5.5 * HOUR) + days(a + 5.5 * HOUR, a + 11 * HOUR)).toBe(0)
    expect(days(a, a + 11 * HOUR)).toBe(1)
  })
})
