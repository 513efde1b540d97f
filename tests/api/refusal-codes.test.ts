import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import { eq } from 'drizzle-orm'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { dayFromIsoDate, isoDate } from '@shared/domain/time'
import { cardPaymentsClient } from '../../server/card-payments/index'
import { startFakePaymentService, type FakePaymentService } from '../../server/fakes/index'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { billedVehicle, key } from '../helpers/billing'
import { DAY, sampleVersion } from '../helpers/board'
import { makeStaff, makeVehicle } from '../helpers/factories'

// A refusal carries a code and its parameters beside the English sentence, so the client says it in the
// reader's language (shared/messages/<locale>/refusals.json); the sentence stays for API clients.
let t_: TestApp
beforeAll(async () => {
  t_ = await makeTestApp()
})
afterAll(() => t_.close())

const catalog = (locale: string) => JSON.parse(readFileSync(join(import.meta.dirname, `../../shared/messages/${locale}/refusals.json`), 'utf8')).refusals as Record<string, unknown>
const spoken = (code: unknown) => ['en', 'es'].every((l) => typeof catalog(l)[String(code)] === 'string')

describe('refusal codes in the answers', () => {
  it('a stale move answers 409 with movedElsewhere, the stock number and the column it is in now', async () => {
    const staff = await makeStaff(t_.db)
    const v = await makeVehicle(t_.db, staff.yard.id)
    const s = await signedIn(t_.app, staff.dispatcher)
    expect((await s.post(`/api/vehicles/${v.id}/moves`, { to: 'teardown', version: 1 })).status).toBe(200)
    const stale = await s.post(`/api/vehicles/${v.id}/moves`, { to: 'teardown', version: 1 })
    expect(stale.status).toBe(409)
    expect(stale.body).toMatchObject({ code: 'movedElsewhere', params: { stock: v.stockNumber, column: 'teardown' } })
    expect(stale.body.error).toContain(v.stockNumber)
    expect(spoken(stale.body.code)).toBe(true)
  })

  it('a hold lifted twice answers 409 with holdLifted and the day it was lifted', async () => {
    const staff = await makeStaff(t_.db)
    const v = await makeVehicle(t_.db, staff.yard.id, { state: 'storage' })
    const d = await signedIn(t_.app, staff.dispatcher)
    const set = await d.post(`/api/vehicles/${v.id}/holds`, { kind: 'dispute', note: 'Owner disputes the tow' })
    expect(set.status).toBe(201)
    const holdId = set.body.holds[0].id
    expect((await d.post(`/api/vehicles/${v.id}/holds/${holdId}/lift`, { reason: 'Settled' })).status).toBe(200)
    const again = await d.post(`/api/vehicles/${v.id}/holds/${holdId}/lift`, { reason: 'Settled' })
    expect(again.status).toBe(409)
    expect(again.body).toMatchObject({ code: 'holdLifted', params: { date: expect.stringMatching(/^\d{4}-\d{2}-\d{2}$/) } })
    expect(spoken(again.body.code)).toBe(true)
  })

  it('a role the access table refuses answers 403 with forbidden; an unknown vehicle 404 with notFound', async () => {
    const staff = await makeStaff(t_.db)
    const tech = await signedIn(t_.app, staff.technician)
    const refused = await tech.post('/api/users', { email: 'new@example.test', name: 'New', role: 'office' })
    expect(refused.status).toBe(403)
    expect(refused.body.code).toBe('forbidden')
    const missing = await (await signedIn(t_.app, staff.manager)).get('/api/vehicles/00000000-0000-4000-8000-000000000000')
    expect(missing.status).toBe(404)
    expect(missing.body.code).toBe('notFound')
    expect([refused.body.code, missing.body.code].every(spoken)).toBe(true)
  })

  it('a computation’s refusal (a release before arrival) answers its DomainError code, worded under refusals', async () => {
    await sampleVersion(t_.db, 'california-sample')
    const staff = await makeStaff(t_.db)
    const s = await signedIn(t_.app, staff.office)
    const res = await s.post('/api/quotes/storage', {
      ruleSetId: 'california-sample',
      stay: { arrivedAt: '2026-03-02T09:00:00-08:00', releasedAt: '2026-03-01T09:00:00-08:00', vehicleClass: 'standard' },
      asOf: '2026-03-04T12:00:00-08:00',
    })
    expect(res.status).toBe(400)
    expect(res.body).toMatchObject({ error: 'The release time is before the arrival time.', code: 'release-before-arrival', issues: [{ path: 'releasedAt', message: 'The release time is before the arrival time.' }] })
    expect(spoken(res.body.code)).toBe(true)
    expect(catalog('es')['release-before-arrival']).toBe('La hora de entrega es anterior a la hora de llegada.')
  })

  it('a quote under a rule set that does not exist answers noRuleSetNamed with its name, and the field’s own code', async () => {
    const staff = await makeStaff(t_.db)
    const s = await signedIn(t_.app, staff.office)
    const res = await s.post('/api/quotes/storage', { ruleSetId: 'atlantis-sample', stay: { arrivedAt: '2026-03-02T09:00:00-08:00', vehicleClass: 'standard' }, asOf: '2026-03-04T12:00:00-08:00' })
    expect(res.status).toBe(400)
    expect(res.body).toMatchObject({ error: 'There is no rule set "atlantis-sample".', code: 'noRuleSetNamed', params: { name: 'atlantis-sample' }, issues: [{ path: 'ruleSetId', code: 'quotes.noSuchRuleSet' }] })
    expect(String(catalog('es').noRuleSetNamed).replace('{name}', res.body.params.name)).toBe('No hay reglas llamadas «atlantis-sample».')
  })
})

