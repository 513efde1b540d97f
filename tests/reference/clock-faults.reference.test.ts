// The clock faults of issue 10, each a hand-worked case beside the statute it comes from. Every case
// here failed on the code before the fix (see the commit that added this file).
import { describe, expect, it } from 'vitest'
import californiaJson from '../../server/rule-sets/samples/california.json' with { type: 'json' }
import floridaJson from '../../server/rule-sets/samples/florida.json' with { type: 'json' }
import { ruleSetCalendars } from '../../server/holidays/index'
import { type ClockEvent, type ClockVehicle, legalClocks, lienSaleGate } from '@shared/domain/clocks'
import { checkMove, type MoveFacts } from '@shared/domain/lifecycle'
import { type RuleSet, ruleSetSchema } from '@shared/schemas/rule-sets'

const california = ruleSetSchema.parse(californiaJson)
const florida = ruleSetSchema.parse(floridaJson)

// The calendars the server counts with (date-holidays, the post offices' closed days) for each rule set.
const clocks = (ruleSet: RuleSet, vehicle: ClockVehicle, events: ClockEvent[], asOf: string) =>
  legalClocks(vehicle, events, ruleSet, ruleSetCalendars(ruleSet), asOf)
const gate = (ruleSet: RuleSet, vehicle: ClockVehicle, events: ClockEvent[], asOf: string) =>
  lienSaleGate(clocks(ruleSet, vehicle, events, asOf).deadlines)
const due = (c: ReturnType<typeof legalClocks>, code: string) => c.deadlines.find((d) => d.code === code)

const facts = (lienSale: MoveFacts['lienSale']): MoveFacts => ({
  timeZone: 'America/Los_Angeles',
  holds: [],
  inspected: true,
  balanceCents: 0,
  paidCents: 0,
  creditedCents: 0,
  waived: false,
  claimantIdRecorded: false,
  releaseSigned: false,
  transferSigned: false,
  lienSaleSigned: true,
  lienSale,
})

