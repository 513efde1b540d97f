import { describe, expect, it } from 'vitest'
import californiaJson from '../../server/rule-sets/samples/california.json' with { type: 'json' }
import floridaJson from '../../server/rule-sets/samples/florida.json' with { type: 'json' }
import { usFederalCalendar } from '../helpers/us-federal-holidays'
import { type ClockEvent, legalClocks } from '@shared/domain/clocks'
import { plannedPublication } from '@shared/domain/notices'
import { ruleSetSchema } from '@shared/schemas/rule-sets'

// The newspaper publication (issue 10): California Civ. Code § 3071, for a vehicle valued over $4,000,
// "advertise the sale 5 to 20 days before it" [V, DMV lien sale handbook — REFERENCES.md]. Dates hand-worked.
const california = ruleSetSchema.parse(californiaJson)
const florida = ruleSetSchema.parse(floridaJson)
const federal = usFederalCalendar()

const events: ClockEvent[] = [
  { kind: 'stored', at: '2026-04-01T10:00:00-07:00' },
  { kind: 'lien-arose', at: '2026-04-01T10:00:00-07:00' },
  { kind: 'sale-scheduled', at: '2026-06-15T10:00:00-07:00' },
]
const over = { valueCents: 650_000 } // over $4,000: § 3071
const under = { valueCents: 250_000 } // $4,000 or less: § 3072, no advertisement

describe('California Civ. Code § 3071: advertise the sale 5 to 20 days before it [V]', () => {
  it('plannedPublication_over4000_windowOpensTwentySixthOfMayAndClosesTenthOfJune', () => {
    // Sale Mon 15 June 2026: 20 calendar days before = Tue 26 May; 5 days before = Wed 10 June.
    const p = plannedPublication(legalClocks(over, events, california, federal, '2026-05-20T19:00:00Z'), '2026-05-20')
    expect(p).toMatchObject({ kind: 'publication', status: 'not-yet', opensOn: '2026-05-26', dueDate: '2026-06-10', publishedAt: null })
    expect(p!.citation).toContain('§ 3071')
  })

  it.each([
    { today: '2026-05-26', status: 'due', why: 'the window opens on 26 May' },
    { today: '2026-06-10', status: 'due', why: 'the last day to publish is 10 June' },
    { today: '2026-06-11', status: 'overdue', why: 'less than 5 days before the sale' },
  ])('plannedPublication_over4000_on$today_is$status ($why)', ({ today, status }) => {
    expect(plannedPublication(legalClocks(over, events, california, federal, `${today}T19:00:00Z`), today)!.status).toBe(status)
  })

  it.each([
    { published: '2026-06-01T09:00:00-07:00', status: 'sent', why: 'in print on 1 June, inside the window' },
    { published: '2026-05-20T09:00:00-07:00', status: 'late', why: 'in print on 20 May, more than 20 days before the sale' },
  ])('plannedPublication_over4000_$why', ({ published, status }) => {
    const withPublication: ClockEvent[] = [...events, { kind: 'sale-advertised', at: published }]
    expect(plannedPublication(legalClocks(over, withPublication, california, federal, '2026-06-12T19:00:00Z'), '2026-06-12')).toMatchObject({ status, publishedAt: new Date(published).toISOString() })
  })

  it('plannedPublication_4000OrLess_isNone (§ 3072 has no advertisement)', () => {
    expect(plannedPublication(legalClocks(under, events, california, federal, '2026-05-20T19:00:00Z'), '2026-05-20')).toBeNull()
  })

  it('plannedPublication_florida_isNone (the sample has no publication step)', () => {
    expect(plannedPublication(legalClocks({ modelYear: 2018 }, [{ kind: 'stored', at: '2026-06-30T15:00:00-04:00' }], florida, federal, '2026-07-01T12:00:00Z'), '2026-07-01')).toBeNull()
  })
})
