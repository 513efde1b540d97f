import { describe, expect, it } from 'vitest'
import californiaJson from '../../server/rule-sets/samples/california.json' with { type: 'json' }
import floridaJson from '../../server/rule-sets/samples/florida.json' with { type: 'json' }
import templateJson from '../../server/rule-sets/samples/ordinance-24h.json' with { type: 'json' }
import { usFederalCalendar } from '../helpers/us-federal-holidays'
import { type ClockEvent, legalClocks } from '@shared/domain/clocks'
import { nextStepDate, plannedNotices } from '@shared/domain/notices'
import { ruleSetSchema } from '@shared/schemas/rule-sets'

// Which letters a vehicle needs and when, from each sample rule set, on hand-worked cases. Counted on
// the independent US federal holiday generator (5 U.S.C. 6103), so each date is checked by hand here.
const california = ruleSetSchema.parse(californiaJson)
const florida = ruleSetSchema.parse(floridaJson)
const template = ruleSetSchema.parse(templateJson)
const federal = usFederalCalendar()

const plan = (vehicle: object, events: ClockEvent[], ruleSet: typeof florida, asOf: string, today: string) =>
  plannedNotices(legalClocks(vehicle, events, ruleSet, federal, asOf), today)

describe('Florida Stat. § 713.78(4): notice of lien within 7 business days of storage [S]', () => {
  // Stored Tuesday 30 June 2026, 15:00 in Miami.
  const stored: ClockEvent[] = [{ kind: 'stored', at: '2026-06-30T15:00:00-04:00' }]

  it('plannedNotices_floridaFirstNotice_isDueTenthOfJulySkippingIndependenceDayObserved', () => {
    // Wed 1, Thu 2, (Fri 3 observed holiday, Sat 4, Sun 5), Mon 6, Tue 7, Wed 8, Thu 9, Fri 10 July.
    expect(plan({ modelYear: 2018 }, stored, florida, '2026-07-01T12:00:00Z', '2026-07-01')).toEqual([
      expect.objectContaining({ kind: 'owner_notice', status: 'due', dueDate: '2026-07-10', opensOn: null, mailedAt: null }),
    ])
  })

  it('plannedNotices_floridaFirstNotice_isOverdueOnTheMondayAfter', () => {
    expect(plan({ modelYear: 2018 }, stored, florida, '2026-07-13T12:00:00Z', '2026-07-13')[0]).toMatchObject({ status: 'overdue', dueDate: '2026-07-10' })
  })

  it.each([
    { mailed: '2026-07-08T10:00:00-04:00', status: 'sent', why: 'mailed Wed 8 July, before the due date' },
    { mailed: '2026-07-13T10:00:00-04:00', status: 'late', why: 'mailed Mon 13 July, after Fri 10 July' },
  ])('plannedNotices_floridaFirstNotice_$why', ({ mailed, status }) => {
    const events: ClockEvent[] = [...stored, { kind: 'owner-notice-mailed', at: mailed }]
    expect(plan({ modelYear: 2018 }, events, florida, '2026-07-20T12:00:00Z', '2026-07-20')[0]).toMatchObject({ status, mailedAt: new Date(mailed).toISOString() })
  })

  it('nextStepDate_floridaVehicleOverThreeYears_isThirtyFiveDaysAfterStorage ([S/M] § 713.78: sale after 35 days)', () => {
    // 30 June + 35 calendar days = 4 August 2026, whatever day the notice is mailed.
    const events: ClockEvent[] = [...stored, { kind: 'owner-notice-mailed', at: '2026-07-02T10:00:00-04:00' }]
    expect(nextStepDate(legalClocks({ modelYear: 2018 }, events, florida, federal, '2026-07-02T15:00:00Z'))).toBe('2026-08-04')
  })
})

