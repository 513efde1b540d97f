import type { Executor } from '@db/client'
import { formatCents } from '@shared/domain/billing'
import type { PaymentRecord } from '@shared/schemas/billing'
import type { User } from '@shared/schemas/users'
import { receiptNumber, receiptPdf, type ReceiptInput } from '../documents/index'
import { queueMessage } from '../outbox/index'
import type { VehicleRow, YardRow } from '../vehicles/index'

/** What sending a receipt needs from the app: the outbox worker's nudge (createApp's kickOutbox). */
export interface ReceiptMail {
  kick?: () => void
}

export const receiptInput = (vehicle: VehicleRow, yard: YardRow, payment: PaymentRecord, dueBeforeCents: number): ReceiptInput => ({
  yard: { name: yard.name, address: yard.address, phone: yard.phone, timeZone: yard.timeZone },
  vehicle,
  payment,
  dueBeforeCents,
})

/**
 * Where a payment's receipt goes. Today only the address the clerk typed at the counter; once
 * contacts are recorded (issue 11's contacts work), fall back here to the owner contact's e-mail
 * and language — the one place to change.
 */
export function receiptRecipient(typed: string | null): string | null {
  return typed
}

const MAIL = {
  en: {
    subject: (stock: string) => `Your receipt for ${stock}`,
    text: (yard: string, stock: string, amount: string, number: string, due: string) =>
      `Thank you. ${yard} received ${amount} for vehicle ${stock} (receipt ${number}).\n` +
      `Still owed as of this payment: ${due}.\n\nThe receipt is attached as a PDF.\n`,
  },
  es: {
    subject: (stock: string) => `Su recibo de ${stock}`,
    text: (yard: string, stock: string, amount: string, number: string, due: string) =>
      `Gracias. ${yard} recibió ${amount} por el vehículo ${stock} (recibo ${number}).\n` +
      `Saldo pendiente a la fecha de este pago: ${due}.\n\nEl recibo va adjunto en PDF.\n`,
  },
}

/** Queues the receipt e-mail in the payment's own transaction, so both are kept or neither. */
export async function queueReceipt(
  tx: Executor,
  r: { actor: Pick<User, 'id'> | { id: null }; vehicle: VehicleRow; yard: YardRow; payment: PaymentRecord; to: string | null; language: 'en' | 'es'; dueAfterCents: number },
): Promise<boolean> {
  const to = receiptRecipient(r.to)
  if (!to) return false
  const words = MAIL[r.language]
  const number = receiptNumber(r.payment.id)
  const pdf = await receiptPdf(receiptInput(r.vehicle, r.yard, r.payment, r.dueAfterCents + r.payment.amountCents), r.language)
  await queueMessage(tx, r.yard.companyId, r.actor.id, {
    to,
    subject: words.subject(r.vehicle.stockNumber),
    text: words.text(r.yard.name, r.vehicle.stockNumber, formatCents(r.payment.amountCents), number, formatCents(Math.max(0, r.dueAfterCents))),
    language: r.language,
    purpose: 'receipt',
    vehicleId: r.vehicle.id,
    attachments: [{ filename: `receipt-${number}.pdf`, contentType: 'application/pdf', content: pdf }],
  })
  return true
}
