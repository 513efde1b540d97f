import { and, eq } from 'drizzle-orm'
import { chargeAdjustments } from '@db/schema'
import { formatCents } from '@shared/domain/billing'
import type { Adjustment, AdjustmentRecord, Invoice } from '@shared/schemas/billing'
import type { User } from '@shared/schemas/users'
import { conflict, forbidden, notFound, said } from '../errors'
import { changeVehicle, vehicleForUser, type VehicleChanges } from '../vehicles/index'
import { adjustmentsOf, approvalLimitOf } from './billing.queries'
import { invoiceOf } from './invoice.service'
import { refusal } from './refusal'

const tooMuch = (dueCents: number) => {
  const owed = Math.max(0, dueCents)
  return refusal(400, 'amountCents', `That is more than is owed: ${formatCents(owed)} is due.`, said('moreThanOwed', { dueCents: owed }))
}

async function answer(changes: VehicleChanges, actor: User, vehicleId: string, adjustmentId: string): Promise<{ adjustment: AdjustmentRecord; invoice: Invoice }> {
  const { vehicle, yard } = await vehicleForUser(changes.db, actor.id, vehicleId)
  const invoice = await invoiceOf(changes.db, vehicle, yard)
  return { adjustment: invoice.adjustments.find((a) => a.id === adjustmentId)!, invoice }
}

/**
 * A manager waives or discounts part of the bill, with the reason, in the history. Up to the
 * company's limit it counts at once; above it, it waits for a second manager's approval.
 */
export async function adjustCharges(changes: VehicleChanges, actor: User, vehicleId: string, input: Adjustment) {
  const { result: id } = await changeVehicle(changes, actor, vehicleId, async ({ tx, vehicle, yard, record }) => {
    if (vehicle.state === 'closed') throw conflict('This vehicle has left the yard: its bill is closed.', said('closedBill'))
    const invoice = await invoiceOf(tx, vehicle, yard)
    if (input.amountCents > invoice.dueCents) throw tooMuch(invoice.dueCents)
    const limit = await approvalLimitOf(tx, yard.id)
    const status = input.amountCents > limit ? 'pending' : 'approved'
    const [row] = await tx
      .insert(chargeAdjustments)
      .values({ vehicleId, kind: input.kind, amountCents: input.amountCents, reason: input.reason, status, requestedById: actor.id, ...(status === 'approved' ? { decidedById: actor.id, decidedAt: new Date() } : {}) })
      .returning({ id: chargeAdjustments.id })
    const after = { adjustmentId: row!.id, kind: input.kind, amountCents: input.amountCents, ...(status === 'pending' ? { approvalLimitCents: limit } : {}) }
    record({ kind: status === 'approved' ? 'charges_adjusted' : 'adjustment_requested', reason: input.reason, after })
    return row!.id
  })
  return answer(changes, actor, vehicleId, id)
}

/** A second manager approves (or declines) a waiting waiver or discount; the one who asked cannot. */
export async function decideAdjustment(changes: VehicleChanges, actor: User, vehicleId: string, adjustmentId: string, decision: { approve: true } | { approve: false; reason: string }) {
  await changeVehicle(changes, actor, vehicleId, async ({ tx, vehicle, yard, record }) => {
    const [row] = await tx.select().from(chargeAdjustments).where(and(eq(chargeAdjustments.id, adjustmentId), eq(chargeAdjustments.vehicleId, vehicleId)))
    if (!row) throw notFound('That waiver or discount')
    if (row.status !== 'pending') throw conflict(`This ${row.kind} was already ${row.status}.`, said('adjustmentDecided'))
    if (row.requestedById === actor.id) throw forbidden('A second manager decides: the manager who asked for it cannot approve or decline it.', 'secondManager')
    const now = new Date()
    if (decision.approve) {
      if (vehicle.state === 'closed') throw conflict('This vehicle has left the yard: its bill is closed.', said('closedBill'))
      const invoice = await invoiceOf(tx, vehicle, yard)
      if (row.amountCents > invoice.dueCents) throw tooMuch(invoice.dueCents)
      await tx.update(chargeAdjustments).set({ status: 'approved', decidedById: actor.id, decidedAt: now }).where(eq(chargeAdjustments.id, adjustmentId))
      const requested = (await adjustmentsOf(tx, vehicleId)).find((a) => a.id === adjustmentId)!
      record({ kind: 'charges_adjusted', reason: row.reason, after: { adjustmentId, kind: row.kind, amountCents: row.amountCents, requestedBy: requested.requestedBy } })
    } else {
      await tx.update(chargeAdjustments).set({ status: 'declined', decidedById: actor.id, decidedAt: now, declineReason: decision.reason }).where(eq(chargeAdjustments.id, adjustmentId))
      record({ kind: 'adjustment_declined', reason: decision.reason, before: { adjustmentId, kind: row.kind, amountCents: row.amountCents } })
    }
  })
  return answer(changes, actor, vehicleId, adjustmentId)
}
