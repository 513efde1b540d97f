import type { Cents } from './money'

/** How money is taken at the counter. Card payments here are at the counter's own terminal. */
export const COUNTER_PAYMENT_METHODS = ['cash', 'check', 'card'] as const
export type CounterPaymentMethod = (typeof COUNTER_PAYMENT_METHODS)[number]
/** Every way money reaches the bill: the counter's, and a lien sale's proceeds applied to the charges. */
export const PAYMENT_METHODS = [...COUNTER_PAYMENT_METHODS, 'lien_sale'] as const
export type PaymentMethod = (typeof PAYMENT_METHODS)[number]

/** A waiver forgives a charge (the tow was the yard's mistake); a discount lowers it (goodwill). */
export const ADJUSTMENT_KINDS = ['waiver', 'discount'] as const
export type AdjustmentKind = (typeof ADJUSTMENT_KINDS)[number]

/** Above the company's limit an adjustment waits (pending) for a second manager. */
export const ADJUSTMENT_STATUSES = ['approved', 'pending', 'declined'] as const
export type AdjustmentStatus = (typeof ADJUSTMENT_STATUSES)[number]

export interface MoneyMovement {
  kind: 'payment' | 'refund'
  method: PaymentMethod
  amountCents: Cents
}

export interface Settlement {
  /** Everything charged: tow, storage, fees and their tax. */
  chargesCents: Cents
  /** Approved waivers and discounts. */
  creditedCents: Cents
  paidCents: Cents
  refundedCents: Cents
  /** Payments less refunds. */
  netPaidCents: Cents
  /** What is still owed; below zero the yard owes the customer. */
  dueCents: Cents
  /** Nothing is owed and a manager's waiver or discount is part of why. */
  waived: boolean
}

/** Where a vehicle's bill stands: charges less approved credits less what was paid net of refunds. */
export function settle(chargesCents: Cents, adjustments: readonly { amountCents: Cents; status: AdjustmentStatus }[], movements: readonly MoneyMovement[]): Settlement {
  let creditedCents = 0
  for (const a of adjustments) if (a.status === 'approved') creditedCents += a.amountCents
  let paidCents = 0
  let refundedCents = 0
  for (const m of movements) {
    if (m.kind === 'payment') paidCents += m.amountCents
    else refundedCents += m.amountCents
  }
  const netPaidCents = paidCents - refundedCents
  const dueCents = chargesCents - creditedCents - netPaidCents
  return { chargesCents, creditedCents, paidCents, refundedCents, netPaidCents, dueCents, waived: creditedCents > 0 && dueCents <= 0 }
}

/** The change a cash payment gives back; null when the cash handed over does not cover it. */
export function cashChange(amountCents: Cents, tenderedCents: Cents): Cents | null {
  return tenderedCents < amountCents ? null : tenderedCents - amountCents
}

export interface DrawerCount {
  /** Cash taken less cash refunded on the day. */
  recordedCents: Cents
  /** The float the drawer opened with, plus what was recorded. */
  expectedCents: Cents
  countedCents: Cents
  /** Counted less expected: above zero the drawer is over, below it short. */
  overShortCents: Cents
}

/** The day's close-out of the cash drawer: only cash moves the drawer, change already given back. */
export function countDrawer(movements: readonly MoneyMovement[], openingFloatCents: Cents, countedCents: Cents): DrawerCount {
  let recordedCents = 0
  for (const m of movements) {
    if (m.method !== 'cash') continue
    recordedCents += m.kind === 'payment' ? m.amountCents : -m.amountCents
  }
  const expectedCents = openingFloatCents + recordedCents
  return { recordedCents, expectedCents, countedCents, overShortCents: countedCents - expectedCents }
}
