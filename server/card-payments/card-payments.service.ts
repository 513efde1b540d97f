import { createHash } from 'node:crypto'
import { and, eq } from 'drizzle-orm'
import Stripe from 'stripe'
import type { Database, Executor } from '@db/client'
import { cardCheckouts, cardWebhookEvents, payments, users } from '@db/schema'
import { formatCents } from '@shared/domain/billing'
import type { CardCheckout, CardCheckoutRequest } from '@shared/schemas/card-payments'
import type { User } from '@shared/schemas/users'
import { invoiceOf, OWNER_ONLINE, paymentRecord, queueReceipt, refusal, type ReceiptMail } from '../billing/index'
import { AppError, fieldIssue, said } from '../errors'
import type { FieldCode } from '@shared/schemas/field-messages'
import { receiveRefundEvent } from './card-refund-records'
import { cardReasonOfError } from './service-reasons'
import { changeVehicle, changeVehicleAsOwner, vehicleById, vehicleForUser, type OwnerWork, type VehicleChanges } from '../vehicles/index'

/**
 * The card payment service, through its official SDK only: the local fake (server/fakes/payment-service.ts)
 * by default and in tests, the real service when a key is configured — the same code either way.
 */
export interface CardPayments {
  stripe: Stripe
  webhookSecret: string
}

export function cardPaymentsClient(o: { secretKey: string; webhookSecret: string; host?: string; port?: number; protocol?: 'http' | 'https' }): CardPayments {
  const stripe = new Stripe(o.secretKey, {
    ...(o.host ? { host: o.host, port: o.port, protocol: o.protocol ?? 'http' } : {}),
    telemetry: false,
    maxNetworkRetries: 0,
    appInfo: { name: 'Holdfast' },
  })
  return { stripe, webhookSecret: o.webhookSecret }
}

/** How long a hosted card page stays open (the real service allows 30 minutes to 24 hours). */
const CHECKOUT_MINUTES = 60

export type CheckoutRow = typeof cardCheckouts.$inferSelect


export const unavailable = () => new AppError(503, 'Card payments are not set up on this server. Take the card at the counter terminal instead.', said('cardsUnavailable'))

const hashOf = (fields: Record<string, unknown>) => createHash('sha256').update(JSON.stringify(fields)).digest('hex')

export const checkoutAnswer = (row: CheckoutRow, replayed = false): CardCheckout => ({
  id: row.id,
  status: row.status,
  amountCents: row.amountCents,
  url: row.status === 'open' ? row.url : null,
  expiresAt: row.expiresAt.toISOString(),
  paymentId: row.paymentId,
  refusal: row.refusal,
  replayed,
})

async function checkoutByKey(db: Executor, vehicleId: string, idempotencyKey: string) {
  const [row] = await db.select().from(cardCheckouts).where(and(eq(cardCheckouts.vehicleId, vehicleId), eq(cardCheckouts.idempotencyKey, idempotencyKey)))
  return row
}

export type Payer = { kind: 'staff'; actor: User } | { kind: 'owner'; linkId: string }

/**
 * Opens the payment service's hosted page for all that is due or (at the counter) a part of it. The
 * client's idempotency key makes a retry or a double click open the same page, here and at the service
 * (its own Idempotency-Key). Nothing is paid or written on the vehicle until the signed webhook says so.
 */
