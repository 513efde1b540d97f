import { describe, expect, it } from 'vitest'
import floridaJson from '../../../server/rule-sets/samples/florida.json' with { type: 'json' }
import { holidayCalendarFromList } from '@shared/domain/time'
import { usFederalCalendar } from '../../helpers/us-federal-holidays'
import { type ClockEvent, legalClocks } from '@shared/domain/clocks'
import { type RuleSet, ruleSetSchema } from '@shared/schemas/rule-sets'

const florida = ruleSetSchema.parse(floridaJson)
const federal = usFederalCalendar()
const source = { citation: 'test rule', confidence: 'C' as const }
const stored: ClockEvent = { kind: 'stored', at: '2026-06-30T15:00:00-04:00' }

const notice = (events: ClockEvent[], asOf: string) =>
  legalClocks({ modelYear: 2018 }, events, florida, federal, asOf).deadlines.find((d) => d.code === 'notice-of-lien')

describe('legalClocks deadline statuses', () => {
  it.each([
    { why: 'mailed on the due date', events: [stored, { kind: 'owner-notice-mailed' as const, at: '2026-07-10T16:00:00-04:00' }], asOf: '2026-07-20T00:00:00Z', status: 'met' },
    { why: 'mailed the day after', events: [stored, { kind: 'owner-notice-mailed' as const, at: '2026-07-11T09:00:00-04:00' }], asOf: '2026-07-20T00:00:00Z', status: 'missed' },
    { why: 'not mailed, due date not over', events: [stored], asOf: '2026-07-10T23:59:00-04:00', status: 'upcoming' },
    { why: 'not mailed, due date over', events: [stored], asOf: '2026-07-11T00:00:00-04:00', status: 'missed' },
    { why: 'not stored yet', events: [], asOf: '2026-07-01T00:00:00Z', status: 'not-started' },
  ])('legalClocks_noticeOfLien_$why_is$status', ({ events, asOf, status }) => {
    expect(notice(events, asOf)?.status).toBe(status)
  })

  it('legalClocks_mailingRecordedAfterAsOf_isNotCountedYet', () => {
    const events = [stored, { kind: 'owner-notice-mailed' as const, at: '2026-07-08T10:00:00-04:00' }]
    expect(notice(events, '2026-07-05T00:00:00Z')).toMatchObject({ status: 'upcoming', doneBy: { at: undefined } })
  })

  it('legalClocks_explanation_namesTheCountTheStartAndWhatWasSkipped', () => {
    expect(notice([stored], '2026-07-01T00:00:00Z')?.explanation).toBe(
      '7 business days after the vehicle was placed in storage (2026-06-30): due by 2026-07-10, ' +
        'skipping 2 weekend days and Independence Day (observed) (2026-07-03).',
    )
  })
})

describe('legalClocks earliest dates', () => {
  const sale = (events: ClockEvent[], asOf: string) =>
    legalClocks({ modelYear: 2018 }, events, florida, federal, asOf).deadlines.find((d) => d.code === 'earliest-sale')

  it.each([
    { why: 'before the date', events: [stored], asOf: '2026-08-03T12:00:00-04:00', status: 'upcoming' },
    { why: 'from the date on', events: [stored], asOf: '2026-08-04T00:00:00-04:00', status: 'reached' },
    { why: 'a sale held on the date', events: [stored, { kind: 'lien-sale-held' as const, at: '2026-08-04T10:00:00-04:00' }], asOf: '2026-08-05T00:00:00Z', status: 'met' },
    { why: 'a sale held too early', events: [stored, { kind: 'lien-sale-held' as const, at: '2026-08-03T10:00:00-04:00' }], asOf: '2026-08-05T00:00:00Z', status: 'missed' },
  ])('legalClocks_earliestSale_$why_is$status', ({ events, asOf, status }) => {
    expect(sale(events, asOf)?.status).toBe(status)
  })

  it('legalClocks_unknownModelYear_asksForItOnBothBranches', () => {
    const clocks = legalClocks({}, [stored], florida, federal, '2026-07-01T00:00:00Z')
    const sales = clocks.deadlines.filter((d) => d.code === 'earliest-sale')
    expect(sales.map((d) => [d.status, d.dueDate])).toEqual([
      ['needs-information', '2026-08-04'],
      ['needs-information', '2026-08-19'],
    ])
    expect(sales[0]?.statusReason).toContain('Enter the model year')
  })
})

describe('legalClocks with the yard’s own holidays and steps', () => {
  const ruleSet: RuleSet = {
    ...florida,
    timeline: [
      { code: 'reply', label: 'Reply window', kind: 'deadline', from: 'sale-scheduled', direction: 'before', days: 3, dayKind: 'business', doneBy: 'sale-notice-posted', placeholder: false, source },
    ],
  }

  it('legalClocks_businessDaysBeforeAPlannedSale_skipTheStateHolidayFromTheList', () => {
    const state = holidayCalendarFromList([{ date: '2026-10-09', name: 'Yard closed for inventory' }])
    const sale: ClockEvent = { kind: 'sale-scheduled', at: '2026-10-14T10:00:00-04:00' }
    const reply = legalClocks({}, [sale], ruleSet, state, '2026-10-01T00:00:00Z').deadlines[0]
    // Back from Wed 14 Oct: Tue 13, Mon 12, (Sun, Sat), (Fri 9 closed), Thu 8.
    expect(reply).toMatchObject({ dueDate: '2026-10-08', weekendDaysSkipped: 2, holidaysSkipped: [{ date: '2026-10-09', name: 'Yard closed for inventory' }] })
  })

  it('legalClocks_rescheduledSale_countsFromTheLatestDate', () => {
    const events: ClockEvent[] = [
      { kind: 'sale-scheduled', at: '2026-10-14T10:00:00-04:00' },
      { kind: 'sale-scheduled', at: '2026-10-21T10:00:00-04:00' },
    ]
    expect(legalClocks({}, events, ruleSet, federal, '2026-10-01T00:00:00Z').deadlines[0]?.dueDate).toBe('2026-10-16')
  })

  it('legalClocks_badTimeZoneOption_throwsInvalidTimeZone', () => {
    expect(() => legalClocks({}, [], ruleSet, federal, '2026-10-01T00:00:00Z', { timeZone: 'Eastern' })).toThrow(expect.objectContaining({ code: 'invalid-time-zone' }))
  })
})
