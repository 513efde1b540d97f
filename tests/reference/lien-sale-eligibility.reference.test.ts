import { describe, expect, it } from 'vitest'
import californiaJson from '../../server/rule-sets/samples/california.json' with { type: 'json' }
import floridaJson from '../../server/rule-sets/samples/florida.json' with { type: 'json' }
import { summarizeVehicle, type SummaryInput } from '../../server/charges/index'
import { ruleSetCalendars } from '../../server/holidays/index'
import { ruleSetSchema } from '@shared/schemas/rule-sets'

const california = ruleSetSchema.parse(californiaJson)
const florida = ruleSetSchema.parse(floridaJson)

const vehicle = (more: Partial<SummaryInput>): SummaryInput => ({
  arrivedAt: new Date('2026-06-30T15:00:00-04:00'),
  closedAt: null,
  vehicleClass: 'standard',
  modelYear: 2018,
  valueCents: 100_000,
  towCents: 0,
  clockEvents: [],
  ...more,
})

describe('eligible for lien sale or disposal: the last "not before" date passed and no claim', () => {
  // Fla. Stat. § 713.78 [M — partly from memory, re-read the current text]: sale after 35 days from
  // storage for a vehicle more than 3 years old. Stored Tue 30 June 2026 → 35 days → Tue 4 August.
  it('eligibility_florida2018StoredOn30June_isEligibleSince4August', () => {
    const s = summarizeVehicle(vehicle({}), florida, ruleSetCalendars(florida), new Date('2026-08-10T12:00:00Z'), 'America/New_York')
    expect(s.eligible).toMatchObject({ since: '2026-08-04', step: 'Earliest lien sale', citation: expect.stringContaining('713.78') })
  })

  it('eligibility_florida2018OnDay34_isNotYetEligible', () => {
    const s = summarizeVehicle(vehicle({}), florida, ruleSetCalendars(florida), new Date('2026-08-03T12:00:00Z'), 'America/New_York')
    expect(s.eligible).toBeNull()
    expect(s.lienSale).toMatchObject({ code: 'not-before', date: '2026-08-04' })
  })

  // The same section [M]: 50 days for a vehicle 3 years old or less. Model year 2024 in 2026: 2 years → 19 August.
  it('eligibility_florida2024_waitsFiftyDaysTo19August', () => {
    const early = summarizeVehicle(vehicle({ modelYear: 2024 }), florida, ruleSetCalendars(florida), new Date('2026-08-10T12:00:00Z'), 'America/New_York')
    expect(early.eligible).toBeNull()
    expect(early.lienSale.date).toBe('2026-08-19')
    const late = summarizeVehicle(vehicle({ modelYear: 2024 }), florida, ruleSetCalendars(florida), new Date('2026-08-20T12:00:00Z'), 'America/New_York')
    expect(late.eligible?.since).toBe('2026-08-19')
  })

  it('eligibility_ownerClaimedTheVehicle_isNotEligible', () => {
    const s = summarizeVehicle(vehicle({ claimed: true }), florida, ruleSetCalendars(florida), new Date('2026-08-10T12:00:00Z'), 'America/New_York')
    expect(s.lienSale.open).toBe(true)
    expect(s.eligible).toBeNull()
  })

  // Cal. Veh. Code § 22851.10(a) [S — secondary copy of the text]: a vehicle valued $500 or less is
  // disposed of not earlier than 15 days after the Notice of Intent to Dispose was mailed.
  // Mailed Mon 2 March 2026 → 15 days → Tue 17 March.
  it('eligibility_californiaLowValueNoticeMailed2March_isEligibleSince17March', () => {
    const input = vehicle({
      arrivedAt: new Date('2026-02-20T09:00:00-08:00'),
      valueCents: 30_000,
      clockEvents: [{ kind: 'disposal-notice-mailed', at: '2026-03-02T10:00:00-08:00' }],
    })
    const before = summarizeVehicle(input, california, ruleSetCalendars(california), new Date('2026-03-16T20:00:00Z'), 'America/Los_Angeles')
    expect(before.eligible).toBeNull()
    const after = summarizeVehicle(input, california, ruleSetCalendars(california), new Date('2026-03-17T20:00:00Z'), 'America/Los_Angeles')
    expect(after.eligible).toMatchObject({ since: '2026-03-17', step: 'Earliest disposal to a dismantler or scrap processor', citation: expect.stringContaining('22851.10') })
  })
})
