import { createHash } from 'node:crypto'
import { and, eq, sql } from 'drizzle-orm'
import type Stripe from 'stripe'
import type { Executor } from '@db/client'
import { historyEvents, payments } from '@db/schema'
import type { User } from '@shared/schemas/users'
import { invoiceOf } from '../billing/index'
import { changeVehicle, type VehicleChanges } from '../vehicles/index'

// What a card refund writes on the vehicle, from the manager's request or from the service's webhook
// when a refund it took as pending ends: each in the vehicle's one change, with its history event.

export type PaymentRow = typeof payments.$inferSelect

/** What the manager asked for, carried in the refund's metadata so the webhook can record it as asked. */
export interface RefundAsked {
  paymentId: string
  idempotencyKey: string
  reason: string
}

export const refundRequestHash = (asked: { paymentId: string; amountCents: number; reason: string }) =>
  createHash('sha256').update(JSON.stringify({ kind: 'card-refund', paymentId: asked.paymentId, amountCents: asked.amountCents, reason: asked.reason })).digest('hex')

export const refundByKey = async (db: Executor, vehicleId: string, key: string) =>
  (await db.select().from(payments).where(and(eq(payments.vehicleId, vehicleId), eq(payments.idempotencyKey, key))))[0]

const refundByReference = async (db: Executor, reference: string) => (await db.select().from(payments).where(and(eq(payments.kind, 'refund'), eq(payments.providerReference, reference))))[0]

/** Whether the vehicle's history already has an event of this kind for this service refund. */
async function noted(db: Executor, vehicleId: string, kind: 'refund_pending' | 'refund_failed', reference: string) {
  const [row] = await db
    .select({ seq: historyEvents.seq })
    .from(historyEvents)
    .where(and(eq(historyEvents.vehicleId, vehicleId), eq(historyEvents.kind, kind), sql`${historyEvents.after}->>'providerReference' = ${reference}`))
  return row !== undefined
}

/** The refund the service has confirmed: one refund row naming it, and its `payment_refunded` event — once, whichever path comes first. */
export async function recordRefund(changes: VehicleChanges, actor: User, vehicleId: string, refund: Stripe.Refund, asked: RefundAsked): Promise<{ row: PaymentRow; replayed: boolean }> {
  const { result } = await changeVehicle(changes, actor, vehicleId, async ({ tx, vehicle, yard, record }) => {
    const again = (await refundByKey(tx, vehicleId, asked.idempotencyKey)) ?? (await refundByReference(tx, refund.id))
    if (again) return { row: again, replayed: true }
    const before = await invoiceOf(tx, vehicle, yard)
    const [row] = await tx
      .insert(payments)
      .values({
        vehicleId,
        kind: 'refund',
        method: 'card',
        amountCents: refund.amount,
        reason: asked.reason,
        idempotencyKey: asked.idempotencyKey,
        requestHash: refundRequestHash({ paymentId: asked.paymentId, amountCents: refund.amount, reason: asked.reason }),
        dueBeforeCents: before.dueCents,
        providerReference: refund.id,
        refundOfPaymentId: asked.paymentId,
        takenById: actor.id,
      })
      .returning()
    record({
      kind: 'payment_refunded',
      reason: asked.reason,
      after: { paymentId: row!.id, method: 'card', online: true, amountCents: refund.amount, providerReference: refund.id, refundOfPaymentId: asked.paymentId },
    })
    return { row: row!, replayed: false }
  })
  return result
}

/** The service took the refund but has not finished it: nothing on the bill, a `refund_pending` event (once) so the office sees it was sent. */
export async function notePendingRefund(changes: VehicleChanges, actor: User, vehicleId: string, refund: Stripe.Refund, asked: RefundAsked): Promise<void> {
  await changeVehicle(changes, actor, vehicleId, async ({ tx, record }) => {
    if (await noted(tx, vehicleId, 'refund_pending', refund.id)) return
    record({ kind: 'refund_pending', reason: asked.reason, after: { paymentId: asked.paymentId, method: 'card', amountCents: refund.amount, providerReference: refund.id } })
  })
}

/** A pending refund the service could not finish: nothing on the bill, a `refund_failed` event (once) for the office to act on. */
export async function noteFailedRefund(changes: VehicleChanges, actor: User, vehicleId: string, refund: Stripe.Refund, asked: RefundAsked): Promise<boolean> {
  const { result } = await changeVehicle(changes, actor, vehicleId, async ({ tx, record }) => {
    if (await noted(tx, vehicleId, 'refund_failed', refund.id)) return false
    record({
      kind: 'refund_failed',
      reason: asked.reason,
      after: { paymentId: asked.paymentId, method: 'card', amountCents: refund.amount, providerReference: refund.id, failureReason: refund.failure_reason ?? (refund.status === 'canceled' ? 'canceled' : 'unknown') },
    })
    return true
  })
  return result
}

/**
 * The service's word on a refund it had taken as pending (`refund.updated`): succeeded → recorded as the
 * manager asked (once, whether their retry or this came first); failed or canceled → a `refund_failed`
 * event; still pending → nothing. A refund Holdfast did not ask for is ignored.
 */
export async function receiveRefundEvent(changes: VehicleChanges, refund: Stripe.Refund, staffOf: (db: Executor, userId: string) => Promise<User>): Promise<string> {
  const m = refund.metadata ?? {}
  if (m.holdfast !== '1' || !m.vehicleId || !m.paymentId || !m.actorId || !m.idempotencyKey || !m.reason) return 'ignored'
  const asked: RefundAsked = { paymentId: m.paymentId, idempotencyKey: m.idempotencyKey, reason: m.reason }
  const actor = await staffOf(changes.db, m.actorId)
  if (refund.status === 'succeeded') return (await recordRefund(changes, actor, m.vehicleId, refund, asked)).replayed ? 'replayed' : 'refunded'
  if (refund.status === 'failed' || refund.status === 'canceled') return (await noteFailedRefund(changes, actor, m.vehicleId, refund, asked)) ? 'refund-failed' : 'replayed'
  return 'pending'
}