export async function startCheckout(
  db: Database,
  cards: CardPayments | undefined,
  payer: Payer,
  vehicleId: string,
  input: CardCheckoutRequest,
  urls: { success: string; cancel: string },
): Promise<CardCheckout> {
  if (!cards) throw unavailable()
  const { vehicle, yard } = payer.kind === 'staff' ? await vehicleForUser(db, payer.actor.id, vehicleId) : await vehicleById(db, vehicleId)
  const requestHash = hashOf({ amountCents: input.amountCents, by: payer.kind === 'staff' ? payer.actor.id : payer.linkId })
  const existing = await checkoutByKey(db, vehicleId, input.idempotencyKey)
  if (existing) {
    if (existing.requestHash !== requestHash) throw refusal(409, 'idempotencyKey', 'This payment key was already used for a different payment. Reload the page and try again.', said('paymentKeyUsed'))
    return checkoutAnswer(existing, true)
  }
  if (vehicle.state === 'closed') throw refusal(409, 'vehicleId', 'This vehicle has left the yard: its bill is closed and takes no more payments.', said('closedPayments'))
  const { dueCents } = await invoiceOf(db, vehicle, yard)
  if (dueCents <= 0) throw refusal(400, 'amountCents', 'Nothing is due on this vehicle.', said('nothingDue'))
  const amountCents = input.amountCents ?? dueCents
  if (amountCents > dueCents) throw refusal(400, 'amountCents', `That is more than is due: ${formatCents(dueCents)} is due. Take at most that.`, said('moreThanDue', { dueCents }))
  if (amountCents < 50) throw refusal(400, 'amountCents', 'A card payment must be at least $0.50: take the rest in cash.', said('cardMinimum'))

  let session: Stripe.Checkout.Session
  try {
    session = await cards.stripe.checkout.sessions.create(
      {
        mode: 'payment',
        line_items: [
          {
            quantity: 1,
            price_data: {
              currency: 'usd',
              unit_amount: amountCents,
              product_data: { name: `${yard.name}: ${vehicle.stockNumber} ${[vehicle.year, vehicle.make, vehicle.model].filter(Boolean).join(' ')}`.trim() },
            },
          },
        ],
        client_reference_id: vehicle.id,
        metadata: { holdfast: '1', vehicleId: vehicle.id },
        locale: input.language,
        ...(input.receiptEmail ? { customer_email: input.receiptEmail } : {}),
        success_url: urls.success,
        cancel_url: urls.cancel,
        expires_at: Math.floor(Date.now() / 1000) + CHECKOUT_MINUTES * 60,
      },
      { idempotencyKey: `holdfast-checkout-${vehicle.id}-${input.idempotencyKey}` },
    )
  } catch (err) {
    const message = err instanceof Stripe.errors.StripeError ? err.message : 'no answer'
    throw new AppError(502, `The card payment service refused to open a payment page: ${message}`, said('cardPageRefused', { cardReason: cardReasonOfError(err) }))
  }
  if (!session.url) throw new AppError(502, 'The card payment service opened no payment page. Try again.', said('cardPageMissing'))
  await db
    .insert(cardCheckouts)
    .values({
      vehicleId: vehicle.id,
      sessionId: session.id,
      amountCents,
      idempotencyKey: input.idempotencyKey,
      requestHash,
      startedById: payer.kind === 'staff' ? payer.actor.id : null,
      ownerLinkId: payer.kind === 'owner' ? payer.linkId : null,
      receiptEmail: input.receiptEmail,
      receiptLanguage: input.language,
      url: session.url,
      expiresAt: new Date(session.expires_at * 1000),
    })
    // Two taps at once: the service gave both the same session; the second insert finds the first.
    .onConflictDoNothing()
  return checkoutAnswer((await checkoutByKey(db, vehicle.id, input.idempotencyKey))!, false)
}

export async function checkoutOf(db: Executor, vehicleId: string, checkoutId: string): Promise<CheckoutRow | undefined> {
  const [row] = await db.select().from(cardCheckouts).where(and(eq(cardCheckouts.vehicleId, vehicleId), eq(cardCheckouts.id, checkoutId)))
  return row
}

/** The counter gives up on an open hosted page (the customer paid another way): the service closes it. */
export async function expireCheckout(db: Database, cards: CardPayments | undefined, row: CheckoutRow): Promise<CardCheckout> {
  if (!cards) throw unavailable()
  if (row.status !== 'open') return checkoutAnswer(row)
  try {
    await cards.stripe.checkout.sessions.expire(row.sessionId)
  } catch (err) {
    // Already paid or expired there: its webhook says which.
    if (!(err instanceof Stripe.errors.StripeInvalidRequestError)) throw new AppError(502, 'The card payment service did not answer. Try again.', said('cardServiceSilent'))
  }
  const session = await cards.stripe.checkout.sessions.retrieve(row.sessionId).catch(() => null)
  if (session?.status === 'expired') await db.update(cardCheckouts).set({ status: 'expired', completedAt: new Date() }).where(and(eq(cardCheckouts.id, row.id), eq(cardCheckouts.status, 'open')))
  return checkoutAnswer((await checkoutOf(db, row.vehicleId, row.id))!)
}

