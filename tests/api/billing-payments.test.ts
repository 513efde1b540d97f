import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { formatCents } from '@shared/domain/billing'
import { historyOf } from '@db/history'
import { browserSession, makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { billedVehicle, key } from '../helpers/billing'
import { historyCount, vehicleRow } from '../helpers/board'
import { makeStaff } from '../helpers/factories'

let app: TestApp
beforeAll(async () => {
  app = await makeTestApp()
})
afterAll(() => app.close())

const pay = (id: string) => `/api/vehicles/${id}/payments`
const paymentRows = (vehicleId: string) => app.db.select().from(t.payments).where(eq(t.payments.vehicleId, vehicleId))

async function counter() {
  const staff = await makeStaff(app.db)
  const v = await billedVehicle(app.db, staff.yard.id)
  const office = await signedIn(app.app, staff.office)
  const due = (await office.get(`/api/vehicles/${v.id}/invoice`).expect(200)).body.invoice.dueCents as number
  return { staff, v, office, due }
}

describe('counter payments', () => {
  it('payment_partialCashThenTheRestByCheck_recordsEachWithChangeAndSettlesTheBill', async () => {
    const { v, office, due } = await counter()
    const first = await office.post(pay(v.id), { idempotencyKey: key(), method: 'cash', amountCents: 10_000, tenderedCents: 12_000 })
    expect(first.status).toBe(201)
    expect(first.body.payment).toMatchObject({ method: 'cash', amountCents: 10_000, tenderedCents: 12_000, changeCents: 2_000 })
    expect(first.body.invoice).toMatchObject({ paidCents: 10_000, dueCents: due - 10_000 })

    const rest = await office.post(pay(v.id), { idempotencyKey: key(), method: 'check', amountCents: due - 10_000, checkNumber: '4471' })
    expect(rest.status).toBe(201)
    expect(rest.body.invoice.dueCents).toBe(0)
    const events = (await historyOf(app.db, v.id)).filter((e) => e.kind === 'payment_taken')
    expect(events.map((e) => e.after)).toMatchObject([
      { method: 'cash', amountCents: 10_000, changeCents: 2_000, dueBeforeCents: due, dueAfterCents: due - 10_000 },
      { method: 'check', checkNumber: '4471', amountCents: due - 10_000, dueAfterCents: 0 },
    ])
    expect((await vehicleRow(app.db, v.id)).version).toBe(3)
  })

  it('payment_retriedWithTheSameKey_isRecordedOnceAndAnswersTheFirstPayment', async () => {
    const { v, office } = await counter()
    const body = { idempotencyKey: key(), method: 'card', amountCents: 5_000, terminalReference: 'T1-000381' }
    const first = await office.post(pay(v.id), body)
    const again = await office.post(pay(v.id), body)
    expect(first.status).toBe(201)
    expect(again.status).toBe(200)
    expect(again.body.replayed).toBe(true)
    expect(again.body.payment.id).toBe(first.body.payment.id)
    expect(again.body.invoice.paidCents).toBe(5_000)
    expect(await paymentRows(v.id)).toHaveLength(1)
    expect(await historyCount(app.db, v.id)).toBe(1)
  })

  it('payment_doubleClickSendingTwoAtOnce_isRecordedOnce', async () => {
    const { v, office } = await counter()
    const body = { idempotencyKey: key(), method: 'cash', amountCents: 2_500 }
    const answers = await Promise.all([office.post(pay(v.id), body), office.post(pay(v.id), body)])
    expect(answers.map((a) => a.status).sort()).toEqual([200, 201])
    expect(await paymentRows(v.id)).toHaveLength(1)
  })

  it('payment_sameKeyForADifferentAmount_isRefusedNamingTheKey', async () => {
    const { v, office } = await counter()
    const idempotencyKey = key()
    await office.post(pay(v.id), { idempotencyKey, method: 'cash', amountCents: 2_500 }).expect(201)
    const res = await office.post(pay(v.id), { idempotencyKey, method: 'cash', amountCents: 3_500 })
    expect(res.status).toBe(409)
    expect(res.body.issues[0].path).toBe('idempotencyKey')
    expect(await paymentRows(v.id)).toHaveLength(1)
  })

  it.each([
    { why: 'zero', body: { method: 'cash', amountCents: 0 }, path: 'amountCents' },
    { why: 'negative', body: { method: 'cash', amountCents: -500 }, path: 'amountCents' },
    { why: 'fractional cents', body: { method: 'cash', amountCents: 10.5 }, path: 'amountCents' },
    { why: 'a check without its number', body: { method: 'check', amountCents: 500 }, path: 'checkNumber' },
    { why: 'a card without the terminal reference', body: { method: 'card', amountCents: 500 }, path: 'terminalReference' },
    { why: 'cash short of the amount', body: { method: 'cash', amountCents: 5_000, tenderedCents: 4_000 }, path: 'tenderedCents' },
    { why: 'no key', body: { method: 'cash', amountCents: 500, idempotencyKey: undefined }, path: 'idempotencyKey' },
    { why: 'a bad receipt address', body: { method: 'cash', amountCents: 500, receiptEmail: 'not-an-address' }, path: 'receiptEmail' },
  ])('payment_$why — refused naming the field, nothing written', async ({ body, path }) => {
    const { v, office } = await counter()
    const res = await office.post(pay(v.id), { idempotencyKey: key(), ...body })
    expect(res.status).toBe(400)
    expect(res.body.issues.map((i: { path: string }) => i.path)).toContain(path)
    expect(await paymentRows(v.id)).toHaveLength(0)
    expect(await historyCount(app.db, v.id)).toBe(0)
  })

  it('payment_moreThanIsDue_isRefusedSayingWhatIsDue', async () => {
    const { v, office, due } = await counter()
    const res = await office.post(pay(v.id), { idempotencyKey: key(), method: 'cash', amountCents: due + 1 })
    expect(res.status).toBe(400)
    expect(res.body.issues).toEqual([{ path: 'amountCents', message: expect.stringContaining('more than is due') }])
    expect(await paymentRows(v.id)).toHaveLength(0)
    expect(await historyCount(app.db, v.id)).toBe(0)
  })

  it('payment_onAClosedVehicle_isRefusedAndWritesNothing', async () => {
    const { v, office } = await counter()
    await app.db.update(t.vehicles).set({ state: 'closed', disposition: 'returned_to_owner', closedAt: new Date() }).where(eq(t.vehicles.id, v.id))
    const res = await office.post(pay(v.id), { idempotencyKey: key(), method: 'cash', amountCents: 100 })
    expect(res.status).toBe(409)
    expect(res.body.error).toMatch(/left the yard/)
    expect(await paymentRows(v.id)).toHaveLength(0)
  })

  it('payment_settlingTheBill_liftsTheBalanceGuardOfTheHandOverAndTheBoardCardFollows', async () => {
    const { v, office, due } = await counter()
    const move = () => office.post(`/api/vehicles/${v.id}/moves`, { to: 'closed', version: 1, disposition: 'returned_to_owner' })
    const before = await move()
    expect(before.body.reasons.map((r: { code: string }) => r.code)).toContain('balance')

    await office.post(pay(v.id), { idempotencyKey: key(), method: 'cash', amountCents: 1_000 }).expect(201)
    const board = await office.get('/api/board').expect(200)
    const card = board.body.columns.flatMap((c: { cards: unknown[] }) => c.cards).find((c: { id: string }) => c.id === v.id)
    expect(card.handover).toMatchObject({ paidCents: 1_000, creditedCents: 0, waived: false })

    const partly = await office.post(`/api/vehicles/${v.id}/moves`, { to: 'closed', version: 2, disposition: 'returned_to_owner' })
    expect(partly.body.reasons[0].message).toMatch(/Balance unpaid: \$[\d,.]+ due/)
    expect(partly.body.reasons[0].message).toContain(formatCents(due - 1_000))

    await office.post(pay(v.id), { idempotencyKey: key(), method: 'card', amountCents: due - 1_000, terminalReference: 'T1-99' }).expect(201)
    const after = await office.post(`/api/vehicles/${v.id}/moves`, { to: 'closed', version: 3, disposition: 'returned_to_owner' })
    expect(after.status).toBe(422)
    expect(after.body.reasons.map((r: { code: string }) => r.code)).not.toContain('balance')
  })

  it('payment_withAReceiptAddress_queuesTheReceiptWithItsPdfInTheSameChange', async () => {
    const { v, office } = await counter()
    const res = await office.post(pay(v.id), { idempotencyKey: key(), method: 'cash', amountCents: 700, receiptEmail: 'walk-in@example.test', receiptLanguage: 'es' }).expect(201)
    const [message] = await app.db.select().from(t.outboundMessages).where(eq(t.outboundMessages.vehicleId, v.id))
    expect(message).toMatchObject({ toAddress: 'walk-in@example.test', purpose: 'receipt', language: 'es', subject: `Su recibo de ${v.stockNumber}` })
    const attachments = await app.db.select().from(t.outboundAttachments).where(eq(t.outboundAttachments.messageId, message!.id))
    expect(attachments).toMatchObject([{ contentType: 'application/pdf' }])
    expect(res.body.payment.receiptEmail).toBe('walk-in@example.test')
  })

  it('payment_withoutAReceiptAddress_queuesNoMessage', async () => {
    const { v, office } = await counter()
    await office.post(pay(v.id), { idempotencyKey: key(), method: 'cash', amountCents: 700, receiptEmail: '' }).expect(201)
    expect(await app.db.select().from(t.outboundMessages).where(eq(t.outboundMessages.vehicleId, v.id))).toHaveLength(0)
  })
})

describe('what the public lookup says is owed', () => {
  it('lookup_afterAPartPayment_answersWhatIsStillOwed', async () => {
    const { v, office, due } = await counter()
    const plate = `P${Math.floor(Math.random() * 1e6)}`
    await app.db.update(t.vehicles).set({ plate, vin: '1M8GDM9AXKP042788' }).where(eq(t.vehicles.id, v.id))
    await office.post(pay(v.id), { idempotencyKey: key(), method: 'cash', amountCents: 5_000 }).expect(201)
    const anonymous = await browserSession(app.app)
    const found = await anonymous.post('/api/vehicle-lookup', { plate, vinTail: '042788' })
    expect(found.body).toMatchObject({ found: true, balanceCents: due - 5_000 })
  })
})

describe('who may take money', () => {
  it.each(['dispatcher', 'technician'] as const)('payment_by%s_isForbidden', async (role) => {
    const staff = await makeStaff(app.db)
    const v = await billedVehicle(app.db, staff.yard.id)
    const s = await signedIn(app.app, staff[role])
    expect((await s.post(pay(v.id), { idempotencyKey: key(), method: 'cash', amountCents: 100 })).status).toBe(403)
    expect((await s.get(`/api/vehicles/${v.id}/invoice`)).status).toBe(403)
    expect((await s.get('/api/cash-drawer')).status).toBe(403)
  })

  it('payment_onAnotherCompanysVehicle_isNotFound', async () => {
    const mine = await makeStaff(app.db)
    const theirs = await makeStaff(app.db)
    const v = await billedVehicle(app.db, theirs.yard.id)
    const s = await signedIn(app.app, mine.office)
    expect((await s.post(pay(v.id), { idempotencyKey: key(), method: 'cash', amountCents: 100 })).status).toBe(404)
    expect((await s.get(`/api/vehicles/${v.id}/invoice`)).status).toBe(404)
  })

  it('manager_takesPaymentsToo', async () => {
    const staff = await makeStaff(app.db)
    const v = await billedVehicle(app.db, staff.yard.id)
    const s = await signedIn(app.app, staff.manager)
    expect((await s.post(pay(v.id), { idempotencyKey: key(), method: 'cash', amountCents: 100 })).status).toBe(201)
  })
})

