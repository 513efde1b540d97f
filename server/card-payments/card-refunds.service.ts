import { createHash } from 'node:crypto'
import { and, eq, sql } from 'drizzle-orm'
import Stripe from 'stripe'
import type { Executor } from '@db/client'
import { payments } from '@db/schema'
import { formatCents } from '@shared/domain/billing'
import type { PaymentAnswer } from '@shared/schemas/billing'
import type { CardRefund } from '@shared/schemas/card-payments'
import type { User } from '@shared/schemas/users'
import { invoiceOf, paymentRecord } from '../billing/index'
import { AppError, said } from '../errors'
import { changeVehicle, vehicleForUser, type VehicleChanges } from '../vehicles/index'
import { unavailable, type CardPayments } from './card-payments.service'

// `words` is the refusal's code for the reader's language (`said(…)`); the field's issue repeats the sentence and reads as it does.
const refusal = (status: number, path: string, message: string, words: ReturnType<typeof said> | Record<string, never> = {}) => new AppError(status, message, { ...words, issues: [{ path, message }] })
const hashOf = (fields: Record<string, unknown>) => createHash('sha256').update(JSON.stringify(fields)).digest('hex')

type PaymentRow = typeof payments.$inferSelect

const byKey = async (db: Executor, vehicleId: string, key: string) =>
  (await db.select().from(payments).where(and(eq(payments.vehicleId, vehicleId), eq(payments.idempotencyKey, key))))[0]

/** The card payment made on the hosted page, and how much of it is left to give back. */
async function chargeOf(db: Executor, vehicleId: string, paymentId: string): Promise<{ charge: PaymentRow; leftCents: number }> {
  const [charge] = await db.select().from(payments).where(and(eq(payments.vehicleId, vehicleId), eq(payments.id, paymentId)))
  if (!charge || charge.kind !== 'payment' || charge.method !== 'card' || !charge.providerReference) {
    throw refusal(400, 'paymentId', 'Only a card payment made on the payment page can be refunded through the payment service.', said('notRefundable'))
  }
  const [done] = await db
    .select({ cents: sql<number>`coalesce(sum(${payments.amountCents}), 0)::int` })
    .from(payments)
    .where(and(eq(payments.kind, 'refund'), eq(payments.refundOfPaymentId, charge.id)))
  return { charge, leftCents: charge.amountCents - (done?.cents ?? 0) }
}

const overRefund = (leftCents: number) =>
  leftCents > 0
    ? refusal(400, 'amountCents', `At most ${formatCents(leftCents)} of this card payment can still be refunded.`, said('refundAtMost', { leftCents }))
    : refusal(400, 'amountCents', 'This card payment has been refunded in full.', said('refundedInFull'))

/**
 * A manager's refund of a card payment through the payment service (the SDK's refunds call). Nothing is
 * written until the service answers that the refund succeeded; then, in the vehicle's one change, a refund
 * row naming the service's refund and the payment it gives back on, and its `payment_refunded` event. The
 * client's idempotency key makes a retry or a double click refund once: the same key answers the refund it
 * made, and the service is sent the same key (`holdfast-refund-<vehicle>-<key>`) so it also refunds once.
 * Never more than is left unrefunded on that one payment, refused before the service is asked.
 */
export async function refundCard(changes: VehicleChanges, cards: CardPayments | undefined, actor: User, vehicleId: string, input: CardRefund): Promise<PaymentAnswer> {
  const { db } = changes
  const requestHash = hashOf({ kind: 'card-refund', paymentId: input.paymentId, amountCents: input.amountCents, reason: input.reason })
  const answer = async (payment: PaymentRow, replayed: boolean): Promise<PaymentAnswer> => {
    if (payment.requestHash !== requestHash) {
      throw refusal(409, 'idempotencyKey', 'This refund key was already used for a different refund. Reload the page and try again.', said('refundKeyUsed'))
    }
    const { vehicle, yard } = await vehicleForUser(db, actor.id, vehicleId)
    return { payment: paymentRecord(payment, actor.name), replayed, invoice: await invoiceOf(db, vehicle, yard) }
  }
  await vehicleForUser(db, actor.id, vehicleId)
  const earlier = await byKey(db, vehicleId, input.idempotencyKey)
  if (earlier) return answer(earlier, true)
  if (!cards) throw unavailable()
  const { charge, leftCents } = await chargeOf(db, vehicleId, input.paymentId)
  if (input.amountCents > leftCents) throw overRefund(leftCents)

  let refund: Stripe.Refund
  try {
    refund = await cards.stripe.refunds.create(
      {
        payment_intent: charge.providerReference!,
        amount: input.amountCents,
        reason: 'requested_by_customer',
        metadata: { holdfast: '1', vehicleId, paymentId: charge.id },
      },
      { idempotencyKey: `holdfast-refund-${vehicleId}-${input.idempotencyKey}` },
    )
  } catch (err) {
    if (err instanceof Stripe.errors.StripeInvalidRequestError && err.param === 'amount') throw refusal(400, 'amountCents', `The card payment service refuses: ${err.message}`)
    const message = err instanceof Stripe.errors.StripeError ? err.message : 'no answer'
    throw new AppError(502, `The card payment service did not refund it: ${message}. Nothing was recorded; try again.`)
  }
  if (refund.status !== 'succeeded') {
    throw new AppError(502, `The card payment service has not confirmed the refund (it says "${refund.status}"). Nothing was recorded; try again in a moment with the same form.`)
  }

  const { result } = await changeVehicle(changes, actor, vehicleId, async ({ tx, vehicle, yard, record }) => {
    const again = await byKey(tx, vehicleId, input.idempotencyKey)
    if (again) return { row: again, replayed: true }
    const before = await invoiceOf(tx, vehicle, yard)
    const [row] = await tx
      .insert(payments)
      .values({
        vehicleId,
        kind: 'refund',
        method: 'card',
        amountCents: refund.amount,
        reason: input.reason,
        idempotencyKey: input.idempotencyKey,
        requestHash,
        dueBeforeCents: before.dueCents,
        providerReference: refund.id,
        refundOfPaymentId: charge.id,
        takenById: actor.id,
      })
      .returning()
    record({
      kind: 'payment_refunded',
      reason: input.reason,
      after: { paymentId: row!.id, method: 'card', online: true, amountCents: refund.amount, providerReference: refund.id, refundOfPaymentId: charge.id },
    })
    return { row: row!, replayed: false }
  })
  return answer(result.row, result.replayed)
}
