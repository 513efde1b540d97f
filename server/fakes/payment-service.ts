import { createHash, randomBytes } from 'node:crypto'
import type { AddressInfo } from 'node:net'
import type { Server } from 'node:http'
import express, { type Response } from 'express'
import Stripe from 'stripe'

/**
 * A local stand-in for the card payment service's HTTP API — only what Holdfast's checkout uses — so
 * the app runs and is tested offline through the very same `stripe` SDK, pointed here by host and port:
 *
 * - `POST /v1/checkout/sessions` (form-encoded, as the SDK sends; `Idempotency-Key` honoured),
 *   `GET /v1/checkout/sessions/:id`, `POST /v1/checkout/sessions/:id/expire`;
 * - `POST /v1/refunds` (`payment_intent`, `amount`; `Idempotency-Key` honoured): never more than is left
 *   unrefunded on that payment, answered `succeeded` at once — or, after `holdRefunds(true)`, `pending`
 *   until a test calls `settleRefund`, which sends a signed `refund.updated` webhook, as the real
 *   service does when a bank takes its time; `GET /v1/refunds/:id`;
 * - its own hosted checkout page, `/pay/:id`: a test card number, Pay and Cancel, which sends the
 *   app a signed `checkout.session.completed` webhook and goes back to the session's success URL.
 *
 * Test cards: 4242 4242 4242 4242 pays; 4000 0000 0000 0002 is declined. Nothing here is real money.
 */
export interface FakePaymentService {
  host: string
  port: number
  /** The key the SDK must send (any other is 401, as the real service answers). */
  secretKey: string
  /** The secret the webhooks are signed with; the app verifies them with it. */
  webhookSecret: string
  /** Where webhooks go: set once the app is listening (or a test's own delivery). */
  deliverTo(deliver: WebhookDelivery): void
  /** Sends the webhooks still waiting for an answer of 2xx (a webhook the app refused is kept, as the real service retries). */
  redeliver(): Promise<void>
  /** From now on, refunds answer `pending` and wait for `settleRefund` (true), or succeed at once (false). */
  holdRefunds(on: boolean): void
  /** A pending refund ends: `succeeded`, or `failed` (its amount can be refunded again); the app hears `refund.updated`. */
  settleRefund(id: string, outcome: 'succeeded' | 'failed'): Promise<void>
  /** From now on, refunds are refused as declined by the card's bank with this decline code (a card error, 402), or go through again (null). */
  declineRefunds(declineCode: string | null): void
  close(): Promise<void>
}

interface FakeRefund {
  id: string
  object: 'refund'
  amount: number
  currency: string
  payment_intent: string
  status: 'pending' | 'succeeded' | 'failed'
  failure_reason?: string
  reason: string | null
  metadata: Record<string, string>
  created: number
}

/** Posts one event's body with its `Stripe-Signature` header; answers the HTTP status the app gave. */
export type WebhookDelivery = (payload: string, signature: string) => Promise<number>

const PAID_CARD = '4242424242424242'
const DECLINED_CARD = '4000000000000002'
/** The service's own floor for a card charge in dollars. */
const MINIMUM_CENTS = 50

interface FakeSession {
  id: string
  object: 'checkout.session'
  amount_total: number
  currency: string
  mode: 'payment'
  status: 'open' | 'complete' | 'expired'
  payment_status: 'unpaid' | 'paid'
  payment_intent: string | null
  client_reference_id: string | null
  customer_email: string | null
  locale: string | null
  metadata: Record<string, string>
  success_url: string
  cancel_url: string | null
  url: string | null
  created: number
  expires_at: number
  livemode: false
  line_items_description: string
}

const newId = (prefix: string) => `${prefix}_${randomBytes(12).toString('hex')}`

const apiError = (res: Response, status: number, message: string, param?: string, type = 'invalid_request_error') =>
  res.status(status).json({ error: { type, message, ...(param ? { param } : {}) } })