export interface WebhookAnswer {
  status: number
  body: { received: boolean; outcome?: string; error?: string }
}

/**
 * One webhook from the service. Its signature is checked against the raw bytes (forged → 400); each
 * event id is acted on once (a replay is answered, nothing more); a paid session becomes one payment
 * inside the vehicle's own change, with its history event and receipt. A paid session the bill cannot
 * take (the vehicle left, more than is due, the page had expired) is kept as refused, with the reason.
 */
export async function receiveWebhook(changes: VehicleChanges, cards: CardPayments | undefined, raw: Buffer, signature: string | undefined, mail: ReceiptMail): Promise<WebhookAnswer> {
  if (!cards) return { status: 503, body: { received: false, error: 'Card payments are not set up on this server.' } }
  // A refusal names what was wrong, as every 400 of the API does: here the signature header.
  const refused = (code: FieldCode, error: string) => ({ status: 400, body: { received: false, error, issues: [fieldIssue('stripe-signature', code, error)] } })
  if (!signature || !Buffer.isBuffer(raw)) return refused('cardPayments.webhookUnsigned', 'The webhook carries no signature.')
  let event: Stripe.Event
  try {
    event = cards.stripe.webhooks.constructEvent(raw, signature, cards.webhookSecret)
  } catch {
    return refused('cardPayments.webhookSignatureMismatch', 'The webhook signature does not match.')
  }
  const { db } = changes
  const seen = async () => (await db.select().from(cardWebhookEvents).where(eq(cardWebhookEvents.eventId, event.id)))[0]
  const already = await seen()
  if (already) return { status: 200, body: { received: true, outcome: `replayed:${already.outcome}` } }
  const note = (tx: Executor, outcome: string, sessionId: string | null) =>
    tx.insert(cardWebhookEvents).values({ eventId: event.id, type: event.type, sessionId, outcome }).onConflictDoNothing()

  if (event.type === 'refund.updated' || event.type === 'refund.failed') {
    const outcome = await receiveRefundEvent(changes, event.data.object, staffOf)
    await note(db, outcome, null)
    return { status: 200, body: { received: true, outcome } }
  }
  if (event.type !== 'checkout.session.completed' && event.type !== 'checkout.session.async_payment_succeeded' && event.type !== 'checkout.session.expired') {
    await note(db, 'ignored', null)
    return { status: 200, body: { received: true, outcome: 'ignored' } }
  }
  const session = event.data.object
  if (session.metadata?.holdfast !== '1') {
    await note(db, 'ignored', session.id)
    return { status: 200, body: { received: true, outcome: 'ignored' } }
  }
  const [row] = await db.select().from(cardCheckouts).where(eq(cardCheckouts.sessionId, session.id))
  // Not written yet (the event came before the page's own answer): not acknowledged, so the service sends it again.
  if (!row) return { status: 409, body: { received: false, error: 'This payment page is not known yet; send again.' } }

  if (event.type === 'checkout.session.expired') {
    // After a payment (events out of order) it changes nothing.
    await db.update(cardCheckouts).set({ status: 'expired', completedAt: new Date() }).where(and(eq(cardCheckouts.id, row.id), eq(cardCheckouts.status, 'open')))
    await note(db, 'expired', session.id)
    return { status: 200, body: { received: true, outcome: 'expired' } }
  }
  if (session.payment_status !== 'paid') {
    await note(db, 'not-paid', session.id)
    return { status: 200, body: { received: true, outcome: 'not-paid' } }
  }
  if (session.amount_total !== row.amountCents) {
    await refuse(db, row, `The service reports ${formatCents(session.amount_total ?? 0)} paid for a page opened for ${formatCents(row.amountCents)}.`)
    await note(db, 'refused', session.id)
    return { status: 200, body: { received: true, outcome: 'refused' } }
  }
  const reference = typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? session.id)
  const outcome = await recordPaid(changes, row, event.id, reference, mail)
  return { status: 200, body: { received: true, outcome } }
}

