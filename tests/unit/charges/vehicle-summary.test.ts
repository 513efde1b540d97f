import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { summarizeVehicle } from '../../../server/charges/vehicle-summary'
import { usFederalCalendar } from '../../helpers/us-federal-holidays'
import { ruleSetSchema } from '@shared/schemas/rule-sets'

const california = ruleSetSchema.parse(JSON.parse(readFileSync('server/rule-sets/samples/california.json', 'utf8')))
const standardRate = california.vehicleClasses.find((c) => c.code === 'standard')!.dailyRateCents
// The sample charges its impound fee once per stay, untaxed (tax rate 0 in the sample).
const impound = california.fees.find((f) => f.code === 'impound')!.amountCents
const LA = 'America/Los_Angeles'

const stay = (over: Partial<Parameters<typeof summarizeVehicle>[0]> = {}) => ({
  arrivedAt: new Date('2026-03-02T18:00:00Z'), // 10:00 in Los Angeles, Monday 2 March 2026
  closedAt: null,
  vehicleClass: 'standard',
  modelYear: 2012,
  valueCents: 300_000,
  towCents: 24_500,
  clockEvents: [],
  ...over,
})

describe('summarizeVehicle', () => {
  // Cal. Civ. Code § 3068.1(a)(1): each calendar day or part of one. 2 Mar 10:00 → 4 Mar 09:00 touches 3 days.
  it('bills storage by the rule set day count and adds the tow to the balance', () => {
    const s = summarizeVehicle(stay(), california, usFederalCalendar(), new Date('2026-03-04T17:00:00Z'), LA)
    expect(s.daysOnLot).toBe(3)
    expect(s.storageCents).toBe(3 * standardRate + impound)
    expect(s.balanceCents).toBe(3 * standardRate + impound + 24_500)
  })

  // Cal. Civ. Code § 3072 (value $4,000 or less): ask for owner records within 15 days of the lien
  // arising; the sample reads the lien as arising at storage → due 17 March 2026 [C].
  it('starts the California records deadline at arrival and counts the days left in the yard calendar', () => {
    const s = summarizeVehicle(stay(), california, usFederalCalendar(), new Date('2026-03-04T17:00:00Z'), LA)
    expect(s.nextDeadline).toMatchObject({ code: 'records-request', status: 'upcoming', dueDate: '2026-03-17', daysLeft: 13 })
  })

  it('shows a missed deadline before an upcoming one', () => {
    const s = summarizeVehicle(stay(), california, usFederalCalendar(), new Date('2026-03-20T17:00:00Z'), LA)
    expect(s.nextDeadline?.status).toBe('missed')
    expect(s.nextDeadline?.daysLeft).toBeLessThan(0)
  })

  // The records request does not depend on the value (Civ. Code § 3072 / Veh. Code § 22851.8, the shorter
  // count); every branch that does comes back as "needs the value", shown on the card, never dropped.
  it('keeps the records deadline and says the value is needed when the value is unknown', () => {
    const s = summarizeVehicle(stay({ valueCents: null }), california, usFederalCalendar(), new Date('2026-03-04T17:00:00Z'), LA)
    expect(s.nextDeadline).toMatchObject({ code: 'records-request', dueDate: '2026-03-17' })
    expect(s.clockAlerts.map((a) => a.code)).toEqual(['needs-value'])
    expect(s.lienSale).toMatchObject({ open: false, code: 'needs-value' })
  })

  it('says no branch applies when the rule set has none for the vehicle', () => {
    const gap = { ...california, timeline: california.timeline.filter((step) => step.when?.valueCents?.atMost !== 50_000) }
    const s = summarizeVehicle(stay({ valueCents: 30_000 }), gap, usFederalCalendar(), new Date('2026-03-04T17:00:00Z'), LA)
    expect(s.clockAlerts.map((a) => a.code)).toEqual(['no-branch'])
    expect(s.lienSale).toMatchObject({ open: false, code: 'no-branch' })
  })
})