export async function startFakePaymentService(options: { host?: string; port?: number; now?: () => number } = {}): Promise<FakePaymentService> {
  const host = options.host ?? '127.0.0.1'
  const now = options.now ?? (() => Date.now())
  const secretKey = `sk_test_holdfast_fake_${randomBytes(16).toString('hex')}`
  const webhookSecret = `whsec_${randomBytes(24).toString('base64url')}`
  const sessions = new Map<string, FakeSession>()
  const idempotent = new Map<string, { hash: string; status: number; body: unknown }>()
  const pending: string[] = []
  // What each paid payment took and how much of it has been given back.
  const intents = new Map<string, { amount: number; currency: string; refunded: number }>()
  const refunds = new Map<string, FakeRefund>()
  let refundsWait = false
  let refundDecline: string | null = null
  let deliver: WebhookDelivery | undefined
  let base = ''

  const app = express()
  app.disable('x-powered-by')
  app.use(express.urlencoded({ extended: true, limit: '100kb' }))

  // The API: the SDK's key, as a bearer token, on every call.
  const api = express.Router()
  api.use((req, res, next) => {
    if (req.get('authorization') !== `Bearer ${secretKey}`) return apiError(res, 401, 'Invalid API Key provided.', undefined, 'authentication_error')
    next()
  })
  api.post('/checkout/sessions', (req, res) => {
    const key = req.get('idempotency-key')
    const hash = createHash('sha256').update(JSON.stringify(req.body)).digest('hex')
    if (key) {
      const seen = idempotent.get(key)
      if (seen && seen.hash !== hash) return apiError(res, 400, 'Keys for idempotent requests can only be used with the same parameters they were first used with.', undefined, 'idempotency_error')
      if (seen) return res.status(seen.status).set('Idempotent-Replayed', 'true').json(seen.body)
    }
    const answer = createSession(req.body)
    if (key) idempotent.set(key, { hash, ...answer })
    res.status(answer.status).json(answer.body)
  })
  api.get('/checkout/sessions/:id', (req, res) => {
    const s = sessions.get(req.params.id!)
    if (!s) return apiError(res, 404, `No such checkout.session: '${req.params.id}'`, 'id')
    res.json(expireIfDue(s))
  })
  api.post('/checkout/sessions/:id/expire', async (req, res) => {
    const s = sessions.get(req.params.id!)
    if (!s) return apiError(res, 404, `No such checkout.session: '${req.params.id}'`, 'id')
    if (expireIfDue(s).status !== 'open') return apiError(res, 400, `Only Checkout Sessions with a status of open can be expired. This session has a status of ${s.status}.`)
    s.status = 'expired'
    s.url = null
    await send('checkout.session.expired', s)
    res.json(s)
  })
  api.post('/refunds', (req, res) => {
    const key = req.get('idempotency-key')
    const hash = createHash('sha256').update(JSON.stringify(req.body)).digest('hex')
    if (key) {
      const seen = idempotent.get(`refund:${key}`)
      if (seen && seen.hash !== hash) return apiError(res, 400, 'Keys for idempotent requests can only be used with the same parameters they were first used with.', undefined, 'idempotency_error')
      if (seen) return res.status(seen.status).set('Idempotent-Replayed', 'true').json(seen.body)
    }
    const answer = createRefund(req.body)
    if (key) idempotent.set(`refund:${key}`, { hash, ...answer })
    res.status(answer.status).json(answer.body)
  })
  api.get('/refunds/:id', (req, res) => {
    const r = refunds.get(req.params.id!)
    if (!r) return apiError(res, 404, `No such refund: '${req.params.id}'`, 'id')
    res.json(r)
  })
  app.use('/v1', api)

  function createRefund(body: Record<string, unknown>): { status: number; body: unknown } {
    const fail = (message: string, param?: string, code?: string) => ({ status: 400, body: { error: { type: 'invalid_request_error', message, ...(param ? { param } : {}), ...(code ? { code } : {}) } } })
    const pi = typeof body.payment_intent === 'string' ? body.payment_intent : ''
    const intent = intents.get(pi)
    if (!intent) return { status: 404, body: { error: { type: 'invalid_request_error', message: `No such payment_intent: '${pi}'`, param: 'payment_intent' } } }
    const left = intent.amount - intent.refunded
    const amount = body.amount === undefined ? left : Number(body.amount)
    if (!Number.isInteger(amount) || amount <= 0) return fail('Invalid positive integer', 'amount')
    if (left <= 0) return fail(`Charge for payment_intent ${pi} has already been refunded.`, undefined, 'charge_already_refunded')
    if (amount > left) return fail(`Refund amount ($${(amount / 100).toFixed(2)}) is greater than unrefunded amount on charge ($${(left / 100).toFixed(2)})`, 'amount', 'amount_too_large')
    if (refundDecline) return { status: 402, body: { error: { type: 'card_error', code: 'card_declined', decline_code: refundDecline, message: 'Your card was declined.' } } }
    intent.refunded += amount
    const refund: FakeRefund = {
      id: newId('re'),
      object: 'refund',
      amount,
      currency: intent.currency,
      payment_intent: pi,
      status: refundsWait ? 'pending' : 'succeeded',
      reason: typeof body.reason === 'string' ? body.reason : null,
      metadata: (body.metadata ?? {}) as Record<string, string>,
      created: Math.floor(now() / 1000),
    }
    refunds.set(refund.id, refund)
    // The answer as it was at the time (a replay of the same key answers it again, as the real service does).
    return { status: 200, body: { ...refund } }
  }

  function createSession(body: Record<string, unknown>): { status: number; body: unknown } {
    const items = Array.isArray(body.line_items) ? (body.line_items as Record<string, unknown>[]) : []
    if (body.mode !== 'payment') return { status: 400, body: { error: { type: 'invalid_request_error', message: 'Only mode=payment is offered here.', param: 'mode' } } }
    if (typeof body.success_url !== 'string' || !/^https?:\/\//.test(body.success_url)) {
      return { status: 400, body: { error: { type: 'invalid_request_error', message: 'Not a valid URL', param: 'success_url' } } }
    }
    let amount = 0
    let currency = ''
    const names: string[] = []
    for (const item of items) {
      const price = (item.price_data ?? {}) as Record<string, unknown>
      const unit = Number(price.unit_amount)
      const quantity = Number(item.quantity ?? 1)
      if (!Number.isInteger(unit) || unit <= 0 || !Number.isInteger(quantity) || quantity <= 0) {
        return { status: 400, body: { error: { type: 'invalid_request_error', message: 'Invalid integer: unit_amount', param: 'line_items[0][price_data][unit_amount]' } } }
      }
      amount += unit * quantity
      currency = String(price.currency ?? '')
      names.push(String(((price.product_data ?? {}) as Record<string, unknown>).name ?? ''))
    }
    if (items.length === 0) return { status: 400, body: { error: { type: 'invalid_request_error', message: 'Missing required param: line_items.', param: 'line_items' } } }
    if (amount < MINIMUM_CENTS) {
      return { status: 400, body: { error: { type: 'invalid_request_error', message: 'The Checkout Session\'s total amount due must add up to at least $0.50 usd', param: 'line_items' } } }
    }
    const id = newId('cs_test')
    const created = Math.floor(now() / 1000)
    const s: FakeSession = {
      id,
      object: 'checkout.session',
      amount_total: amount,
      currency,
      mode: 'payment',
      status: 'open',
      payment_status: 'unpaid',
      payment_intent: null,
      client_reference_id: typeof body.client_reference_id === 'string' ? body.client_reference_id : null,
      customer_email: typeof body.customer_email === 'string' ? body.customer_email : null,
      locale: typeof body.locale === 'string' ? body.locale : null,
      metadata: (body.metadata ?? {}) as Record<string, string>,
      success_url: body.success_url,
      cancel_url: typeof body.cancel_url === 'string' ? body.cancel_url : null,
      url: `${base}/pay/${id}`,
      created,
      expires_at: Number(body.expires_at) || created + 24 * 3600,
      livemode: false,
      line_items_description: names.join(', '),
    }
    sessions.set(id, s)
    return { status: 200, body: s }
  }

  function expireIfDue(s: FakeSession): FakeSession {
    if (s.status === 'open' && s.expires_at * 1000 <= now()) {
      s.status = 'expired'
      s.url = null
    }
    return s
  }

  async function send(type: string, s: FakeSession | FakeRefund) {
    const event = { id: newId('evt'), object: 'event', api_version: '2025-11-17.clover', created: Math.floor(now() / 1000), livemode: false, type, data: { object: s } }
    pending.push(JSON.stringify(event))
    await flush()
  }

  async function flush() {
    if (!deliver) return
    for (const payload of [...pending]) {
      const signature = Stripe.webhooks.generateTestHeaderString({ payload, secret: webhookSecret })
      const status = await deliver(payload, signature).catch(() => 0)
      if (status >= 200 && status < 300) pending.splice(pending.indexOf(payload), 1)
    }
  }

  // The hosted page: plain HTML, its own look, no script.
  app.get('/pay/:id', (req, res) => page(res, sessions.get(req.params.id!)))
  app.post('/pay/:id', async (req, res) => {
    const s = sessions.get(req.params.id!)
    if (!s || expireIfDue(s).status !== 'open') return page(res, s)
    const card = String(req.body.card ?? '').replace(/[\s-]/g, '')
    if (card === DECLINED_CARD) return page(res, s, 'declined')
    if (card !== PAID_CARD) return page(res, s, 'unknown')
    s.status = 'complete'
    s.payment_status = 'paid'
    s.payment_intent = newId('pi')
    intents.set(s.payment_intent, { amount: s.amount_total, currency: s.currency, refunded: 0 })
    s.url = null
    // The real service tells the app a moment after the redirect; here the webhook is sent first, so a
    // test reading the bill right after the redirect sees it (the app's pages wait for it either way).
    await send('checkout.session.completed', s)
    res.redirect(303, s.success_url.replace('{CHECKOUT_SESSION_ID}', s.id))
  })
  app.post('/pay/:id/cancel', (req, res) => {
    const s = sessions.get(req.params.id!)
    if (!s || !s.cancel_url) return page(res, s)
    res.redirect(303, s.cancel_url.replace('{CHECKOUT_SESSION_ID}', s.id))
  })

  const server: Server = await new Promise((resolve) => {
    const srv = app.listen(options.port ?? 0, host, () => resolve(srv))
  })
  const port = (server.address() as AddressInfo).port
  base = `http://${host}:${port}`

  return {
    host,
    port,
    secretKey,
    webhookSecret,
    deliverTo(d) {
      deliver = d
    },
    redeliver: flush,
    holdRefunds(on) {
      refundsWait = on
    },
    declineRefunds(declineCode) {
      refundDecline = declineCode
    },
    async settleRefund(id, outcome) {
      const r = refunds.get(id)
      if (!r || r.status !== 'pending') throw new Error(`No pending refund ${id}`)
      r.status = outcome
      if (outcome === 'failed') {
        r.failure_reason = 'lost_or_stolen_card'
        intents.get(r.payment_intent)!.refunded -= r.amount
      }
      await send('refund.updated', { ...r })
    },
    close: () =>
      new Promise<void>((resolve) => {
        server.close(() => resolve())
        server.closeAllConnections()
      }),
  }
}

