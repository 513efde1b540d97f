import { describe, expect, it } from 'vitest'
import californiaJson from '../../../server/rule-sets/samples/california.json' with { type: 'json' }
import { usFederalCalendar } from '../../helpers/us-federal-holidays'
import { type ClockEvent, earliestSaleDay, legalClocks, saleDateBlocked, saleDayTooEarly } from '@shared/domain/clocks'
import { ruleSetSchema } from '@shared/schemas/rule-sets'

const california = ruleSetSchema.parse(californiaJson)
const TODAY = '2026-06-01'
const AS_OF = '2026-06-01T12:00:00-07:00'
const recorded: ClockEvent[] = [
  { kind: 'stored', at: '2026-04-20T10:00:00-07:00' },
  { kind: 'lien-arose', at: '2026-04-20T10:00:00-07:00' },
  { kind: 'lien-notice-mailed', at: '2026-05-27T10:00:00-07:00' },
]
const clocksFor = (valueCents: number | null, events = recorded) => (saleDay: string) =>
  legalClocks({ modelYear: 2015, valueCents }, [...events, { kind: 'sale-scheduled', at: `${saleDay}T00:00:00-07:00` }], california, usFederalCalendar(), AS_OF)

describe('the earliest lien sale day (California sample)', () => {
  it('saleDay_valued4000OrLess_notBeforeThe31stDayAfterTheNotice (Cal. Civ. Code § 3072)', () => {
    // § 3072 as the sample cites it: notice mailed at least 31 days before the sale. Mailed 27 May 2026 →
    // 27 May + 31 calendar days = 27 June 2026 (hand-counted: 4 days to 31 May, 27 into June).
    const work = clocksFor(300_000)
    // For the 26th the notice (mailed the 27th) would be one day short of its 31: due by 26 May.
    expect(saleDayTooEarly(work('2026-06-26'), '2026-06-26', TODAY)).toMatchObject({ date: '2026-05-26', citation: expect.stringContaining('§ 3072') })
    expect(saleDayTooEarly(work('2026-06-27'), '2026-06-27', TODAY)).toBeNull()
    expect(earliestSaleDay(work, TODAY)).toBe('2026-06-27')
  })

  it('saleDay_valuedOver4000_notBeforeThe20thDayAfterTheNotice (Cal. Civ. Code § 3071)', () => {
    // § 3071: notice at least 20 days before the sale → 27 May + 20 = 16 June 2026.
    expect(earliestSaleDay(clocksFor(650_000), TODAY)).toBe('2026-06-16')
  })

  it('saleDay_beforeToday_isTooEarly; no value_isBlockedUntilEntered', () => {
    expect(saleDayTooEarly(clocksFor(650_000)('2026-05-31'), '2026-05-31', TODAY)).toMatchObject({ date: TODAY })
    expect(saleDateBlocked(clocksFor(null)('2026-07-01'))).toMatchObject({ code: 'needs-value' })
    expect(saleDateBlocked(clocksFor(650_000)('2026-07-01'))).toBeNull()
  })
})