describe('California Civ. Code § 3072 (valued over $500 and up to $4,000): notice of pending lien sale 31 to 41 days before the sale [V]', () => {
  const events: ClockEvent[] = [
    { kind: 'stored', at: '2026-04-01T10:00:00-07:00' },
    { kind: 'lien-arose', at: '2026-04-01T10:00:00-07:00' },
    { kind: 'sale-scheduled', at: '2026-06-15T10:00:00-07:00' },
  ]
  const vehicle = { valueCents: 250_000 }

  it('plannedNotices_californiaSaleNotice_windowOpensFifthOfMayAndClosesFifteenthOfMay', () => {
    // Sale Mon 15 June 2026: 41 days before = Tue 5 May; 31 days before = Fri 15 May.
    expect(plan(vehicle, events, california, '2026-05-01T19:00:00Z', '2026-05-01')).toEqual([
      expect.objectContaining({ kind: 'sale_notice', status: 'not-yet', opensOn: '2026-05-05', dueDate: '2026-05-15' }),
    ])
    expect(plan(vehicle, events, california, '2026-05-10T19:00:00Z', '2026-05-10')[0]).toMatchObject({ status: 'due' })
  })

  it('plannedNotices_californiaSaleNotice_waitsForTheSaleDate', () => {
    // Without a sale date the window cannot be worked out: the letter's clock has not started.
    expect(plan(vehicle, events.slice(0, 2), california, '2026-05-01T19:00:00Z', '2026-05-01')[0]).toMatchObject({ kind: 'sale_notice', status: 'not-started', dueDate: null })
  })

  it('nextStepDate_californiaSaleNoticeMailedTenthOfMay_isTheScheduledSale', () => {
    // Mailed 10 May: the 10-day opposition ends 20 May, 31 days after the mailing is 10 June, the sale is set for 15 June.
    const mailed: ClockEvent[] = [...events, { kind: 'lien-notice-mailed', at: '2026-05-10T09:00:00-07:00' }]
    expect(nextStepDate(legalClocks(vehicle, mailed, california, federal, '2026-05-10T19:00:00Z'))).toBe('2026-06-15')
  })
})

describe('California Veh. Code § 22851.10(a) (valued $500 or less): notice of intent to dispose, disposal not before 15 days after [S, per the sample]', () => {
  it('plannedNotices_californiaLowValue_asksForTheDisposalNoticeAndCountsFifteenDaysFromIt', () => {
    const events: ClockEvent[] = [
      { kind: 'stored', at: '2026-04-01T10:00:00-07:00' },
      { kind: 'lien-arose', at: '2026-04-01T10:00:00-07:00' },
    ]
    expect(plan({ valueCents: 40_000 }, events, california, '2026-04-02T19:00:00Z', '2026-04-02')).toEqual([
      expect.objectContaining({ kind: 'disposal_notice', status: 'due', dueDate: null, opensOn: null }),
    ])
    // Mailed Fri 10 April 2026: 10 April + 15 days = Sat 25 April 2026.
    const mailed: ClockEvent[] = [...events, { kind: 'disposal-notice-mailed', at: '2026-04-10T09:00:00-07:00' }]
    expect(nextStepDate(legalClocks({ valueCents: 40_000 }, mailed, california, federal, '2026-04-10T19:00:00Z'))).toBe('2026-04-25')
  })
})

describe('Ordinance template (placeholder periods, not a statute: set yours from your ordinance)', () => {
  // Stored Monday 30 November 2026, 09:00 in Chicago.
  const stored: ClockEvent[] = [{ kind: 'stored', at: '2026-11-30T09:00:00-06:00' }]

  it('plannedNotices_template_ownerNoticeTenBusinessDaysAfterStorage', () => {
    // Tue 1 … Fri 4, Mon 7 … Fri 11, Mon 14 December: the 10th business day (no federal holiday between).
    expect(plan({}, stored, template, '2026-12-01T15:00:00Z', '2026-12-01')).toEqual([expect.objectContaining({ kind: 'owner_notice', status: 'due', dueDate: '2026-12-14' })])
  })

  it('nextStepDate_template_disposalThirtyDaysAfterTheMailing', () => {
    // Mailed Tue 1 December 2026 + 30 calendar days = Thu 31 December 2026.
    const mailed: ClockEvent[] = [...stored, { kind: 'owner-notice-mailed', at: '2026-12-01T10:00:00-06:00' }]
    expect(nextStepDate(legalClocks({}, mailed, template, federal, '2026-12-01T18:00:00Z'))).toBe('2026-12-31')
  })
})
