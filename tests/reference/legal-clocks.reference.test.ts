import { describe, expect, it } from 'vitest'
import californiaJson from '../../server/rule-sets/samples/california.json' with { type: 'json' }
import floridaJson from '../../server/rule-sets/samples/florida.json' with { type: 'json' }
import templateJson from '../../server/rule-sets/samples/ordinance-24h.json' with { type: 'json' }
import { ruleSetCalendars } from '../../server/holidays/index'
import { usFederalCalendar } from '../helpers/us-federal-holidays'
import { type ClockEvent, legalClocks, lienSaleGate } from '@shared/domain/clocks'
import { ruleSetSchema } from '@shared/schemas/rule-sets'

const california = ruleSetSchema.parse(californiaJson)
const florida = ruleSetSchema.parse(floridaJson)
const federal = usFederalCalendar()

const due = (clocks: ReturnType<typeof legalClocks>, code: string) => clocks.deadlines.find((d) => d.code === code)

describe('Florida Stat. 713.78 timelines', () => {
  // Stored Tuesday 30 June 2026, 15:00 in Miami.
  const stored: ClockEvent[] = [{ kind: 'stored', at: '2026-06-30T15:00:00-04:00' }]

  it('legalClocks_floridaNoticeOfLien_isDueSevenBusinessDaysAfterStorageSkippingIndependenceDay ([S]; 5 U.S.C. 6103)', () => {
    const notice = due(legalClocks({ modelYear: 2018 }, stored, florida, federal, '2026-07-01T12:00:00Z'), 'notice-of-lien')
    // Wed 1, Thu 2, (Fri 3 observed holiday, Sat 4, Sun 5), Mon 6 … Fri 10 July.
    expect(notice).toMatchObject({ dueDate: '2026-07-10', dayKind: 'business', weekendDaysSkipped: 2, status: 'upcoming' })
    expect(notice?.holidaysSkipped).toEqual([{ date: '2026-07-03', name: 'Independence Day (observed)' }])
    expect(notice?.dueAt).toBe('2026-07-11T04:00:00.000Z')
  })

  it.each([
    { modelYear: 2022, days: 35, date: '2026-08-04', why: 'model year 2022 is 4 years old in 2026: more than 3 years → 35 days' },
    { modelYear: 2023, days: 50, date: '2026-08-19', why: 'model year 2023 is 3 years old in 2026: 3 years or less → 50 days' },
  ])('legalClocks_floridaEarliestSale_$why ([M] — re-read the current text)', ({ modelYear, days, date }) => {
    const clocks = legalClocks({ modelYear }, stored, florida, federal, '2026-07-01T12:00:00Z')
    const sale = due(clocks, 'earliest-sale')
    expect(sale).toMatchObject({ days, dueDate: date, kind: 'earliest', status: 'upcoming' })
    expect(sale?.branch).toContain(`Model year ${modelYear}`)
    expect(clocks.notApplicable).toHaveLength(1)
  })
})

