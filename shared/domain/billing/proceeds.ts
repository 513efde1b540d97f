import { DomainError } from '../errors'

export interface AppliedProceeds {
  dueCents: number
  appliedCents: number
  surplusCents: number
  shortfallCents: number
}

/**
 * A lien sale's price applied to what is owed (integer cents): the charges are paid from the proceeds
 * first; what is left over is a surplus held for the owner (or as the state's law directs: California
 * Civil Code 3073 has the balance deposited with the state, from memory [M]), never the yard's; what the price
 * did not cover is a shortfall. applied + surplus = price; applied + shortfall = due.
 */
export function applyProceeds(priceCents: number, dueCents: number): AppliedProceeds {
  for (const [field, value] of [['priceCents', priceCents], ['dueCents', dueCents]] as const) {
    if (!Number.isSafeInteger(value) || value < 0) throw new DomainError('invalid-amount', 'An amount must be whole cents, zero or more.', field)
  }
  const appliedCents = Math.min(priceCents, dueCents)
  return { dueCents, appliedCents, surplusCents: priceCents - appliedCents, shortfallCents: dueCents - appliedCents }
}