describe('California: the sale waits for every "not before" step of its branch', () => {
  // Civ. Code § 3072 (valued $4,000 or less) [V, REFERENCES.md]: notice of pending lien sale by certified
  // mail at least 31 and not more than 41 days before the sale; owners have 10 days from the mailing to
  // oppose; notice posted at least 10 days before the sale. Hand-worked from a mailing on Fri 10 Apr 2026
  // and a sale set for Mon 18 May 2026:
  //   10 Apr + 10 = 20 Apr (opposition ends), + 31 = 11 May (earliest sale), + 41 = 21 May (latest sale);
  //   posted Tue 5 May + 10 = 15 May.
  const events: ClockEvent[] = [
    { kind: 'lien-arose', at: '2026-04-01T10:00:00-07:00' },
    { kind: 'lien-notice-mailed', at: '2026-04-10T09:00:00-07:00' },
    { kind: 'sale-scheduled', at: '2026-05-18T10:00:00-07:00' },
  ]
  const valued3000 = { valueCents: 300_000 }
  const posted: ClockEvent[] = [...events, { kind: 'sale-notice-posted', at: '2026-05-05T09:00:00-07:00' }]

  it('lienSaleGate_section3072_oppositionOverButNoticeNot31DaysOld_isShut', () => {
    const shut = gate(california, valued3000, events, '2026-04-25T12:00:00-07:00')
    expect(shut.open).toBe(false)
    const verdict = checkMove({ from: 'storage', to: 'closed', role: 'office', disposition: 'lien_sale', facts: facts(shut), now: new Date('2026-04-25T19:00:00Z') })
    expect(verdict.allowed).toBe(false)
    expect(verdict.reasons.map((r) => r.code)).toEqual(['lien-sale'])
  })

  it('lienSaleGate_section3072_31DaysPassedButBeforeTheNoticedSaleDate_isShutUntil18May', () => {
    expect(gate(california, valued3000, posted, '2026-05-12T12:00:00-07:00')).toMatchObject({ open: false, date: '2026-05-18', code: 'not-before' })
  })

  it('lienSaleGate_section3072_everyStepPassedAndPosted_opensOn18May', () => {
    expect(gate(california, valued3000, posted, '2026-05-18T09:00:00-07:00')).toMatchObject({ open: true, date: '2026-05-18' })
  })

  it('lienSaleGate_section3072_notPosted10DaysBefore_isShut', () => {
    expect(gate(california, valued3000, events, '2026-05-19T09:00:00-07:00')).toMatchObject({ open: false, code: 'waiting' })
  })

  it('lienSaleGate_section3072_noticeMoreThan41DaysOld_isShut', () => {
    // 22 May is past 21 May, the 41st day after the mailing: the notice no longer covers a sale.
    expect(gate(california, valued3000, posted, '2026-05-22T09:00:00-07:00')).toMatchObject({ open: false, code: 'expired' })
  })

  // Civ. Code § 3071 (valued over $4,000) [V, as read in the DMV lien sale handbook]: the department mails
  // the owners its own notice, and they have 10 days from that mailing to oppose; the yard's notice of the
  // sale goes out at least 20 days before it, and the sale is advertised 5 to 20 days before it.
  it('lienSaleGate_section3071_yardsNoticeOfSaleAlone_doesNotStartTheOwnersOpposition', () => {
    const yardsNoticeOnly: ClockEvent[] = [
      { kind: 'lien-arose', at: '2026-04-01T10:00:00-07:00' },
      { kind: 'lien-notice-mailed', at: '2026-04-10T09:00:00-07:00' },
    ]
    const c = clocks(california, { valueCents: 500_000 }, yardsNoticeOnly, '2026-05-01T12:00:00-07:00')
    expect(due(c, 'opposition-period')).toMatchObject({ status: 'not-started', start: { event: 'state-notice-mailed' } })
    expect(lienSaleGate(c.deadlines, c.alerts).open).toBe(false)
  })

  it('lienSaleGate_section3071_stateNoticeYardNoticeAndAdvertising_opensOnTheSaleDate', () => {
    // State's notice Sun 5 Apr + 10 = 15 Apr; yard's notice 10 Apr + 20 = 30 Apr; advertised 20 Apr + 5 = 25 Apr
    // (and no later than + 20 = 10 May); sale set for Mon 4 May.
    const all: ClockEvent[] = [
      { kind: 'lien-arose', at: '2026-04-01T10:00:00-07:00' },
      { kind: 'state-notice-mailed', at: '2026-04-05T09:00:00-07:00' },
      { kind: 'lien-notice-mailed', at: '2026-04-10T09:00:00-07:00' },
      { kind: 'sale-advertised', at: '2026-04-20T09:00:00-07:00' },
      { kind: 'sale-scheduled', at: '2026-05-04T10:00:00-07:00' },
    ]
    expect(gate(california, { valueCents: 500_000 }, all, '2026-05-03T12:00:00-07:00')).toMatchObject({ open: false, date: '2026-05-04' })
    expect(gate(california, { valueCents: 500_000 }, all, '2026-05-04T12:00:00-07:00')).toMatchObject({ open: true, date: '2026-05-04' })
  })
})

describe('California: a vehicle without a value on record', () => {
  const arose: ClockEvent[] = [{ kind: 'lien-arose', at: '2026-04-01T10:00:00-07:00' }]

  // Civ. Code § 3072 [V]: records within 15 days of the lien arising; CVC 22851.8 [S, DMV handbook 5.310]:
  // within 15 working days of possession. 1 Apr + 15 calendar days = 16 Apr, the earlier of the two.
  it('legalClocks_noValue_recordsRequestStillRunsFromTheLien', () => {
    const c = clocks(california, { valueCents: null }, arose, '2026-04-02T12:00:00-07:00')
    expect(due(c, 'records-request')).toMatchObject({ status: 'upcoming', dueDate: '2026-04-16' })
  })

  it('legalClocks_noValue_valueBranchesComeBackAsNeedsTheValue', () => {
    const c = clocks(california, { valueCents: null }, arose, '2026-04-02T12:00:00-07:00')
    const waiting = c.deadlines.filter((d) => d.status === 'needs-information')
    expect(waiting.length).toBeGreaterThan(0)
    for (const d of waiting) expect(d.needs).toBe('value')
    expect(c.alerts).toEqual([expect.objectContaining({ code: 'needs-value' })])
  })
})