describe('California Civil Code 3071 and 3072 timelines by value [V]', () => {
  const events: ClockEvent[] = [
    { kind: 'lien-arose', at: '2026-04-01T10:00:00-07:00' },
    { kind: 'sale-scheduled', at: '2026-06-15T10:00:00-07:00' },
  ]

  it('legalClocks_californiaVehicleValuedAtMost4000_followsSection3072', () => {
    const clocks = legalClocks({ valueCents: 400_000 }, events, california, federal, '2026-04-02T00:00:00Z')
    expect(clocks.deadlines.map((d) => [d.code, d.dueDate ?? null])).toEqual([
      ['records-request', '2026-04-16'], // 15 days after the lien arose
      ['notice-window-opens', '2026-05-05'], // not more than 41 days before the sale
      ['notice-window-closes', '2026-05-15'], // at least 31 days before the sale
      ['opposition-period', null], // 10 days from mailing: starts when the notice is mailed
      ['sale-after-notice', null], // 31 days from mailing
      ['sale-within-notice', null], // no later than 41 days from mailing
      ['sale-notice-posted', '2026-06-05'], // at least 10 days before the sale
      ['sale-after-posting', null], // 10 days from the posting
      ['sale-on-noticed-date', '2026-06-15'], // the date the notice gives [M]
    ])
  })

  it('legalClocks_californiaVehicleValuedOver4000_followsSection3071', () => {
    const clocks = legalClocks({ valueCents: 400_001 }, events, california, federal, '2026-04-02T00:00:00Z')
    expect(clocks.deadlines.map((d) => [d.code, d.dueDate ?? null])).toEqual([
      ['records-request', '2026-04-16'], // asked of every vehicle: the shorter count of § 3072 and Veh. Code § 22851.8
      ['lien-sale-application', '2026-05-01'], // apply within 30 days of the lien arising
      ['opposition-period', null], // 10 days from the DMV's own notice
      ['sale-notice', '2026-05-26'], // notice 20 days before the sale
      ['sale-after-notice', null],
      ['advertise-window-opens', '2026-05-26'], // advertise 5 to 20 days before it
      ['advertise-window-closes', '2026-06-10'],
      ['sale-after-advertising', null],
      ['sale-within-advertising', null],
      ['sale-on-noticed-date', '2026-06-15'],
    ])
  })

  it('legalClocks_californiaVehicleValued500OrLess_followsVehicleCode22851 (CVC 22851.6: $500 or less → 22851.8, 22851.10)', () => {
    const clocks = legalClocks({ valueCents: 50_000 }, events, california, federal, '2026-04-02T00:00:00Z')
    expect(clocks.deadlines.map((d) => [d.code, d.dueDate ?? null])).toEqual([
      ['records-request', '2026-04-16'],
      ['low-value-disposal', null], // 15 days after the notice of intent to dispose is mailed
    ])
    expect(clocks.alerts).toEqual([])
  })

  // A mailing deadline on a day post offices are closed moves to the open day before (the sample's
  // mailDeadlines, [M]): a sale on Wed 17 Jun 2026 puts the 31st day before it on Sun 17 May, so the
  // notice of pending lien sale is due by Fri 15 May (Saturday counts as closed too).
  it('legalClocks_californiaLatestMailingOnASunday_movesToTheFridayBefore', () => {
    const onWednesday: ClockEvent[] = [events[0]!, { kind: 'sale-scheduled', at: '2026-06-17T10:00:00-07:00' }]
    const clocks = legalClocks({ valueCents: 300_000 }, onWednesday, california, ruleSetCalendars(california), '2026-04-02T00:00:00Z')
    const closes = due(clocks, 'notice-window-closes')
    expect(closes?.dueDate).toBe('2026-05-15')
    expect(closes?.explanation).toContain('2026-05-17 is a Sunday, when post offices are closed')
    expect(closes?.rules?.[0]?.source.confidence).toBe('M')
    expect(due(clocks, 'notice-window-opens')?.dueDate).toBe('2026-05-07') // an earliest date never moves
  })
})

describe('The ordinance template (placeholder periods, US federal holidays of 5 U.S.C. 6103 [V])', () => {
  const template = ruleSetSchema.parse(templateJson)

  it('legalClocks_templateOwnerNotice_isTenBusinessDaysSkippingThanksgiving', () => {
    // Stored Tue 24 Nov 2026 in Chicago: Wed 25, (Thu 26 Thanksgiving), Fri 27, Mon 30, Tue 1 … Fri 4, Mon 7,
    // Tue 8, Wed 9 Dec → the 10th business day is Wed 9 Dec 2026 [C].
    const clocks = legalClocks({}, [{ kind: 'stored', at: '2026-11-24T10:00:00-06:00' }], template, ruleSetCalendars(template), '2026-11-25T12:00:00Z')
    const notice = due(clocks, 'owner-notice')
    expect(notice).toMatchObject({ dueDate: '2026-12-09', weekendDaysSkipped: 4 })
    expect(notice?.holidaysSkipped.map((h) => h.date)).toEqual(['2026-11-26'])
  })

  it('lienSaleGate_templateDisposal_opensThirtyDaysAfterTheNotice', () => {
    // Notice mailed Tue 1 Dec 2026 + 30 calendar days = Thu 31 Dec 2026 [C].
    const events: ClockEvent[] = [
      { kind: 'stored', at: '2026-11-24T10:00:00-06:00' },
      { kind: 'owner-notice-mailed', at: '2026-12-01T10:00:00-06:00' },
    ]
    const gateOn = (asOf: string) => lienSaleGate(legalClocks({}, events, template, ruleSetCalendars(template), asOf).deadlines)
    expect(gateOn('2026-12-30T12:00:00-06:00')).toMatchObject({ open: false, date: '2026-12-31' })
    expect(gateOn('2026-12-31T12:00:00-06:00')).toMatchObject({ open: true, date: '2026-12-31' })
  })
})