describe('refusal codes from the money, the sale date and the rule sets', () => {
  let fake: FakePaymentService
  let cardApp: TestApp
  beforeAll(async () => {
    fake = await startFakePaymentService()
    cardApp = await makeTestApp({ cardPayments: cardPaymentsClient({ secretKey: fake.secretKey, webhookSecret: fake.webhookSecret, host: fake.host, port: fake.port }) })
    fake.deliverTo(async (payload, signature) => (await request(cardApp.app).post('/api/card-payments/webhook').set('content-type', 'application/json; charset=utf-8').set('stripe-signature', signature).send(payload)).status)
  })
  afterAll(async () => {
    await cardApp.close()
    await fake.close()
  })
  const es = catalog('es') as Record<string, string> & { cardReasons: Record<string, string> }

  it('a card refund the bank declines (decline code insufficient_funds) answers cardRefundNotMade with our reason, never the code', async () => {
    const staff = await makeStaff(cardApp.db)
    const v = await billedVehicle(cardApp.db, staff.yard.id)
    const office = await signedIn(cardApp.app, staff.office)
    const opened = await office.post(`/api/vehicles/${v.id}/card-checkouts`, { idempotencyKey: key(), amountCents: 5_000 }).expect(201)
    expect((await fetch(opened.body.checkout.url, { method: 'POST', body: new URLSearchParams({ card: '4242424242424242' }), redirect: 'manual' })).status).toBe(303)
    const [payment] = await cardApp.db.select().from(t.payments).where(eq(t.payments.vehicleId, v.id))
    fake.declineRefunds('insufficient_funds')
    try {
      const manager = await signedIn(cardApp.app, staff.manager)
      const res = await manager.post(`/api/vehicles/${v.id}/card-refunds`, { idempotencyKey: key(), paymentId: payment!.id, amountCents: 1_000, reason: 'Charged twice' })
      expect(res.status).toBe(502)
      expect(res.body).toMatchObject({ code: 'cardRefundNotMade', params: { cardReason: 'funds' } })
      expect(res.body.error).toBe('The card payment service did not refund it: Your card was declined.. Nothing was recorded; try again.')
      expect(JSON.stringify(res.body.params)).not.toContain('insufficient_funds')
      // The Spanish the client words it with (src/composables/refusal-words.ts fills {cardReason}).
      expect(es.cardRefundNotMade).toContain('{cardReason}')
      expect(es.cardReasons.funds).toBe('El banco dice que no hay fondos suficientes en la cuenta.')
    } finally {
      fake.declineRefunds(null)
    }
  })

  it('a refund over what was paid answers refundMoreThanPaid with the amount in cents, and its field the same amount', async () => {
    const staff = await makeStaff(t_.db)
    const v = await billedVehicle(t_.db, staff.yard.id)
    await (await signedIn(t_.app, staff.office)).post(`/api/vehicles/${v.id}/payments`, { idempotencyKey: key(), method: 'cash', amountCents: 6_000 }).expect(201)
    const res = await (await signedIn(t_.app, staff.manager)).post(`/api/vehicles/${v.id}/refunds`, { idempotencyKey: key(), method: 'cash', amountCents: 6_001, reason: 'Overcharged' })
    expect(res.status).toBe(400)
    expect(res.body).toMatchObject({ error: 'A refund cannot be more than was paid: $60.00 was paid and not yet refunded.', code: 'refundMoreThanPaid', params: { paidCents: 6_000 } })
    expect(res.body.issues).toEqual([{ path: 'amountCents', message: 'At most $60.00 can be refunded.', code: 'billing.refundAtMost', params: { paidCents: 6_000 } }])
    expect(es.refundMoreThanPaid).toBe('Un reembolso no puede ser mayor que lo pagado: se pagaron {paidCents} que todavía no se han reembolsado.')
  })

  it('a sale day earlier than the law allows answers saleTooEarly with the earliest day (Cal. Civ. Code § 3071, as the sample cites it)', async () => {
    const staff = await makeStaff(t_.db)
    const ruleSetVersionId = await sampleVersion(t_.db, 'california-sample')
    const v = await makeVehicle(t_.db, staff.yard.id, { state: 'storage', ruleSetVersionId, estimatedValueCents: 650_000, estimatedValueSource: 'test', arrivedAt: new Date(Date.now() - 40 * DAY) })
    const s = await signedIn(t_.app, staff.office)
    const earliest: string = (await s.get(`/api/vehicles/${v.id}/sale-date`).expect(200)).body.earliest
    const res = await s.put(`/api/vehicles/${v.id}/sale-date`, { day: isoDate(dayFromIsoDate(earliest) - 1) })
    expect(res.status).toBe(400)
    expect(res.body).toMatchObject({ code: 'saleTooEarly', params: { date: earliest }, earliest })
    expect(res.body.issues).toEqual([{ path: 'day', message: res.body.error }])
    expect(es.saleTooEarly).toBe('La fecha más temprana que permite la ley para la venta es el {date}.')
  })

  it('a rule set the company cannot see answers noSuchRuleSet, naming the field with its own code', async () => {
    const staff = await makeStaff(t_.db)
    const res = await (await signedIn(t_.app, staff.manager)).put('/api/settings/yard-rule-set', { ruleSetId: 'no-such-rule-set' })
    expect(res.status).toBe(422)
    expect(res.body).toMatchObject({ error: 'There is no such rule set.', code: 'noSuchRuleSet' })
    expect(res.body.issues).toEqual([{ path: 'ruleSetId', message: 'Choose one of the rule sets listed.', code: 'ruleSetEditor.chooseListed' }])
    expect(es.noSuchRuleSet).toBe('Esas reglas no existen.')
  })
})