const WORDS = {
  en: {
    title: 'Test payment',
    service: 'Local test payment service — no real card is charged',
    amount: 'Amount',
    card: 'Card number',
    hint: 'Test cards: 4242 4242 4242 4242 pays, 4000 0000 0000 0002 is declined.',
    pay: 'Pay',
    cancel: 'Cancel',
    declined: 'The card was declined. Try another card.',
    unknown: 'Use one of the test card numbers below.',
    gone: 'This payment page is no longer open.',
    paid: 'This payment has been made.',
  },
  es: {
    title: 'Pago de prueba',
    service: 'Servicio de pagos de prueba local: no se cobra a ninguna tarjeta real',
    amount: 'Importe',
    card: 'Número de tarjeta',
    hint: 'Tarjetas de prueba: 4242 4242 4242 4242 paga, 4000 0000 0000 0002 se rechaza.',
    pay: 'Pagar',
    cancel: 'Cancelar',
    declined: 'La tarjeta fue rechazada. Pruebe con otra.',
    unknown: 'Use uno de los números de tarjeta de prueba de abajo.',
    gone: 'Esta página de pago ya no está abierta.',
    paid: 'Este pago ya se hizo.',
  },
}

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`)

function page(res: Response, s: FakeSession | undefined, problem?: 'declined' | 'unknown') {
  const w = WORDS[s?.locale === 'es' ? 'es' : 'en']
  res.set('Content-Security-Policy', "default-src 'none'; img-src data:; style-src 'unsafe-inline'; form-action 'self' http: https:; frame-ancestors 'none'")
  res.set('Cache-Control', 'no-store')
  const amount = s ? `$${(s.amount_total / 100).toFixed(2)}` : ''
  const open = s?.status === 'open'
  const body = !s
    ? `<p class="note">${w.gone}</p>`
    : !open
      ? `<p class="note">${s.status === 'complete' ? w.paid : w.gone}</p>`
      : `<p class="what">${escape(s.line_items_description)}</p>
  <p class="amount"><span>${w.amount}</span> <strong>${amount}</strong></p>
  ${problem ? `<p class="problem" role="alert">${w[problem]}</p>` : ''}
  <form method="post" action="/pay/${s.id}">
    <label for="card">${w.card}</label>
    <input id="card" name="card" inputmode="numeric" autocomplete="off" placeholder="4242 4242 4242 4242" required>
    <p class="hint">${w.hint}</p>
    <button type="submit">${w.pay} ${amount}</button>
  </form>
  ${s.cancel_url ? `<form method="post" action="/pay/${s.id}/cancel"><button class="cancel" type="submit">${w.cancel}</button></form>` : ''}`
  res.status(s ? 200 : 404).type('html').send(`<!doctype html>
