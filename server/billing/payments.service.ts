import { createHash } from 'node:crypto'
import { payments } from '@db/schema'
import { cashChange, formatCents } from '@shared/domain/billing'
import type { Payment, PaymentAnswer } from '@shared/schemas/billing'
import type { Refund } from '@shared/schemas/billing'
import type { User } from '@shared/schemas/users'
import { AppError, fieldIssue, said } from '../errors'
import { changeVehicle, vehicleForUser, type VehicleChanges } from '../vehicles/index'
import { paymentByKey, paymentRecord, type PaymentRow } from './billing.queries'
import { invoiceOf, withMovement } from './invoice.service'
import { queueReceipt, type ReceiptMail } from './receipt-mail'
import { refusal } from './refusal'

const hashOf = (fields: Record<string, unknown>) => createHash('sha256').update(JSON.stringify(fields)).digest('hex')


/** The same key again: the payment it recorded, or a refusal if the key now asks for something else. */
function replay(existing: PaymentRow, requestHash: string, takenBy: string) {
  if (existing.requestHash !== requestHash) {
    throw refusal(409, 'idempotencyKey', 'This payment key was already used for a different payment. Reload the page and try again.', said('paymentKeyUsed'))
  }
  return paymentRecord(existing, takenBy)
}

/**
 * Takes a payment at the counter: cash (with the change given), check or card at the terminal. The
 * idempotency key makes a retry or a second tap record it once; the vehicle's lock makes two at once
 * wait for each other, so neither can pay more than is due. A receipt goes by e-mail when an address
 * was typed (the contact's own address, once contacts exist, is the seam in receipt-mail.ts).
 */
export async function takePayment(changes: VehicleChanges, actor: User, vehicleId: string, input: Payment, mail: ReceiptMail): Promise<PaymentAnswer> {
  const requestHash = hashOf({ kind: 'payment', method: input.method, amountCents: input.amountCents, tenderedCents: input.tenderedCents, checkNumber: input.checkNumber, terminalReference: input.terminalReference })
  const { result, changed } = await changeVehicle(changes, actor, vehicleId, async ({ tx, vehicle, yard, now, record }) => {
    const existing = await paymentByKey(tx, vehicleId, input.idempotencyKey)
    if (existing) return { payment: replay(existing, requestHash, actor.name), replayed: true, invoice: undefined }
    if (vehicle.state === 'closed') throw refusal(409, 'vehicleId', 'This vehicle has left the yard: its bill is closed and takes no more payments.', said('closedPayments'))
    const before = await invoiceOf(tx, vehicle, yard, now)
    if (before.dueCents <= 0) throw refusal(400, 'amountCents', 'Nothing is due on this vehicle.', said('nothingDue'))
    if (input.amountCents > before.dueCents) {
      throw refusal(400, 'amountCents', `That is more than is due: ${formatCents(before.dueCents)} is due. Take at most that.`, said('moreThanDue', { dueCents: before.dueCents }))
    }
    const cash = input.method === 'cash'
    const tenderedCents = cash ? (input.tenderedCents ?? input.amountCents) : null
    const changeCents = cash ? cashChange(input.amountCents, tenderedCents!) : null
    if (cash && changeCents === null) throw refusal(400, 'tenderedCents', 'The cash handed over is less than the amount paid.', said('cashShort'))
    const [row] = await tx
      .insert(payments)
      .values({
        vehicleId,
        kind: 'payment',
        method: input.method,
        amountCents: input.amountCents,
        tenderedCents,
        changeCents,
        checkNumber: input.method === 'check' ? input.checkNumber : null,
        terminalReference: input.method === 'card' ? input.terminalReference : null,
        idempotencyKey: input.idempotencyKey,
        requestHash,
        dueBeforeCents: before.dueCents,
        receiptEmail: input.receiptEmail,
        takenById: actor.id,
        takenAt: now,
      })
      .returning()
    const payment = paymentRecord(row!, actor.name)
    // Only what this kind of payment has: a cash payment names its change, a check its number.
    const specific = { changeCents: payment.changeCents || null, checkNumber: payment.checkNumber, terminalReference: payment.terminalReference }
    record({
      kind: 'payment_taken',
      after: {
        paymentId: payment.id,
        method: payment.method,
        amountCents: payment.amountCents,
        ...Object.fromEntries(Object.entries(specific).filter(([, v]) => v !== null)),
        dueBeforeCents: before.dueCents,
        dueAfterCents: before.dueCents - payment.amountCents,
      },
    })
    await queueReceipt(tx, { actor, vehicle, yard, payment, to: input.receiptEmail, language: input.receiptLanguage, dueAfterCents: before.dueCents - payment.amountCents })
    return { payment, replayed: false, invoice: withMovement(before, payment) }
  })
  if (changed && result.payment.receiptEmail) mail.kick?.()
  return answer(changes, actor, vehicleId, result)
}

