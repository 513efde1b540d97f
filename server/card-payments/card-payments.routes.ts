import express, { Router, type Request } from 'express'
import { cardCheckoutInputSchema, cardCheckoutParamsSchema, cardRefundInputSchema, ownerCardCheckoutInputSchema } from '@shared/schemas/card-payments'
import { vehicleParamsSchema } from '@shared/schemas/vehicles'
import type { ReceiptMail } from '../billing/index'
import { publicBase } from '../documents/index'
import { notFound } from '../errors'
import { vehicleForUser, type VehicleChanges } from '../vehicles/index'
import { refundCard } from './card-refunds.service'
import { checkoutAnswer, checkoutOf, expireCheckout, receiveWebhook, startCheckout, type CardPayments } from './card-payments.service'

export interface CardPaymentDeps {
  changes: VehicleChanges
  cards?: CardPayments
  mail: ReceiptMail
  publicUrl?: string
}

/** /api/vehicles/:vehicleId/card-checkouts: the counter sends the customer to the hosted card page. */
export function cardCheckoutsRouter({ changes, cards, publicUrl }: CardPaymentDeps): Router {
  const { db } = changes
  const router = Router({ mergeParams: true })
  router.post('/', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    const input = cardCheckoutInputSchema.parse(req.body)
    const back = `${publicBase(req, publicUrl)}/vehicles/${vehicleId}`
    const answer = await startCheckout(db, cards, { kind: 'staff', actor: req.user! }, vehicleId, input, {
      success: `${back}?card=paid`,
      cancel: `${back}?card=cancelled`,
    })
    res.status(answer.replayed ? 200 : 201).json({ checkout: answer })
  })
  router.get('/:checkoutId', async (req, res) => {
    const { vehicleId, checkoutId } = cardCheckoutParamsSchema.parse(req.params)
    await vehicleForUser(db, req.user!.id, vehicleId)
    const row = await checkoutOf(db, vehicleId, checkoutId)
    if (!row) throw notFound('That card payment')
    res.json({ checkout: checkoutAnswer(row) })
  })
  router.post('/:checkoutId/expire', async (req, res) => {
    const { vehicleId, checkoutId } = cardCheckoutParamsSchema.parse(req.params)
    await vehicleForUser(db, req.user!.id, vehicleId)
    const row = await checkoutOf(db, vehicleId, checkoutId)
    if (!row) throw notFound('That card payment')
    res.json({ checkout: await expireCheckout(db, cards, row) })
  })
  return router
}

/**
 * The owner's "Pay by card", called by the owner router once the link is proved. The way back carries
 * no key: the owner's page keeps it in the tab (sessionStorage) while the hosted page is open, so the
 * link's secret is never handed to the payment service.
 */
export async function startOwnerCheckout(deps: CardPaymentDeps, req: Request, link: { id: string; vehicleId: string }, body: unknown) {
  const input = ownerCardCheckoutInputSchema.parse(body)
  const back = `${publicBase(req, deps.publicUrl)}/o/payment-return`
  return startCheckout(deps.changes.db, deps.cards, { kind: 'owner', linkId: link.id }, link.vehicleId, { ...input, amountCents: null }, {
    success: `${back}?result=paid`,
    cancel: `${back}?result=cancelled`,
  })
}

/**
 * POST /api/card-payments/webhook — public: the signature (checked against the raw bytes) is its guard.
 * Mounted before the JSON parser, the session and CSRF; the signature and the secret are never logged.
 */
export function cardWebhookRouter(deps: CardPaymentDeps): Router {
  const router = Router()
  router.post('/', express.raw({ type: '*/*', limit: '512kb' }), async (req, res) => {
    const answer = await receiveWebhook(deps.changes, deps.cards, req.body as Buffer, req.get('stripe-signature'), deps.mail)
    res.status(answer.status).json(answer.body)
  })
  return router
}

/** /api/vehicles/:vehicleId/card-refunds: a manager gives back a hosted-page card payment through the service. */
export function cardRefundsRouter({ changes, cards }: CardPaymentDeps): Router {
  const router = Router({ mergeParams: true })
  router.post('/', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    const { status, answer } = await refundCard(changes, cards, req.user!, vehicleId, cardRefundInputSchema.parse(req.body))
    // 200 a refund this key already made, 201 a new one, 202 one the service has taken but not finished.
    res.status('replayed' in answer && answer.replayed ? 200 : status).json(answer)
  })
  return router
}
