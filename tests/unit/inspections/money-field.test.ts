import { describe, expect, it } from 'vitest'
import { centsToDollars, dollarsToCents } from '../../../src/composables/money-field'

describe('dollarsToCents — typed text to whole cents without floats', () => {
  it.each([
    ['1276.55', 127_655],
    ['$1,276.55', 127_655],
    ['12.34', 1_234], // 12.34 × 100 in floating point is 1233.9999999999998
    ['0.1', 10],
    ['.5', 50],
    ['89', 8_900],
    ['-5', -500],
  ])('dollarsToCents_%s_is_%i', (text, cents) => {
    expect(dollarsToCents(text)).toBe(cents)
  })

  it('dollarsToCents_threeDecimals_isAFractionOfACent_soTheSchemaRefusesIt', () => {
    expect(Number.isInteger(dollarsToCents('10.005'))).toBe(false)
  })

  it.each(['', 'abc', '1.2.3', '$'])('dollarsToCents_%j_isNaN', (text) => {
    expect(dollarsToCents(text)).toBeNaN()
  })

  it('centsToDollars_putsASavedFigureBack', () => {
    expect(centsToDollars(127_605)).toBe('1276.05')
    expect(dollarsToCents(centsToDollars(127_605))).toBe(127_605)
  })
})
