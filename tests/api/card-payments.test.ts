import { eq } from 'drizzle-orm'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { historyOf } from '@db/history'
import { cardPaymentsClient } from '../../server/card-payments/index'
import { signWebhook, startFakePaymentService, type FakePaymentService } from '../../server/fakes/index'
import { browserSession, makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { billedVehicle, key } from '../helpers/billing'
import { historyCount, vehicleRow } from '../helpers/board'
import { makeStaff } from '../helpers/factories'

// Issue 11, "Payments" (card): the hosted page of the payment service, through its SDK, against the local
// fake; the payment is written only by the signed webhook, once per event, inside the vehicle's change.

let fake: FakePaymentService
let app: TestApp
/** Every webhook body and signature the fake sent, in order, to replay them. */
const delivered: { payload: string; signature: string; status: number }[] = []

const postWebhook = (payload: string, signature?: string) => {
  const r = request(app.app).post('/api/card-payments/webhook').set('content-type', 'application/json; charset=utf-8')
  return (signature ? r.set('stripe-signature', signature) : r).send(payload)
}

beforeAll(async () => {
  fake = await startFakePaymentService()
  app = await makeTestApp({ cardPayments: cardPaymentsClient({ secretKey: fake.secretKey, webhookSecret: fake.webhookSecret, host: fake.host, port: fake.port }) })
  fake.deliverTo(async (payload, signature) => {
    const { status } = await postWebhook(payload, signature)
    delivered.push({ payload, signature, status })
    return status
  })
})
afterAll(async () => {
  await app.close()
  await fake.close()
})

const checkouts = (id: string) => `/api/vehicles/${id}/card-checkouts`
const paymentRows = (vehicleId: string) => app.db.select().from(t.payments).where(eq(t.payments.vehicleId, vehicleId))
const checkoutRow = async (id: string) => (await app.db.select().from(t.cardCheckouts).where(eq(t.cardCheckouts.id, id)))[0]!

async function counter() {
  const staff = await makeStaff(app.db)
  const v = await billedVehicle(app.db, staff.yard.id)
  const office = await signedIn(app.app, staff.office)
  const due = (await office.get(`/api/vehicles/${v.id}/invoice`).expect(200)).body.invoice.dueCents as number
  return { staff, v, office, due }
}

/** The payer on the fake's hosted page: types a card and presses Pay; answers where it sends the browser. */
async function payOnHostedPage(url: string, card = '4242 4242 4242 4242') {
  const page = await fetch(url)
  expect(page.status).toBe(200)
  expect(await page.text()).toContain('name="card"')
  const res = await fetch(url, { method: 'POST', body: new URLSearchParams({ card }), redirect: 'manual' })
  return { status: res.status, location: res.headers.get('location'), html: res.status === 200 ? await res.text() : '' }
}

describe('card payment at the counter, on the hosted page', () => {
  it('checkout_paidOnTheHostedPage_recordsOnePaymentFromTheWebhookWithItsReferenceHistoryAndReceipt', async () => {
    const { v, office, due } = await counter()
    const res = await office.post(checkouts(v.id), { idempotencyKey: key(), amountCents: 6_000, receiptEmail: 'owner@example.com', language: 'en' })
    expect(res.status).toBe(201)
    expect(res.body.checkout).toMatchObject({ status: 'open', amountCents: 6_000, paymentId: null, replayed: false })
    expect(res.body.checkout.url).toMatch(new RegExp(`^http://127\\.0\\.0\\.1:${fake.port}/pay/cs_test_`))
    // Opening the page writes nothing on the vehicle.
    expect(await paymentRows(v.id)).toHaveLength(0)
    expect(await historyCount(app.db, v.id)).toBe(0)

    const back = await payOnHostedPage(res.body.checkout.url)
    expect(back.status).toBe(303)
    expect(back.location).toMatch(new RegExp(`/vehicles/${v.id}\\?card=paid$`))

    const [payment] = await paymentRows(v.id)
    expect(payment).toMatchObject({ method: 'card', amountCents: 6_000, dueBeforeCents: due, takenById: expect.any(String), terminalReference: null })
    expect(payment!.providerReference).toMatch(/^pi_/)
    const invoice = (await office.get(`/api/vehicles/${v.id}/invoice`).expect(200)).body.invoice
    expect(invoice).toMatchObject({ paidCents: 6_000, dueCents: due - 6_000 })
    expect(invoice.payments[0]).toMatchObject({ method: 'card', providerReference: payment!.providerReference })
    const status = await office.get(`${checkouts(v.id)}/${res.body.checkout.id}`).expect(200)
    expect(status.body.checkout).toMatchObject({ status: 'paid', paymentId: payment!.id, url: null })
    const events = (await historyOf(app.db, v.id)).filter((e) => e.kind === 'payment_taken')
    expect(events.map((e) => e.after)).toMatchObject([{ method: 'card', online: true, amountCents: 6_000, dueBeforeCents: due, dueAfterCents: due - 6_000 }])
    const mail = await app.db.select().from(t.outboundMessages).where(eq(t.outboundMessages.vehicleId, v.id))
    expect(mail.map((m) => [m.purpose, m.toAddress])).toEqual([['receipt', 'owner@example.com']])
    expect((await vehicleRow(app.db, v.id)).version).toBe(2)
  })

  it('checkout_declinedCard_staysOpenAndWritesNothing', async () => {
    const { v, office } = await counter()
    const res = await office.post(checkouts(v.id), { idempotencyKey: key() }).expect(201)
    const back = await payOnHostedPage(res.body.checkout.url, '4000 0000 0000 0002')
    expect(back.status).toBe(200)
    expect(back.html).toContain('declined')
    expect(await paymentRows(v.id)).toHaveLength(0)
    expect((await checkoutRow(res.body.checkout.id)).status).toBe('open')
  })

  it('checkout_sameKeyTwiceAndTwoAtOnce_opensOnePageAndOneRow', async () => {
    const { v, office } = await counter()
    const body = { idempotencyKey: key(), amountCents: 2_000 }
    const first = await office.post(checkouts(v.id), body)
    const again = await office.post(checkouts(v.id), body)
    expect([first.status, again.status]).toEqual([201, 200])
    expect(again.body.checkout).toMatchObject({ id: first.body.checkout.id, url: first.body.checkout.url, replayed: true })

    const together = { idempotencyKey: key(), amountCents: 3_000 }
    const both = await Promise.all([office.post(checkouts(v.id), together), office.post(checkouts(v.id), together)])
    expect(both[0]!.body.checkout.url).toBe(both[1]!.body.checkout.url)
    const rows = await app.db.select().from(t.cardCheckouts).where(eq(t.cardCheckouts.vehicleId, v.id))
    expect(rows).toHaveLength(2)

    const other = await office.post(checkouts(v.id), { ...body, amountCents: 2_500 })
    expect(other.status).toBe(409)
    expect(other.body.issues[0].path).toBe('idempotencyKey')
  })

  it.each([
    { why: 'more than is due', amount: (due: number) => due + 1, status: 400, path: 'amountCents', says: /more than is due/ },
    { why: 'under the service minimum', amount: () => 49, status: 400, path: 'amountCents', says: /at least \$0\.50/ },
    { why: 'fractional cents', amount: () => 100.5, status: 400, path: 'amountCents', says: /to the cent/ },
  ])('checkout_$why_isRefusedNamingTheAmountAndOpensNoPage', async ({ amount, status, path, says }) => {
    const { v, office, due } = await counter()
    const res = await office.post(checkouts(v.id), { idempotencyKey: key(), amountCents: amount(due) })
    expect(res.status).toBe(status)
    expect(res.body.issues.map((i: { path: string }) => i.path)).toContain(path)
    expect(JSON.stringify(res.body)).toMatch(says)
    expect(await app.db.select().from(t.cardCheckouts).where(eq(t.cardCheckouts.vehicleId, v.id))).toHaveLength(0)
  })

  it('checkout_onAClosedVehicle_isRefused', async () => {
    const { v, office } = await counter()
    await app.db.update(t.vehicles).set({ state: 'closed', disposition: 'returned_to_owner', closedAt: new Date() }).where(eq(t.vehicles.id, v.id))
    const res = await office.post(checkouts(v.id), { idempotencyKey: key() })
    expect(res.status).toBe(409)
    expect(res.body.error).toMatch(/left the yard/)
  })

  it('checkout_ofAnotherCompanysVehicle_isNotFound_andTheDispatcherMayNotOpenOne', async () => {
    const { v } = await counter()
    const outsider = await signedIn(app.app, (await makeStaff(app.db)).office)
    expect((await outsider.post(checkouts(v.id), { idempotencyKey: key() })).status).toBe(404)
    const { staff } = await counter()
    const dispatcher = await signedIn(app.app, staff.dispatcher)
    expect((await dispatcher.post(checkouts(v.id), { idempotencyKey: key() })).status).toBe(403)
  })
})

describe('the webhook', () => {
  async function paidCheckout() {
    const c = await counter()
    const res = await c.office.post(checkouts(c.v.id), { idempotencyKey: key(), amountCents: 4_000 }).expect(201)
    const sent = delivered.length
    await payOnHostedPage(res.body.checkout.url)
    const webhook = delivered.slice(sent).find((d) => JSON.parse(d.payload).type === 'checkout.session.completed')!
    return { ...c, checkout: res.body.checkout, webhook }
  }

  it('webhook_replayedEvent_isAnsweredButRecordedOnce', async () => {
    const { v, webhook } = await paidCheckout()
    expect(webhook.status).toBe(200)
    const replay = await postWebhook(webhook.payload, signWebhook(webhook.payload, fake.webhookSecret))
    expect(replay.status).toBe(200)
    expect(replay.body.outcome).toBe('replayed:paid')
    const twice = await Promise.all([0, 1].map(() => postWebhook(webhook.payload, webhook.signature)))
    expect(twice.map((r) => r.status)).toEqual([200, 200])
    expect(await paymentRows(v.id)).toHaveLength(1)
    expect((await historyOf(app.db, v.id)).filter((e) => e.kind === 'payment_taken')).toHaveLength(1)
  })

  it('webhook_forged_isRefusedWith400AndWritesNothing', async () => {
    const { v, office, due } = await counter()
    const res = await office.post(checkouts(v.id), { idempotencyKey: key(), amountCents: 1_000 }).expect(201)
    const row = await checkoutRow(res.body.checkout.id)
    const payload = JSON.stringify({
      id: 'evt_forged_1',
      object: 'event',
      type: 'checkout.session.completed',
      created: Math.floor(Date.now() / 1000),
      data: { object: { id: row.sessionId, object: 'checkout.session', amount_total: 1_000, payment_status: 'paid', status: 'complete', payment_intent: 'pi_forged', metadata: { holdfast: '1' } } },
    })
    const wrongSecret = await postWebhook(payload, signWebhook(payload, 'whsec_not_the_right_one'))
    const noSignature = await postWebhook(payload)
    const tampered = await postWebhook(payload.replace('1000', '100'), signWebhook(payload, fake.webhookSecret))
    const tooOld = await postWebhook(payload, signWebhook(payload, fake.webhookSecret, Math.floor(Date.now() / 1000) - 3_600))
    expect([wrongSecret.status, noSignature.status, tampered.status, tooOld.status]).toEqual([400, 400, 400, 400])
    expect(await paymentRows(v.id)).toHaveLength(0)
    expect((await checkoutRow(row.id)).status).toBe('open')
    expect(await app.db.select().from(t.cardWebhookEvents).where(eq(t.cardWebhookEvents.eventId, 'evt_forged_1'))).toHaveLength(0)
    expect((await office.get(`/api/vehicles/${v.id}/invoice`)).body.invoice.dueCents).toBe(due)
  })

  it('webhook_outOfOrder_expiredAfterPaidChangesNothing_paidAfterExpiredIsRefused_unknownSessionIsAskedAgain', async () => {
    const { v, checkout, webhook } = await paidCheckout()
    const paid = JSON.parse(webhook.payload)
    const expiredLate = JSON.stringify({ ...paid, id: 'evt_late_expired', type: 'checkout.session.expired', data: { object: { ...paid.data.object, status: 'expired' } } })
    expect((await postWebhook(expiredLate, signWebhook(expiredLate, fake.webhookSecret))).status).toBe(200)
    expect((await checkoutRow(checkout.id)).status).toBe('paid')
    expect(await paymentRows(v.id)).toHaveLength(1)

    // A page the counter closed, then a payment event for it (a delayed or crafted one): refused, nothing on the bill.
    const c = await counter()
    const open = await c.office.post(checkouts(c.v.id), { idempotencyKey: key(), amountCents: 1_500 }).expect(201)
    const closed = await c.office.post(`${checkouts(c.v.id)}/${open.body.checkout.id}/expire`).expect(200)
    expect(closed.body.checkout.status).toBe('expired')
    const gone = await fetch(open.body.checkout.url, { method: 'POST', body: new URLSearchParams({ card: '4242424242424242' }), redirect: 'manual' })
    expect(gone.status).toBe(200)
    expect(await gone.text()).toContain('no longer open')
    const row = await checkoutRow(open.body.checkout.id)
    const late = JSON.stringify({ ...paid, id: 'evt_paid_after_expiry', data: { object: { ...paid.data.object, id: row.sessionId, amount_total: 1_500 } } })
    const answer = await postWebhook(late, signWebhook(late, fake.webhookSecret))
    expect(answer.status).toBe(200)
    expect(answer.body.outcome).toBe('refused')
    expect(await paymentRows(c.v.id)).toHaveLength(0)
    expect(await checkoutRow(row.id)).toMatchObject({ status: 'refused', refusal: expect.stringMatching(/expired/) })

    const unknown = JSON.stringify({ ...paid, id: 'evt_unknown', data: { object: { ...paid.data.object, id: 'cs_test_nobody' } } })
    expect((await postWebhook(unknown, signWebhook(unknown, fake.webhookSecret))).status).toBe(409)
    expect(await app.db.select().from(t.cardWebhookEvents).where(eq(t.cardWebhookEvents.eventId, 'evt_unknown'))).toHaveLength(0)
  })

  it('webhook_paidAfterTheVehicleLeft_isRefusedWithTheReasonAndWritesNothingOnTheVehicle', async () => {
    const { v, office } = await counter()
    const res = await office.post(checkouts(v.id), { idempotencyKey: key(), amountCents: 2_000 }).expect(201)
    await app.db.update(t.vehicles).set({ state: 'closed', disposition: 'returned_to_owner', closedAt: new Date() }).where(eq(t.vehicles.id, v.id))
    const before = await historyCount(app.db, v.id)
    await payOnHostedPage(res.body.checkout.url)
    expect(await paymentRows(v.id)).toHaveLength(0)
    expect(await historyCount(app.db, v.id)).toBe(before)
    expect(await checkoutRow(res.body.checkout.id)).toMatchObject({ status: 'refused', refusal: expect.stringMatching(/left the yard/) })
  })

  it('webhook_logNeverCarriesTheSignature', async () => {
    const lines: string[] = []
    const { pino } = await import('pino')
    const logged = await makeTestApp({
      cardPayments: cardPaymentsClient({ secretKey: fake.secretKey, webhookSecret: fake.webhookSecret, host: fake.host, port: fake.port }),
      log: pino({ level: 'info' }, { write: (l: string) => void lines.push(l) }),
    })
    const payload = JSON.stringify({ id: 'evt_log', object: 'event', type: 'customer.created', data: { object: {} } })
    const signature = signWebhook(payload, fake.webhookSecret)
    await request(logged.app).post('/api/card-payments/webhook').set('content-type', 'application/json').set('stripe-signature', signature).send(payload).expect(200)
    await logged.close()
    const text = lines.join('\n')
    expect(text).toContain('/api/card-payments/webhook')
    expect(text).not.toContain(signature.split(',')[1]!.slice(3))
    expect(text).not.toContain(fake.webhookSecret)
  })
})

describe("the owner's page pays by card", () => {
  async function ownerOf(vehicleId: string, office: Awaited<ReturnType<typeof signedIn>>) {
    const link = (await office.post(`/api/vehicles/${vehicleId}/owner-links`).expect(201)).body as { token: string }
    return { owner: await browserSession(app.app), token: link.token }
  }

  it('ownerCheckout_paysAllThatIsDueOnItsOwnVehicleOnly_recordedAsTheOwner', async () => {
    const { staff, v, office, due } = await counter()
    const b = await billedVehicle(app.db, staff.yard.id)
    const dueB = (await office.get(`/api/vehicles/${b.id}/invoice`)).body.invoice.dueCents
    const { owner, token } = await ownerOf(v.id, office)
    expect((await owner.get(`/api/owner/${token}`).expect(200)).body.money).toEqual({ totalCents: due, paidCents: 0, creditedCents: 0, dueCents: due, canPayByCard: true })
    // The body cannot name another vehicle or an amount: the link decides both.
    const res = await owner.post(`/api/owner/${token}/card-checkout`, { idempotencyKey: key(), vehicleId: b.id, amountCents: 100 })
    expect(res.status).toBe(201)
    expect(res.body.checkout.amountCents).toBe(due)
    const back = await payOnHostedPage(res.body.checkout.url)
    expect(back.location).toMatch(/\/o\/payment-return\?result=paid$/)
    expect(back.location).not.toContain(token)

    expect((await office.get(`/api/vehicles/${v.id}/invoice`)).body.invoice).toMatchObject({ paidCents: due, dueCents: 0 })
    // The owner's page says the same as the counter's invoice.
    expect((await owner.get(`/api/owner/${token}`).expect(200)).body.money).toEqual({ totalCents: due, paidCents: due, creditedCents: 0, dueCents: 0, canPayByCard: false })
    expect((await office.get(`/api/vehicles/${b.id}/invoice`)).body.invoice).toMatchObject({ paidCents: 0, dueCents: dueB })
    const [event] = (await historyOf(app.db, v.id)).filter((e) => e.kind === 'payment_taken')
    expect(event).toMatchObject({ actorId: null, actorLabel: 'Owner, online (card)' })
    expect((await paymentRows(v.id))[0]!.takenById).toBeNull()
    // Nothing left to pay: a second page is refused.
    expect((await owner.post(`/api/owner/${token}/card-checkout`, { idempotencyKey: key() })).status).toBe(400)
  })

  it('ownerCheckout_withAWrongKey_isNotFoundAndOpensNothing', async () => {
    const owner = await browserSession(app.app)
    const res = await owner.post(`/api/owner/${'A'.repeat(43)}/card-checkout`, { idempotencyKey: key() })
    expect(res.status).toBe(404)
  })
})
