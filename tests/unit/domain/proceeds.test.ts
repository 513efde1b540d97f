import { describe, expect, it } from 'vitest'
import { applyProceeds } from '@shared/domain/billing'

// A lien sale's price pays the charges first; the rest is the owner's surplus (the rule the transfer records).
describe('applyProceeds', () => {
  it.each([
    { price: 150_000, due: 123_455, applied: 123_455, surplus: 26_545, shortfall: 0 },
    { price: 80_001, due: 80_002, applied: 80_001, surplus: 0, shortfall: 1 },
    { price: 0, due: 41_250, applied: 0, surplus: 0, shortfall: 41_250 },
    { price: 99_999, due: 0, applied: 0, surplus: 99_999, shortfall: 0 },
  ])('applyProceeds_price$price_due$due_applies$applied_surplus$surplus_shortfall$shortfall', ({ price, due, applied, surplus, shortfall }) => {
    const p = applyProceeds(price, due)
    expect(p).toEqual({ dueCents: due, appliedCents: applied, surplusCents: surplus, shortfallCents: shortfall })
    expect(p.appliedCents + p.surplusCents).toBe(price)
    expect(p.appliedCents + p.shortfallCents).toBe(due)
  })

  it.each([[-1, 0, 'priceCents'], [10.5, 0, 'priceCents'], [0, -5, 'dueCents']])('applyProceeds_%s_%s_refusesNaming_%s', (price, due, field) => {
    expect(() => applyProceeds(price, due)).toThrow(expect.objectContaining({ field }))
  })
})
