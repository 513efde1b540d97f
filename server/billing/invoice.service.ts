import type { Executor } from '@db/client'
import { invoiceCharges, settle } from '@shared/domain/billing'
import { dayFromIsoDate, startOfLocalDay } from '@shared/domain/time'
import type { Invoice, PaymentRecord } from '@shared/schemas/billing'
import { vehicleBill } from '../charges/index'
import { unprocessable, said } from '../errors'
import type { VehicleRow, YardRow } from '../vehicles/index'
import { adjustmentsOf, approvalLimitOf, lienSaleOf, paymentsOf } from './billing.queries'
import { ruleSetTitle } from '@shared/messages/rule-words'

/**
 * A vehicle's invoice: the tow, storage and fees from the core with tax per line, the approved
 * waivers and discounts, every payment and refund, and what is due. Charges run to `asOf` (now by
 * default); a vehicle that has left is billed to the moment it left, whatever `asOf` says.
 */
export async function invoiceOf(db: Executor, vehicle: VehicleRow, yard: YardRow, asOf = new Date()): Promise<Invoice> {
  const frozen = vehicle.closedAt !== null
  const lienSale = await lienSaleOf(db, vehicle.id)
  // Sold at lien sale: the owner owes storage to the end of the sale day, not beyond (the proceeds were
  // applied to what was owed then), so the bill and the transfer's record agree to the cent.
  const endOfSale = lienSale ? startOfLocalDay(yard.timeZone, dayFromIsoDate(lienSale.saleDate) + 1) : Infinity
  const at = new Date(Math.min((frozen ? vehicle.closedAt! : asOf).getTime(), endOfSale))
  const billed = await vehicleBill(db, yard, vehicle, at)
  if (!billed) throw unprocessable('No rule set bills this vehicle: give it a vehicle class its rule set knows, or give the yard a rule set.', said('noBilling'))
  const charges = invoiceCharges(billed.bill, billed.towCents)
  const payments = await paymentsOf(db, vehicle.id)
  const adjustments = await adjustmentsOf(db, vehicle.id)
  const s = settle(charges.totalCents, adjustments, payments)
  return {
    vehicleId: vehicle.id,
    stockNumber: vehicle.stockNumber,
    endsAt: billed.bill.endsAt,
    frozen,
    storageDays: billed.bill.days,
    ...charges,
    creditedCents: s.creditedCents,
    paidCents: s.paidCents,
    refundedCents: s.refundedCents,
    netPaidCents: s.netPaidCents,
    dueCents: s.dueCents,
    waived: s.waived,
    payments,
    adjustments,
    approvalLimitCents: await approvalLimitOf(db, yard.id),
    ruleSet: ruleSetTitle(billed.ruleSet),
    warnings: billed.bill.warnings,
    lienSale,
  }
}

/**
 * The invoice once one more payment or refund is recorded on it: the same charges and adjustments,
 * settled again with the new movement last (as `paymentsOf` orders them). A payment's answer comes
 * from the invoice its transaction already read, not from reading the bill a second time.
 */
export function withMovement(invoice: Invoice, movement: PaymentRecord): Invoice {
  const payments = [...invoice.payments, movement]
  const s = settle(invoice.totalCents, invoice.adjustments, payments)
  return { ...invoice, payments, creditedCents: s.creditedCents, paidCents: s.paidCents, refundedCents: s.refundedCents, netPaidCents: s.netPaidCents, dueCents: s.dueCents, waived: s.waived }
}