/** Money given back by a manager, with the reason; never more than was paid and not yet refunded. */
export async function refund(changes: VehicleChanges, actor: User, vehicleId: string, input: Refund): Promise<PaymentAnswer> {
  const requestHash = hashOf({ kind: 'refund', method: input.method, amountCents: input.amountCents, reason: input.reason })
  const { result } = await changeVehicle(changes, actor, vehicleId, async ({ tx, vehicle, yard, record }) => {
    const existing = await paymentByKey(tx, vehicleId, input.idempotencyKey)
    if (existing) return { payment: replay(existing, requestHash, actor.name), replayed: true, invoice: undefined }
    const before = await invoiceOf(tx, vehicle, yard)
    if (input.amountCents > before.netPaidCents) {
      const paidCents = before.netPaidCents
      throw new AppError(
        400,
        `A refund cannot be more than was paid: ${formatCents(paidCents)} was paid and not yet refunded.`,
        said('refundMoreThanPaid', { paidCents }, { issues: [fieldIssue('amountCents', 'billing.refundAtMost', `At most ${formatCents(paidCents)} can be refunded.`, { paidCents })] }),
      )
    }
    if (input.method === 'check' && !input.checkNumber) throw refusal(400, 'checkNumber', 'Enter the number of the check you give back.', said('checkNumberBack'))
    const [row] = await tx
      .insert(payments)
      .values({
        vehicleId,
        kind: 'refund',
        method: input.method,
        amountCents: input.amountCents,
        checkNumber: input.method === 'check' ? input.checkNumber : null,
        terminalReference: input.method === 'card' ? input.terminalReference : null,
        reason: input.reason,
        idempotencyKey: input.idempotencyKey,
        requestHash,
        dueBeforeCents: before.dueCents,
        takenById: actor.id,
      })
      .returning()
    const payment = paymentRecord(row!, actor.name)
    const specific = { checkNumber: payment.checkNumber, terminalReference: payment.terminalReference }
    record({
      kind: 'payment_refunded',
      reason: input.reason,
      after: { paymentId: payment.id, method: payment.method, amountCents: payment.amountCents, ...Object.fromEntries(Object.entries(specific).filter(([, v]) => v !== null)) },
    })
    return { payment, replayed: false, invoice: withMovement(before, payment) }
  })
  return answer(changes, actor, vehicleId, result)
}

/** The answer: the invoice the change worked out, or — for a replayed key, which read none — the bill as it is now. */
async function answer(changes: VehicleChanges, actor: User, vehicleId: string, result: { payment: PaymentAnswer['payment']; replayed: boolean; invoice: PaymentAnswer['invoice'] | undefined }): Promise<PaymentAnswer> {
  const { payment, replayed } = result
  if (result.invoice) return { payment, replayed, invoice: result.invoice }
  const { vehicle, yard } = await vehicleForUser(changes.db, actor.id, vehicleId)
  return { payment, replayed, invoice: await invoiceOf(changes.db, vehicle, yard) }
}
