import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { DomainError } from '@shared/domain/errors'
import { assertCents, formatCents, multiplyRounded, taxOnLine, times } from '@shared/domain/billing'

describe('taxOnLine (half-up per line)', () => {
  it.each([
    { amount: 1000, rate: 7.25, tax: 73, why: '72.5 cents rounds half up to 73' },
    { amount: 1001, rate: 6, tax: 60, why: '60.06 cents rounds down to 60' },
    { amount: 1009, rate: 6, tax: 61, why: '60.54 cents rounds up to 61' },
    { amount: 19_500, rate: 8.875, tax: 1731, why: '1730.625 cents rounds up to 1731' },
    { amount: 12_345, rate: 0, tax: 0, why: 'a zero rate is no tax' },
  ])('taxOnLine_$amount cents at $rate %_is$tax ($why)', ({ amount, rate, tax }) => {
    expect(taxOnLine(amount, rate)).toBe(tax)
  })

  it('taxOnLine_anyAmountAndRate_equalsIntegerHalfUpArithmetic', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 10_000_000 }), fc.integer({ min: 0, max: 150_000 }), (amount, tenThousandths) => {
        // Oracle in BigInt: amount × rate / 10^6, half-up.
        const exact = (BigInt(amount) * BigInt(tenThousandths) * 2n + 1_000_000n) / 2_000_000n
        expect(taxOnLine(amount, tenThousandths / 10_000)).toBe(Number(exact))
      }),
    )
  })
})

describe('multiplyRounded', () => {
  it.each([
    { cents: 650, factor: { amount: 127, scale: 1 }, result: 8255, why: '12.7 miles at $6.50' },
    { cents: 333, factor: { amount: 5, scale: 1 }, result: 167, why: '166.5 rounds half up' },
  ])('multiplyRounded_$why_is$result', ({ cents, factor, result }) => {
    expect(multiplyRounded(cents, factor)).toBe(result)
  })
})

describe('formatCents', () => {
  const intl = new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' })

  it('formatCents_anyAmount_readsAsIntlEnUsCurrency (Intl as the oracle)', () => {
    fc.assert(
      fc.property(fc.integer({ min: -1_000_000_000_00, max: 1_000_000_000_00 }), (cents) => {
        expect(formatCents(cents)).toBe(intl.format(cents / 100))
      }),
    )
  })

  it.each([
    { cents: 0, text: '$0.00' },
    { cents: 5, text: '$0.05' },
    { cents: 123_456_78, text: '$123,456.78' },
  ])('formatCents_$cents_is$text', ({ cents, text }) => {
    expect(formatCents(cents)).toBe(text)
  })
})

describe('cents guards', () => {
  it.each([
    { value: -1, why: 'negative' },
    { value: 10.5, why: 'fractional' },
    { value: Number.MAX_SAFE_INTEGER + 2, why: 'beyond exact integers' },
  ])('assertCents_$why_throwsInvalidAmount', ({ value }) => {
    expect(() => assertCents(value, 'fee')).toThrow(expect.objectContaining({ code: 'invalid-amount', field: 'fee' }))
  })

  it('times_overflowingProduct_throwsDomainError', () => {
    expect(() => times(Number.MAX_SAFE_INTEGER, 3, 'storage')).toThrow(DomainError)
  })
})
