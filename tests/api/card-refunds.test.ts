import { eq } from 'drizzle-orm'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { historyOf } from '@db/history'
import { cardPaymentsClient } from '../../server/card-payments/index'
import { signWebhook, startFakePaymentService, type FakePaymentService } from '../../server/fakes/index'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { billedVehicle, key } from '../helpers/billing'
import { historyCount, vehicleRow } from '../helpers/board'
import { makeStaff } from '../helpers/factories'

// Issue 11, "Payments" / "The bill" (refunds, with reason, manager): a card paid on the hosted page is given
// back through the payment service's refunds call (the SDK against the local stand-in), recorded only once
// the service answers that it succeeded, once per key, never more than is left on that one payment.

let fake: FakePaymentService
let app: TestApp

beforeAll(async () => {
  fake = await startFakePaymentService()
  app = await makeTestApp({ cardPayments: cardPaymentsClient({ secretKey: fake.secretKey, webhookSecret: fake.webhookSecret, host: fake.host, port: fake.port }) })
  fake.deliverTo(async (payload, signature) => {
    const r = await request(app.app).post('/api/card-payments/webhook').set('content-type', 'application/json; charset=utf-8').set('stripe-signature', signature).send(payload)
    return r.status
  })
})
afterAll(async () => {
  await app.close()
  await fake.close()
})

const refunds = (id: string) => `/api/vehicles/${id}/card-refunds`
const refundRows = async (vehicleId: string) => (await app.db.select().from(t.payments).where(eq(t.payments.vehicleId, vehicleId))).filter((p) => p.kind === 'refund')

/** A vehicle with one card payment of `cents` made on the fake's hosted page (its webhook recorded it). */
async function paidByCard(cents: number) {
  const staff = await makeStaff(app.db)
  const v = await billedVehicle(app.db, staff.yard.id)
  const office = await signedIn(app.app, staff.office)
  const manager = await signedIn(app.app, staff.manager)
  const opened = await office.post(`/api/vehicles/${v.id}/card-checkouts`, { idempotencyKey: key(), amountCents: cents }).expect(201)
  const paid = await fetch(opened.body.checkout.url, { method: 'POST', body: new URLSearchParams({ card: '4242424242424242' }), redirect: 'manual' })
  expect(paid.status).toBe(303)
  const [payment] = await app.db.select().from(t.payments).where(eq(t.payments.vehicleId, v.id))
  expect(payment).toMatchObject({ kind: 'payment', method: 'card', amountCents: cents })
  return { staff, v, office, manager, payment: payment! }
}

