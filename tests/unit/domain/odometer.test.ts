import { describe, expect, it } from 'vitest'
import { odometerDisclosure } from '@shared/domain/vehicle'

describe('odometerDisclosure input', () => {
  it.each([
    { why: 'a two-digit model year', args: [98, 4_000, '2026-01-05'] as const, code: 'invalid-model-year', field: 'modelYear' },
    { why: 'a negative GVWR', args: [2015, -1, '2026-01-05'] as const, code: 'invalid-amount', field: 'gvwrLb' },
    { why: 'a transfer date that is no date', args: [2015, 4_000, '2026-02-30'] as const, code: 'invalid-date', field: 'transferDate' },
  ])('odometerDisclosure_$why_throwsAtItsField', ({ args, code, field }) => {
    const [modelYear, gvwrLb, transferDate] = args
    expect(() => odometerDisclosure(modelYear, gvwrLb, true, transferDate)).toThrow(expect.objectContaining({ code, field }))
  })

  it('odometerDisclosure_required_saysFromWhenTheVehicleIsExempt', () => {
    expect(odometerDisclosure(2015, 4_000, true, '2026-01-05').reason).toBe(
      'Disclose the mileage: a model year 2011 or newer vehicle is exempt only from 1 January 2035 (49 CFR 580.17(a)(4)).',
    )
  })
})
