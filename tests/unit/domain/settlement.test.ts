import { describe, expect, it } from 'vitest'
import { cashChange, settle } from '@shared/domain/billing'

describe('settle', () => {
  it.each([
    { why: 'nothing recorded', credits: [], moves: [], due: 10_000, waived: false },
    { why: 'paid in full', credits: [], moves: [{ kind: 'payment' as const, method: 'cash' as const, amountCents: 10_000 }], due: 0, waived: false },
    { why: 'waived in full', credits: [{ amountCents: 10_000, status: 'approved' as const }], moves: [], due: 0, waived: true },
    { why: 'discounted, rest paid', credits: [{ amountCents: 2_500, status: 'approved' as const }], moves: [{ kind: 'payment' as const, method: 'card' as const, amountCents: 7_500 }], due: 0, waived: true },
    { why: 'discounted, rest unpaid', credits: [{ amountCents: 2_500, status: 'approved' as const }], moves: [], due: 7_500, waived: false },
    { why: 'refund reopens', credits: [], moves: [{ kind: 'payment' as const, method: 'cash' as const, amountCents: 10_000 }, { kind: 'refund' as const, method: 'cash' as const, amountCents: 4_000 }], due: 4_000, waived: false },
  ])('settle_$why', ({ credits, moves, due, waived }) => {
    expect(settle(10_000, credits, moves)).toMatchObject({ dueCents: due, waived })
  })
})

describe('cashChange', () => {
  it.each([
    [4_250, 5_000, 750],
    [4_250, 4_250, 0],
    [4_250, 4_249, null],
  ])('cashChange(%i, %i) = %s', (amount, tendered, change) => {
    expect(cashChange(amount, tendered)).toBe(change)
  })
})
