import { and, asc, eq, inArray, sql } from 'drizzle-orm'
import { alias } from 'drizzle-orm/pg-core'
import type { Executor } from '@db/client'
import { chargeAdjustments, companies, payments, titleTransfers, users, yards } from '@db/schema'
import type { AdjustmentRecord, PaymentRecord } from '@shared/schemas/billing'

export type PaymentRow = typeof payments.$inferSelect
export type AdjustmentRow = typeof chargeAdjustments.$inferSelect

export const paymentRecord = (p: PaymentRow, takenBy: string): PaymentRecord => ({
  id: p.id,
  kind: p.kind,
  method: p.method,
  amountCents: p.amountCents,
  tenderedCents: p.tenderedCents,
  changeCents: p.changeCents,
  checkNumber: p.checkNumber,
  terminalReference: p.terminalReference,
  reason: p.reason,
  receiptEmail: p.receiptEmail,
  providerReference: p.providerReference,
  refundOfPaymentId: p.refundOfPaymentId,
  takenBy,
  takenAt: p.takenAt.toISOString(),
})

/** Who a payment names when no staff member took it: the owner paid by card from their page. */
export const OWNER_ONLINE = 'Owner, online'

/** A lien sale recorded on the vehicle (its day and how its price was applied), if any. */
export async function lienSaleOf(db: Executor, vehicleId: string) {
  const [row] = await db
    .select({ saleDate: titleTransfers.saleDate, priceCents: titleTransfers.priceCents, appliedCents: titleTransfers.appliedCents, surplusCents: titleTransfers.surplusCents, shortfallCents: titleTransfers.shortfallCents })
    .from(titleTransfers)
    .where(and(eq(titleTransfers.vehicleId, vehicleId), eq(titleTransfers.kind, 'lien_sale')))
  if (!row || row.appliedCents === null) return null
  return { saleDate: row.saleDate, priceCents: row.priceCents, appliedCents: row.appliedCents, surplusCents: row.surplusCents ?? 0, shortfallCents: row.shortfallCents ?? 0 }
}

/** A vehicle's payments and refunds, oldest first, with who took each. */
export async function paymentsOf(db: Executor, vehicleId: string): Promise<PaymentRecord[]> {
  const rows = await db
    .select({ p: payments, by: users.name })
    .from(payments)
    .leftJoin(users, eq(users.id, payments.takenById))
    .where(eq(payments.vehicleId, vehicleId))
    .orderBy(asc(payments.takenAt), asc(payments.id))
  return rows.map((r) => paymentRecord(r.p, r.by ?? OWNER_ONLINE))
}

const decider = alias(users, 'decider')

/** A vehicle's waivers and discounts, oldest first, with who asked and who decided. */
export async function adjustmentsOf(db: Executor, vehicleId: string): Promise<AdjustmentRecord[]> {
  const rows = await db
    .select({ a: chargeAdjustments, by: users.name, decidedBy: decider.name })
    .from(chargeAdjustments)
    .innerJoin(users, eq(users.id, chargeAdjustments.requestedById))
    .leftJoin(decider, eq(decider.id, chargeAdjustments.decidedById))
    .where(eq(chargeAdjustments.vehicleId, vehicleId))
    .orderBy(asc(chargeAdjustments.requestedAt), asc(chargeAdjustments.id))
  return rows.map(({ a, by, decidedBy }) => ({
    id: a.id,
    kind: a.kind,
    amountCents: a.amountCents,
    reason: a.reason,
    status: a.status,
    requestedBy: by,
    requestedById: a.requestedById,
    requestedAt: a.requestedAt.toISOString(),
    decidedBy: decidedBy ?? null,
    decidedAt: a.decidedAt?.toISOString() ?? null,
    declineReason: a.declineReason,
  }))
}

export interface MoneyTotals {
  /** Payments less refunds. */
  paidCents: number
  /** Approved waivers and discounts. */
  creditedCents: number
}

/** What has been paid and credited toward each vehicle's bill, in two grouped queries. */
export async function moneyTotals(db: Executor, vehicleIds: readonly string[]): Promise<Map<string, MoneyTotals>> {
  const out = new Map<string, MoneyTotals>()
  if (vehicleIds.length === 0) return out
  const ids = [...vehicleIds]
  // One after the other: inside a transaction the two share one connection.
  const paid = await db
      .select({ vehicleId: payments.vehicleId, cents: sql<number>`sum(case when ${payments.kind} = 'payment' then ${payments.amountCents} else -${payments.amountCents} end)::int` })
      .from(payments)
      .where(inArray(payments.vehicleId, ids))
      .groupBy(payments.vehicleId)
  const credited = await db
      .select({ vehicleId: chargeAdjustments.vehicleId, cents: sql<number>`sum(${chargeAdjustments.amountCents})::int` })
      .from(chargeAdjustments)
      .where(and(inArray(chargeAdjustments.vehicleId, ids), eq(chargeAdjustments.status, 'approved')))
      .groupBy(chargeAdjustments.vehicleId)
  const totals = (id: string) => {
    let t = out.get(id)
    if (!t) out.set(id, (t = { paidCents: 0, creditedCents: 0 }))
    return t
  }
  for (const r of paid) totals(r.vehicleId).paidCents = Number(r.cents)
  for (const r of credited) totals(r.vehicleId).creditedCents = Number(r.cents)
  return out
}

export async function paymentByKey(db: Executor, vehicleId: string, idempotencyKey: string): Promise<PaymentRow | undefined> {
  const [row] = await db.select().from(payments).where(and(eq(payments.vehicleId, vehicleId), eq(payments.idempotencyKey, idempotencyKey)))
  return row
}

/** The amount above which a waiver or discount needs a second manager (companies.waiver_approval_limit_cents). */
export async function approvalLimitOf(db: Executor, yardId: string): Promise<number> {
  const [row] = await db.select({ cents: companies.waiverApprovalLimitCents }).from(companies).innerJoin(yards, eq(yards.companyId, companies.id)).where(eq(yards.id, yardId))
  return row?.cents ?? 10_000
}

/** What was owed just before a payment or refund, as stored with it (its receipt reprints the same). */
export async function dueBeforeOf(db: Executor, paymentId: string): Promise<number> {
  const [row] = await db.select({ cents: payments.dueBeforeCents }).from(payments).where(eq(payments.id, paymentId))
  return row?.cents ?? 0
}
