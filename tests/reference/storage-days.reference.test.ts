import { describe, expect, it } from 'vitest'
import californiaJson from '../../server/rule-sets/samples/california.json' with { type: 'json' }
import floridaJson from '../../server/rule-sets/samples/florida.json' with { type: 'json' }
import ordinanceJson from '../../server/rule-sets/samples/ordinance-24h.json' with { type: 'json' }
import { storageBill } from '@shared/domain/billing'
import { ruleSetSchema } from '@shared/schemas/rule-sets'

const california = ruleSetSchema.parse(californiaJson)
const florida = ruleSetSchema.parse(floridaJson)
const ordinance = ruleSetSchema.parse(ordinanceJson)

const MINUTE = 60_000
const HOUR = 60 * MINUTE

function daysBilled(ruleSet: typeof california, arrivedAt: string, stayMs: number): number {
  const release = new Date(Date.parse(arrivedAt) + stayMs).toISOString()
  return storageBill({ arrivedAt, releasedAt: release, vehicleClass: 'standard' }, ruleSet, release).days
}

describe('California Civil Code 3068.1(a)(1) [V]', () => {
  // Arrival 10:00 on 14 Jan 2026 in Los Angeles: no DST change nearby.
  const arrivedAt = '2026-01-14T10:00:00-08:00'

  it.each([
    { stay: 23 * HOUR + 59 * MINUTE, days: 1, why: '23 h 59 min: released within 24 hours → no more than one day' },
    { stay: 24 * HOUR, days: 1, why: '24 h 00 min: "24 hours or less" → one day' },
    { stay: 24 * HOUR + 1 * MINUTE, days: 2, why: '24 h 01 min: two calendar days, each a day or part thereof' },
    { stay: 14 * HOUR + 30 * MINUTE, days: 1, why: '14 h 30 min crossing midnight: still one day (released within 24 hours)' },
  ])('storageBill_california_$why', ({ stay, days }) => {
    expect(daysBilled(california, arrivedAt, stay)).toBe(days)
  })

  it('storageBill_california25HoursOverTwoMidnights_isThreeCalendarDays (full-calendar-day basis, part thereof)', () => {
    // 23:30 on the 14th to 00:30 on the 16th touches the 14th, 15th and 16th.
    expect(daysBilled(california, '2026-01-14T23:30:00-08:00', 25 * HOUR)).toBe(3)
  })
})

describe('Florida Stat. 713.78: no storage under 6 hours [V, 1997 text]', () => {
  const arrivedAt = '2026-01-14T10:00:00-05:00'

  it.each([
    { stay: 5 * HOUR + 59 * MINUTE, days: 0, why: '5 h 59 min → no storage' },
    { stay: 6 * HOUR, days: 1, why: '6 h 00 min is not "less than 6 hours" → storage charged' },
  ])('storageBill_florida_$why', ({ stay, days }) => {
    expect(daysBilled(florida, arrivedAt, stay)).toBe(days)
  })
})

describe('City ordinances: "each 24-hour period or fraction thereof" [S]', () => {
  const arrivedAt = '2026-01-14T10:00:00-06:00'

  it.each([
    { stay: 1 * MINUTE, days: 1, why: 'one minute is a fraction of a period' },
    { stay: 24 * HOUR, days: 1, why: 'exactly 24 hours is one period' },
    { stay: 24 * HOUR + 1 * MINUTE, days: 2, why: '24 h 01 min starts a second period' },
    { stay: 72 * HOUR, days: 3, why: '72 hours is three periods' },
  ])('storageBill_ordinance_$why', ({ stay, days }) => {
    expect(daysBilled(ordinance, arrivedAt, stay)).toBe(days)
  })
})