<html lang="${s?.locale === 'es' ? 'es' : 'en'}"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<link rel="icon" href="data:,"><title>${w.title}</title>
<style>
  body { margin: 0; font: 16px/1.45 system-ui, sans-serif; background: #eef0f3; color: #1d2430; }
  main { max-width: 420px; margin: 40px auto; background: #fff; border: 1px solid #cfd5dd; border-radius: 6px; padding: 24px; }
  h1 { font-size: 20px; margin: 0 0 4px; }
  .service { font-size: 13px; color: #5a6473; margin: 0 0 20px; }
  .amount { font-size: 18px; display: flex; justify-content: space-between; border-top: 1px solid #e3e7ec; border-bottom: 1px solid #e3e7ec; padding: 10px 0; }
  label { display: block; font-weight: 600; margin: 16px 0 6px; }
  input { width: 100%; box-sizing: border-box; font-size: 18px; padding: 10px; border: 1px solid #9aa4b1; border-radius: 4px; letter-spacing: 1px; }
  .hint { font-size: 13px; color: #5a6473; }
  button { width: 100%; font-size: 17px; padding: 12px; margin-top: 8px; border: 0; border-radius: 4px; background: #2d4a6b; color: #fff; cursor: pointer; }
  button.cancel { background: #fff; color: #2d4a6b; border: 1px solid #2d4a6b; }
  .problem { background: #fdecea; border-left: 4px solid #b3261e; padding: 8px 12px; }
  .note { font-size: 17px; }
  @media (max-width: 480px) { main { margin: 0; border: 0; border-radius: 0; min-height: 100vh; } }
</style></head>
<body><main><h1>${w.title}</h1><p class="service">${w.service}</p>
  ${body}
</main></body></html>`)
}

/** For tests: the same signature the service puts on a webhook, for a payload of the test's choosing. */
export function signWebhook(payload: string, secret: string, timestamp?: number): string {
  return Stripe.webhooks.generateTestHeaderString({ payload, secret, ...(timestamp ? { timestamp } : {}) })
}