describe('California: vehicles valued $500 or less (CVC 22851.6, 22851.8, 22851.10)', () => {
  // CVC 22851.10(a) [S, secondary copy of the text]: disposed of to a dismantler or scrap iron processor
  // not earlier than 15 days after the Notice of Intent to Dispose was mailed. 20 Apr + 15 = 5 May.
  const events: ClockEvent[] = [
    { kind: 'lien-arose', at: '2026-04-01T10:00:00-07:00' },
    { kind: 'disposal-notice-mailed', at: '2026-04-20T09:00:00-07:00' },
  ]

  it('legalClocks_valued400_hasTheLowValueDisposalDate', () => {
    const c = clocks(california, { valueCents: 40_000 }, events, '2026-04-21T12:00:00-07:00')
    expect(due(c, 'low-value-disposal')).toMatchObject({ kind: 'earliest', dueDate: '2026-05-05', status: 'upcoming' })
    expect(due(c, 'low-value-disposal')?.source.citation).toMatch(/22851\.10/)
  })

  it('lienSaleGate_valued400_opensOn5May', () => {
    expect(gate(california, { valueCents: 40_000 }, events, '2026-05-04T12:00:00-07:00')).toMatchObject({ open: false, date: '2026-05-05' })
    expect(gate(california, { valueCents: 40_000 }, events, '2026-05-05T12:00:00-07:00')).toMatchObject({ open: true, date: '2026-05-05' })
  })

  it('legalClocks_ruleSetWithoutALowValueBranch_saysNoBranchApplies', () => {
    const withoutLowValue = { ...california, timeline: california.timeline.filter((s) => s.when?.valueCents?.atMost !== 50_000) }
    const c = clocks(withoutLowValue, { valueCents: 40_000 }, events, '2026-04-21T12:00:00-07:00')
    expect(c.alerts).toEqual([expect.objectContaining({ code: 'no-branch' })])
    expect(lienSaleGate(c.deadlines, c.alerts)).toMatchObject({ open: false, code: 'no-branch' })
  })
})

describe('Florida: business days counted so the notice is never late (Fla. Stat. 713.78)', () => {
  // § 713.78(4) [S]: notice of lien by certified mail within 7 business days of storage; the section does
  // not say which holidays close a business day [M]. Counted conservatively: a day is skipped only when both
  // the Florida calendar (date-holidays US-FL) and the federal one (5 U.S.C. 6103 [V]) close it.
  const notice = (stored: string) =>
    legalClocks({ modelYear: 2015 }, [{ kind: 'stored', at: stored }], florida, ruleSetCalendars(florida), stored).deadlines.find((d) => d.code === 'notice-of-lien')

  it('legalClocks_floridaDayAfterThanksgiving_countsAsABusinessDay', () => {
    // Stored Fri 20 Nov 2026: Mon 23, Tue 24, Wed 25, (Thu 26 Thanksgiving, closed by both), Fri 27 (Florida
    // closes, the federal calendar does not: counted), Mon 30, Tue 1, Wed 2 Dec → due Wed 2 Dec 2026.
    expect(notice('2026-11-20T10:00:00-05:00')).toMatchObject({ dueDate: '2026-12-02' })
  })

  it('legalClocks_floridaDueOnColumbusDay_movesEarlierToTheFridayThePostOfficeIsOpen', () => {
    // Stored Thu 1 Oct 2026: Fri 2, Mon 5 … Fri 9, Mon 12 (Columbus Day: the federal calendar closes, Florida's
    // does not, so it counts as the 7th) → due Mon 12 Oct, when post offices are closed (a federal holiday):
    // the mailing moves earlier, to Fri 9 Oct 2026.
    const d = notice('2026-10-01T10:00:00-04:00')
    expect(d).toMatchObject({ dueDate: '2026-10-09' })
    expect(d?.explanation).toMatch(/Columbus Day/)
    expect(d?.rules?.map((r) => r.source.citation).join(' ')).toMatch(/713\.78/)
  })
})
