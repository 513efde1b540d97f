import { eq } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { titleTransfers } from '@db/schema'
import { odometerDisclosure, type OdometerDecision } from '@shared/domain/vehicle'
import type { TransferRecord } from '@shared/schemas/transfers'

export type TransferRow = typeof titleTransfers.$inferSelect

export async function transferOf(db: Executor, vehicleId: string): Promise<TransferRow | undefined> {
  const [row] = await db.select().from(titleTransfers).where(eq(titleTransfers.vehicleId, vehicleId))
  return row
}

/**
 * 49 CFR 580.17 for this transfer, by the shared rule. A vehicle whose model year is not on record
 * gets the statement: the exemptions all need a fact the yard has not shown, and disclosing costs nothing.
 */
export function odometerRule(modelYear: number | null, t: { gvwrLb: number | null; selfPropelled: boolean; date: string }): OdometerDecision {
  if (modelYear === null) {
    if (!t.selfPropelled) return odometerDisclosure(2000, t.gvwrLb ?? 0, false, t.date)
    if (t.gvwrLb !== null && t.gvwrLb > 16_000) return odometerDisclosure(2000, t.gvwrLb, true, t.date)
    return { required: true, clause: '49 CFR 580.5', reason: 'Disclose the mileage: the model year is not recorded, so no exemption of 580.17(a)(3)–(4) can be shown.' }
  }
  return odometerDisclosure(modelYear, t.gvwrLb ?? 0, t.selfPropelled, t.date)
}

export function transferRecord(row: TransferRow, modelYear: number | null): TransferRecord {
  return {
    id: row.id,
    kind: row.kind,
    sellerName: row.sellerName,
    buyerKind: row.buyerKind,
    buyerName: row.buyerName,
    buyerAddress: row.buyerAddress,
    buyerIdType: row.buyerIdType,
    buyerIdNumber: row.buyerIdNumber,
    priceCents: row.priceCents,
    date: row.saleDate,
    odometer: row.odometer,
    odometerUnreadable: row.odometerUnreadable,
    gvwrLb: row.gvwrLb,
    selfPropelled: row.selfPropelled,
    proceeds:
      row.dueCents !== null && row.appliedCents !== null && row.surplusCents !== null && row.shortfallCents !== null
        ? { dueCents: row.dueCents, appliedCents: row.appliedCents, surplusCents: row.surplusCents, shortfallCents: row.shortfallCents }
        : null,
    odometerDisclosure: odometerRule(modelYear, { gvwrLb: row.gvwrLb, selfPropelled: row.selfPropelled, date: row.saleDate }),
    signerName: row.signerName,
    signedAt: row.signedAt?.toISOString() ?? null,
    recordedAt: row.updatedAt.toISOString(),
  }
}