describe('card refund through the payment service', () => {
  it('refund_partThenTheRest_eachRecordedWithTheServiceRefundItsHistoryAndOnTheBill', async () => {
    const { v, manager, payment } = await paidByCard(6_000)
    const before = (await manager.get(`/api/vehicles/${v.id}/invoice`).expect(200)).body.invoice
    const part = await manager.post(refunds(v.id), { idempotencyKey: key(), paymentId: payment.id, amountCents: 2_500, reason: 'Storage day charged in error' })
    expect(part.status).toBe(201)
    expect(part.body.payment).toMatchObject({ kind: 'refund', method: 'card', amountCents: 2_500, reason: 'Storage day charged in error', refundOfPaymentId: payment.id })
    expect(part.body.payment.providerReference).toMatch(/^re_/)
    // The bill shows it: 25.00 less paid, 25.00 more due.
    expect(part.body.invoice).toMatchObject({ paidCents: 6_000, refundedCents: 2_500, netPaidCents: 3_500, dueCents: before.dueCents + 2_500 })
    expect(part.body.invoice.payments.map((p: { kind: string; amountCents: number }) => [p.kind, p.amountCents])).toEqual([
      ['payment', 6_000],
      ['refund', 2_500],
    ])
    const rest = await manager.post(refunds(v.id), { idempotencyKey: key(), paymentId: payment.id, amountCents: 3_500, reason: 'Owner paid in cash instead' }).expect(201)
    expect(rest.body.invoice).toMatchObject({ refundedCents: 6_000, netPaidCents: 0 })
    const events = (await historyOf(app.db, v.id)).filter((e) => e.kind === 'payment_refunded')
    expect(events.map((e) => [e.reason, e.after])).toMatchObject([
      ['Storage day charged in error', { method: 'card', online: true, amountCents: 2_500, refundOfPaymentId: payment.id, providerReference: part.body.payment.providerReference }],
      ['Owner paid in cash instead', { method: 'card', amountCents: 3_500 }],
    ])
  })

  it('refund_overWhatIsLeftOnThatPayment_refusedNamingAmountNothingWrittenServiceNotCharged', async () => {
    const { v, manager, payment } = await paidByCard(4_000)
    await manager.post(refunds(v.id), { idempotencyKey: key(), paymentId: payment.id, amountCents: 1_000, reason: 'Fee charged twice' }).expect(201)
    const version = (await vehicleRow(app.db, v.id)).version
    const events = await historyCount(app.db, v.id)
    const over = await manager.post(refunds(v.id), { idempotencyKey: key(), paymentId: payment.id, amountCents: 3_001, reason: 'Too much' })
    expect(over.status).toBe(400)
    expect(over.body.issues).toEqual([{ path: 'amountCents', message: 'At most $30.00 of this card payment can still be refunded.' }])
    expect(await refundRows(v.id)).toHaveLength(1)
    expect((await vehicleRow(app.db, v.id)).version).toBe(version)
    expect(await historyCount(app.db, v.id)).toBe(events)
    // The service was not asked: the whole 30.00 left is still refundable there.
    await manager.post(refunds(v.id), { idempotencyKey: key(), paymentId: payment.id, amountCents: 3_000, reason: 'The rest' }).expect(201)
  })

  it('refund_sameKeyTwiceAndTwoAtOnce_refundsOnce', async () => {
    const { v, manager, payment } = await paidByCard(5_000)
    const body = { idempotencyKey: key(), paymentId: payment.id, amountCents: 2_000, reason: 'Goodwill' }
    const both = await Promise.all([manager.post(refunds(v.id), body), manager.post(refunds(v.id), body)])
    expect(both.map((r) => r.status).sort()).toEqual([200, 201])
    const again = await manager.post(refunds(v.id), body).expect(200)
    expect(again.body).toMatchObject({ replayed: true, payment: { amountCents: 2_000 }, invoice: { refundedCents: 2_000 } })
    expect(await refundRows(v.id)).toHaveLength(1)
    expect((await historyOf(app.db, v.id)).filter((e) => e.kind === 'payment_refunded')).toHaveLength(1)
    // The service refunded once too: 30.00 is still left there.
    const last = await manager.post(refunds(v.id), { idempotencyKey: key(), paymentId: payment.id, amountCents: 3_000, reason: 'The rest' })
    expect(last.status).toBe(201)
    // The same key for another refund is refused, naming the key.
    const other = await manager.post(refunds(v.id), { ...body, amountCents: 1_000 })
    expect(other.status).toBe(409)
    expect(other.body.issues[0].path).toBe('idempotencyKey')
  })

  it.each([
    ['no reason', { reason: '  ' }, 'reason'],
    ['zero', { amountCents: 0 }, 'amountCents'],
    ['fractional cents', { amountCents: 10.5 }, 'amountCents'],
    ['no payment named', { paymentId: 'x' }, 'paymentId'],
  ])('refund_%s_refusedNamingTheFieldNothingWritten', async (_, change, path) => {
    const { v, manager, payment } = await paidByCard(3_000)
    const res = await manager.post(refunds(v.id), { idempotencyKey: key(), paymentId: payment.id, amountCents: 1_000, reason: 'Why', ...change })
    expect(res.status).toBe(400)
    expect(res.body.issues.map((i: { path: string }) => i.path)).toContain(path)
    expect(await refundRows(v.id)).toHaveLength(0)
  })

  it('refund_ofACashPayment_refusedNamingPaymentId', async () => {
    const { v, office, manager } = await paidByCard(3_000)
    const cash = await office.post(`/api/vehicles/${v.id}/payments`, { idempotencyKey: key(), method: 'cash', amountCents: 1_000, tenderedCents: 1_000 }).expect(201)
    const res = await manager.post(refunds(v.id), { idempotencyKey: key(), paymentId: cash.body.payment.id, amountCents: 500, reason: 'Why' })
    expect(res.status).toBe(400)
    expect(res.body.issues).toEqual([{ path: 'paymentId', message: 'Only a card payment made on the payment page can be refunded through the payment service.' }])
    expect(await refundRows(v.id)).toHaveLength(0)
  })

  it('refund_byTheOfficeClerk_forbiddenNothingWritten', async () => {
    const { v, office, payment } = await paidByCard(3_000)
    const res = await office.post(refunds(v.id), { idempotencyKey: key(), paymentId: payment.id, amountCents: 500, reason: 'Why' })
    expect(res.status).toBe(403)
    expect(await refundRows(v.id)).toHaveLength(0)
  })
})

