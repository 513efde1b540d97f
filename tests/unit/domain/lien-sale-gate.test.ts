import { describe, expect, it } from 'vitest'
import californiaJson from '../../../server/rule-sets/samples/california.json' with { type: 'json' }
import floridaJson from '../../../server/rule-sets/samples/florida.json' with { type: 'json' }
import { usFederalCalendar } from '../../helpers/us-federal-holidays'
import { type ClockEvent, legalClocks, lienSaleGate } from '@shared/domain/clocks'
import { ruleSetSchema } from '@shared/schemas/rule-sets'

const florida = ruleSetSchema.parse(floridaJson)
const california = ruleSetSchema.parse(californiaJson)
const stored: ClockEvent[] = [{ kind: 'stored', at: '2026-06-30T15:00:00-04:00' }]
const gate = (ruleSet: typeof florida, modelYear: number, asOf: string) =>
  lienSaleGate(legalClocks({ modelYear, valueCents: 100_000 }, stored, ruleSet, usFederalCalendar(), asOf).deadlines)

// The sample Florida rule set's sale dates (35 days from storage, 50 for a vehicle 3 years old or
// less) come from its own timeline; the gate only reads whether they have been reached.
describe('lienSaleGate', () => {
  it('lienSaleGate_olderVehicleBeforeDay35_isShutWithTheDate', () => {
    expect(gate(florida, 2018, '2026-07-20T00:00:00Z')).toEqual({
      open: false,
      date: '2026-08-04',
      why: 'Not before 2026-08-04.',
      code: 'not-before',
      step: 'Earliest lien sale',
      citation: expect.stringContaining('713.78'),
      // The sample's Spanish beside it (server/rule-sets/samples/florida.json), for a Spanish reader.
      es: { step: 'Primer día para la venta por gravamen', citation: expect.stringContaining('Fla. Stat. § 713.78: venta después de 35 días') },
    })
  })

  it('lienSaleGate_olderVehicleAfterDay35_isOpen', () => {
    expect(gate(florida, 2018, '2026-08-10T00:00:00Z')).toMatchObject({ open: true, date: '2026-08-04', why: 'Open since 2026-08-04.', code: 'open', step: 'Earliest lien sale' })
  })

  it('lienSaleGate_newerVehicle_waitsForTheLongerPeriod', () => {
    expect(gate(florida, 2025, '2026-08-10T00:00:00Z')).toMatchObject({ open: false, date: '2026-08-19' })
  })

  it('lienSaleGate_clockStartsFromANoticeNotYetMailed_isShutWithoutADate', () => {
    const g = gate(california, 2018, '2026-08-10T00:00:00Z')
    expect(g).toMatchObject({ open: false, date: null, code: 'waiting' })
    expect(g.why).toMatch(/: Starts once the record shows .*\.$/)
  })

  it('lienSaleGate_ruleSetWithoutASaleDate_isShut', () => {
    expect(lienSaleGate([])).toEqual({ open: false, date: null, why: 'The rule set sets no lien-sale date for this vehicle.', code: 'no-sale-date' })
  })
})