async function refuse(db: Executor, row: CheckoutRow, reason: string) {
  await db.update(cardCheckouts).set({ status: 'refused', refusal: reason, completedAt: new Date() }).where(and(eq(cardCheckouts.id, row.id), eq(cardCheckouts.status, row.status)))
}

async function staffOf(db: Executor, userId: string): Promise<User> {
  const [u] = await db.select({ id: users.id, email: users.email, name: users.name, role: users.role }).from(users).where(eq(users.id, userId))
  if (!u) throw new Error('The clerk who opened this card payment is not on record.')
  return u
}

/** The paid session as a payment, in the vehicle's change (locked), checked again there. */
async function recordPaid(changes: VehicleChanges, row: CheckoutRow, eventId: string, reference: string, mail: ReceiptMail): Promise<string> {
  const actor = row.startedById ? await staffOf(changes.db, row.startedById) : null
  type Outcome = { outcome: 'paid' | 'replayed' } | { outcome: 'refused'; reason: string }
  const work = async ({ tx, vehicle, yard, record }: OwnerWork): Promise<Outcome> => {
    const [locked] = await tx.select().from(cardCheckouts).where(eq(cardCheckouts.id, row.id)).for('update')
    const [seen] = await tx.select().from(cardWebhookEvents).where(eq(cardWebhookEvents.eventId, eventId))
    if (seen || locked!.status === 'paid') return { outcome: 'replayed' }
    if (locked!.status === 'expired') return { outcome: 'refused', reason: 'The payment page had expired before this payment came.' }
    if (vehicle.state === 'closed') return { outcome: 'refused', reason: 'The vehicle had left the yard: its bill was closed.' }
    const before = await invoiceOf(tx, vehicle, yard)
    if (row.amountCents > before.dueCents) return { outcome: 'refused', reason: `More than was due: ${formatCents(Math.max(0, before.dueCents))} was due when this payment came.` }
    const [p] = await tx
      .insert(payments)
      .values({
        vehicleId: vehicle.id,
        kind: 'payment',
        method: 'card',
        amountCents: row.amountCents,
        idempotencyKey: `card-checkout:${row.id}`,
        requestHash: hashOf({ kind: 'card-checkout', sessionId: row.sessionId }),
        dueBeforeCents: before.dueCents,
        receiptEmail: row.receiptEmail,
        providerReference: reference,
        takenById: row.startedById,
      })
      .returning()
    const payment = paymentRecord(p!, actor?.name ?? OWNER_ONLINE)
    await tx.update(cardCheckouts).set({ status: 'paid', paymentId: payment.id, completedAt: new Date() }).where(eq(cardCheckouts.id, row.id))
    await tx.insert(cardWebhookEvents).values({ eventId, type: 'checkout.session.completed', sessionId: row.sessionId, outcome: 'paid' })
    record({
      kind: 'payment_taken',
      after: {
        paymentId: payment.id,
        method: 'card',
        online: true,
        amountCents: payment.amountCents,
        providerReference: reference,
        dueBeforeCents: before.dueCents,
        dueAfterCents: before.dueCents - payment.amountCents,
      },
    })
    await queueReceipt(tx, { actor: { id: actor?.id ?? null }, vehicle, yard, payment, to: row.receiptEmail, language: row.receiptLanguage, dueAfterCents: before.dueCents - payment.amountCents })
    return { outcome: 'paid' }
  }
  const { result } = actor
    ? await changeVehicle(changes, actor, row.vehicleId, work)
    : await changeVehicleAsOwner(changes, `${OWNER_ONLINE} (card)`, row.vehicleId, work)
  if (result.outcome === 'refused') {
    await refuse(changes.db, row, result.reason)
    await changes.db.insert(cardWebhookEvents).values({ eventId, type: 'checkout.session.completed', sessionId: row.sessionId, outcome: 'refused' }).onConflictDoNothing()
  }
  if (result.outcome === 'paid' && row.receiptEmail) mail.kick?.()
  return result.outcome
}