// A refund the service takes as pending (a bank can take days; the service's refunds can answer
// `pending` and later send `refund.updated`): nothing on the bill until it succeeds, and then once.
describe('card refund the service finishes later', () => {
  beforeAll(() => fake.holdRefunds(true))
  afterAll(() => fake.holdRefunds(false))
  const kinds = async (vehicleId: string, kind: string) => (await historyOf(app.db, vehicleId)).filter((e) => e.kind === kind)

  it('refund_pendingThenSucceeded_notedAsSentThenRecordedOnceByTheWebhook', async () => {
    const { v, manager, payment, staff } = await paidByCard(6_000)
    const body = { idempotencyKey: key(), paymentId: payment.id, amountCents: 2_000, reason: 'Tow charged twice' }
    const sent = await manager.post(refunds(v.id), body)
    expect(sent.status).toBe(202)
    expect(sent.body.pending).toMatchObject({ amountCents: 2_000 })
    expect(sent.body.invoice).toMatchObject({ refundedCents: 0 })
    expect(await refundRows(v.id)).toHaveLength(0)
    // A retry while it is still pending: answered the same, noted once.
    expect((await manager.post(refunds(v.id), body)).status).toBe(202)
    const noted = await kinds(v.id, 'refund_pending')
    expect(noted).toHaveLength(1)
    expect(noted[0]).toMatchObject({ reason: 'Tow charged twice', after: { amountCents: 2_000, providerReference: sent.body.pending.providerReference } })

    await fake.settleRefund(sent.body.pending.providerReference, 'succeeded')
    const rows = await refundRows(v.id)
    expect(rows).toMatchObject([{ amountCents: 2_000, reason: 'Tow charged twice', providerReference: sent.body.pending.providerReference, refundOfPaymentId: payment.id, takenById: staff.manager.id }])
    const given = await kinds(v.id, 'payment_refunded')
    expect(given).toHaveLength(1)
    expect(given[0]!.actorLabel).toBe(staff.manager.name)
    // The manager's retry after it ended answers the refund the webhook recorded.
    const after = await manager.post(refunds(v.id), body).expect(200)
    expect(after.body).toMatchObject({ replayed: true, payment: { id: rows[0]!.id }, invoice: { refundedCents: 2_000 } })
    // The service telling it again, as a new event, records nothing more.
    const reference = sent.body.pending.providerReference
    const refund = await (await fetch(`http://${fake.host}:${fake.port}/v1/refunds/${reference}`, { headers: { authorization: `Bearer ${fake.secretKey}` } })).json()
    const payload = JSON.stringify({ id: `evt_again_${reference}`, object: 'event', type: 'refund.updated', created: 1, livemode: false, data: { object: refund } })
    const again = await request(app.app).post('/api/card-payments/webhook').set('content-type', 'application/json').set('stripe-signature', signWebhook(payload, fake.webhookSecret)).send(payload)
    expect(again.body).toMatchObject({ received: true, outcome: 'replayed' })
    expect(await refundRows(v.id)).toHaveLength(1)
    expect(await kinds(v.id, 'payment_refunded')).toHaveLength(1)
  })

  it('refund_pendingThenFailed_noteOfFailureNothingOnTheBillAndTheAmountCanBeGivenAgain', async () => {
    const { v, manager, payment } = await paidByCard(3_000)
    const sent = await manager.post(refunds(v.id), { idempotencyKey: key(), paymentId: payment.id, amountCents: 3_000, reason: 'Owner overpaid' }).expect(202)
    await fake.settleRefund(sent.body.pending.providerReference, 'failed')
    expect(await refundRows(v.id)).toHaveLength(0)
    const failed = await kinds(v.id, 'refund_failed')
    expect(failed).toHaveLength(1)
    expect(failed[0]!.after).toMatchObject({ amountCents: 3_000, failureReason: 'lost_or_stolen_card', providerReference: sent.body.pending.providerReference })
    const invoice = (await manager.get(`/api/vehicles/${v.id}/invoice`).expect(200)).body.invoice
    expect(invoice).toMatchObject({ paidCents: 3_000, refundedCents: 0 })
    // The whole amount is there to give back again, and this time the service finishes it at once.
    fake.holdRefunds(false)
    try {
      await manager.post(refunds(v.id), { idempotencyKey: key(), paymentId: payment.id, amountCents: 3_000, reason: 'Owner overpaid, again' }).expect(201)
    } finally {
      fake.holdRefunds(true)
    }
    expect(await refundRows(v.id)).toHaveLength(1)
  })
})
