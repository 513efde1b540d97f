import { and, eq, sql } from 'drizzle-orm'
import Stripe from 'stripe'
import type { Executor } from '@db/client'
import { payments } from '@db/schema'
import { formatCents } from '@shared/domain/billing'
import type { CardRefund, CardRefundAnswer } from '@shared/schemas/card-payments'
import type { User } from '@shared/schemas/users'
import { invoiceOf, paymentRecord, refusal } from '../billing/index'
import { AppError, said } from '../errors'
import { vehicleForUser, type VehicleChanges } from '../vehicles/index'
import { notePendingRefund, recordRefund, refundByKey, refundRequestHash, type PaymentRow, type RefundAsked } from './card-refund-records'
import { unavailable, type CardPayments } from './card-payments.service'
import { cardReasonOf, cardReasonOfError } from './service-reasons'


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
 * on the bill until the service says the refund succeeded; then, in the vehicle's one change, a refund
 * row naming the service's refund and the payment it gives back on, and its `payment_refunded` event.
 * A refund the service takes as pending (a bank can take days) is noted in the history as sent and
 * answered 202; the service's `refund.updated` webhook records it when it ends (`receiveRefundEvent`).
 * The client's idempotency key makes a retry or a double click refund once: the same key answers the
 * refund it made, and the service is sent the same key (`holdfast-refund-<vehicle>-<key>`) so it also
 * refunds once. Never more than is left unrefunded on that one payment, refused before the service is asked.
 */
export async function refundCard(changes: VehicleChanges, cards: CardPayments | undefined, actor: User, vehicleId: string, input: CardRefund): Promise<{ status: 201 | 202; answer: CardRefundAnswer }> {
  const { db } = changes
  const requestHash = refundRequestHash(input)
  const invoice = async () => {
    const { vehicle, yard } = await vehicleForUser(db, actor.id, vehicleId)
    return invoiceOf(db, vehicle, yard)
  }
  const answer = async (payment: PaymentRow, replayed: boolean) => {
    if (payment.requestHash !== requestHash) {
      throw refusal(409, 'idempotencyKey', 'This refund key was already used for a different refund. Reload the page and try again.', said('refundKeyUsed'))
    }
    return { status: 201 as const, answer: { payment: paymentRecord(payment, actor.name), replayed, invoice: await invoice() } }
  }
  await vehicleForUser(db, actor.id, vehicleId)
  const earlier = await refundByKey(db, vehicleId, input.idempotencyKey)
  if (earlier) return answer(earlier, true)
  if (!cards) throw unavailable()
  const { charge, leftCents } = await chargeOf(db, vehicleId, input.paymentId)
  if (input.amountCents > leftCents) throw overRefund(leftCents)

  const asked: RefundAsked = { paymentId: charge.id, idempotencyKey: input.idempotencyKey, reason: input.reason }
  let refund: Stripe.Refund
  try {
    refund = await cards.stripe.refunds.create(
      {
        payment_intent: charge.providerReference!,
        amount: input.amountCents,
        reason: 'requested_by_customer',
        // What the webhook needs to record the refund as asked, should it end later: ids, the key and the reason as typed; no owner details.
        metadata: { holdfast: '1', vehicleId, paymentId: charge.id, actorId: actor.id, idempotencyKey: input.idempotencyKey, reason: input.reason },
      },
      { idempotencyKey: `holdfast-refund-${vehicleId}-${input.idempotencyKey}` },
    )
    // A retry is answered with the service's first answer: ask it how the refund stands now.
    if (refund.status === 'pending') refund = await cards.stripe.refunds.retrieve(refund.id)
  } catch (err) {
    const cardReason = cardReasonOfError(err)
    if (err instanceof Stripe.errors.StripeInvalidRequestError && err.param === 'amount') throw refusal(400, 'amountCents', `The card payment service refuses: ${err.message}`, said('cardRefundRefused', { cardReason }))
    const message = err instanceof Stripe.errors.StripeError ? err.message : 'no answer'
    throw new AppError(502, `The card payment service did not refund it: ${message}. Nothing was recorded; try again.`, said('cardRefundNotMade', { cardReason }))
  }
  if (refund.status === 'succeeded') {
    const recorded = await recordRefund(changes, actor, vehicleId, refund, asked)
    return answer(recorded.row, recorded.replayed)
  }
  if (refund.status === 'pending' || refund.status === 'requires_action') {
    await notePendingRefund(changes, actor, vehicleId, refund, asked)
    return { status: 202, answer: { pending: { providerReference: refund.id, amountCents: refund.amount }, invoice: await invoice() } }
  }
  const status = refund.status ?? 'unknown'
  throw new AppError(502, `The card payment service could not give this refund back (${status}). Nothing was recorded; check the card payment and try again.`, said('refundFailed', { cardReason: cardReasonOf(refund.failure_reason, refund.status) }))
}
