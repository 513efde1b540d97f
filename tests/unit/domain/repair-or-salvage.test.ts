import { describe, expect, it } from 'vitest'
import californiaJson from '../../../server/rule-sets/samples/california.json' with { type: 'json' }
import floridaJson from '../../../server/rule-sets/samples/florida.json' with { type: 'json' }
import { repairOrSalvage } from '@shared/domain/inspection'
import { ruleSetSchema } from '@shared/schemas/rule-sets'

const florida = ruleSetSchema.parse(floridaJson)
const california = ruleSetSchema.parse(californiaJson)

describe('repairOrSalvage — Florida Stat. 319.30(3)(a): 80 % of the value [V, older text]', () => {
  it.each([
    { estimate: 239_999, recommendation: 'repair', why: '$2,399.99 on a $3,000 car is under 80 %' },
    { estimate: 240_000, recommendation: 'salvage', why: '$2,400.00 on a $3,000 car is 80 %' },
  ])('repairOrSalvage_florida_$why', ({ estimate, recommendation }) => {
    const result = repairOrSalvage(estimate, 300_000, 40_000, florida)
    expect(result).toMatchObject({ recommendation, rule: 'percent-of-value', numbers: { thresholdCents: 240_000 } })
  })
})

describe('repairOrSalvage — Total Loss Formula: repair + salvage ≥ value [S]', () => {
  it.each([
    // A fact of the trade: a worn front end on an older car commonly costs well over $1,000 (common trade practice).
    { estimate: 140_000, salvage: 40_000, value: 180_000, recommendation: 'salvage', why: '$1,400 + $400 reaches an $1,800 car' },
    { estimate: 139_999, salvage: 40_000, value: 180_000, recommendation: 'repair', why: 'a cent less stays under it' },
  ])('repairOrSalvage_california_$why', ({ estimate, salvage, value, recommendation }) => {
    const result = repairOrSalvage(estimate, value, salvage, california)
    expect(result.recommendation).toBe(recommendation)
    expect(result.explanation.join(' ')).toContain('$1,800.00')
  })

  it('repairOrSalvage_salvageRecommended_saysWhyInPlainWords', () => {
    const result = repairOrSalvage(140_000, 180_000, 40_000, california)
    expect(result.explanation.at(-1)).toBe('That reaches the value of the vehicle, so repairing it is not worth it: salvage is recommended.')
    expect(result.source.citation).toContain('544')
  })

  it.each([
    { why: 'a value of zero', estimate: 100, value: 0, field: 'actualCashValueCents' },
    { why: 'a negative estimate', estimate: -1, value: 100, field: 'estimateCents' },
  ])('repairOrSalvage_$why_throwsAtItsField', ({ estimate, value, field }) => {
    expect(() => repairOrSalvage(estimate, value, 0, california)).toThrow(expect.objectContaining({ field }))
  })
})
