import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { eq } from 'drizzle-orm'
import { pino } from 'pino'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { openDatabase, type DatabaseHandle } from '@db/client'
import * as t from '@db/schema'
import { createApp } from '../../server/app'
import { cardPaymentsClient } from '../../server/card-payments/index'
import { startFakePaymentService, startLocalSmtp, type FakePaymentService, type LocalSmtp } from '../../server/fakes/index'
import { localFileStore } from '../../server/files/index'
import { postgresBus, type LiveBus } from '../../server/live/index'
import { OutboxWorker, smtpTransport } from '../../server/outbox/index'
import { makePostgresDatabase, TEST_HISTORY_KEY, type BrowserSession } from '../helpers/app'
import { billedVehicle, key } from '../helpers/billing'
import { makeStaff, makeVehicle } from '../helpers/factories'
import { fetchSession, listening, openStream } from '../helpers/live'
import { dropDatabase } from '../helpers/postgres'
import { completeRelease, vehicleInRelease } from '../helpers/release'

// Issue 15, "stateless servers" and "one sender": two app servers, each with its own connection pool,
// live bus (LISTEN/NOTIFY) and e-mail worker, on two ports against one PostgreSQL database. Whatever
// one server decides, the other must know from the database alone.
let database: Awaited<ReturnType<typeof makePostgresDatabase>>
let smtp: LocalSmtp
// One payment service for both servers, as the real one is; its webhooks go to A, a replay of them to B.
let payments: FakePaymentService
const webhooks: { payload: string; signature: string }[] = []
const filesDir = mkdtempSync(path.join(tmpdir(), 'holdfast-two-servers-'))
const servers: { url: string; handle: DatabaseHandle; bus: LiveBus; outbox: OutboxWorker; close: () => Promise<void> }[] = []

beforeAll(async () => {
  database = await makePostgresDatabase('t_two')
  smtp = await startLocalSmtp()
  payments = await startFakePaymentService()
  for (let i = 0; i < 2; i++) {
    const handle = await openDatabase({ kind: 'postgres', url: database.url })
    await handle.migrate()
    const log = pino({ level: process.env.TEST_LOG ?? 'silent' })
    const bus = await postgresBus(database.url, log)
    const files = localFileStore(filesDir)
    const outbox = new OutboxWorker(handle.db, smtpTransport(smtp.url), files, log, { from: 'yard@test.example', pollMs: 200 })
    const app = createApp({
      db: handle.db, historyKey: TEST_HISTORY_KEY, log, live: bus, files, version: 'test',
      sessionSecret: 'test-secret-that-is-long-enough-for-signing',
      signInLimits: { perAccount: 5, perIp: 1000, windowMs: 15 * 60_000 },
      kickOutbox: () => outbox.kick(),
      publicUrl: 'https://yard.test.example',
      cardPayments: cardPaymentsClient({ secretKey: payments.secretKey, webhookSecret: payments.webhookSecret, host: payments.host, port: payments.port }),
    })
    outbox.start()
    const listener = await listening(app)
    servers.push({ url: listener.url, handle, bus, outbox, close: listener.close })
  }
  payments.deliverTo(async (payload, signature) => {
    webhooks.push({ payload, signature })
    return (await postWebhook(A, payload, signature)).status
  })
})

const postWebhook = (on: number, payload: string, signature: string) =>
  fetch(`${servers[on]!.url}/api/card-payments/webhook`, { method: 'POST', headers: { 'content-type': 'application/json; charset=utf-8', 'stripe-signature': signature }, body: payload })

afterAll(async () => {
  for (const s of servers) {
    await s.close()
    await s.outbox.stop()
    await s.bus.close()
    await s.handle.close()
  }
  await smtp?.close()
  await payments?.close()
  await dropDatabase(database.adminClient, database.name)
  await database.adminClient.end()
  rmSync(filesDir, { recursive: true, force: true })
})

const [A, B] = [0, 1] as const
const db = () => servers[A]!.handle.db

/** supertest against one server's port, with a session cookie and CSRF token, like a browser tab. */
async function tab(on: number, user: { email: string; password: string }): Promise<BrowserSession> {
  const agent = request.agent(servers[on]!.url)
  let csrf: string = (await agent.get('/api/session').expect(200)).body.csrfToken
  const r = await agent.post('/api/session').set('x-csrf-token', csrf).send(user)
  if (r.status !== 200) throw new Error(`sign-in failed in test setup: ${r.status}`)
  csrf = r.body.csrfToken
  return {
    agent,
    csrf,
    signIn: () => Promise.reject(new Error('signed in already')),
    get: (url: string) => agent.get(url),
    post: (url: string, body?: object) => agent.post(url).set('x-csrf-token', csrf).send(body),
    put: (url: string, body?: object) => agent.put(url).set('x-csrf-token', csrf).send(body),
    patch: (url: string, body?: object) => agent.patch(url).set('x-csrf-token', csrf).send(body),
    del: (url: string) => agent.delete(url).set('x-csrf-token', csrf),
  } as unknown as BrowserSession
}

describe('two app servers on one PostgreSQL', () => {
  it('a sign-in on A is valid on B, and a sign-out on B ends it on A', async () => {
    const staff = await makeStaff(db())
    const s = await fetchSession(servers[A]!.url, staff.office)
    const onB = await fetch(`${servers[B]!.url}/api/session`, { headers: { cookie: s.cookie } })
    expect(((await onB.json()) as { user: { id: string } | null }).user?.id).toBe(staff.office.id)
    expect((await s.signOut(servers[B]!.url)).status).toBe(204)
    const onA = await fetch(`${servers[A]!.url}/api/session`, { headers: { cookie: s.cookie } })
    expect(((await onA.json()) as { user: unknown }).user ?? null).toBeNull()
  })

  it('failed sign-ins counted on A hold the account on B', async () => {
    const staff = await makeStaff(db())
    const wrong = { email: staff.office.email, password: 'not the password at all' }
    for (let i = 0; i < 5; i++) {
      const a = request.agent(servers[i % 2]!.url)
      const csrf = (await a.get('/api/session')).body.csrfToken
      expect((await a.post('/api/session').set('x-csrf-token', csrf).send(wrong)).status).toBe(401)
    }
    const b = request.agent(servers[B]!.url)
    const csrf = (await b.get('/api/session')).body.csrfToken
    expect((await b.post('/api/session').set('x-csrf-token', csrf).send({ email: staff.office.email, password: staff.office.password })).status).toBe(429)
  })

  it('a move on A reaches a board stream connected to B', async () => {
    const staff = await makeStaff(db())
    const v = await makeVehicle(db(), staff.yard.id)
    const mover = await fetchSession(servers[A]!.url, staff.manager)
    const watcher = await fetchSession(servers[B]!.url, staff.office)
    const stream = await openStream(servers[B]!.url, watcher.cookie)
    await stream.first()
    expect((await mover.post(`/api/vehicles/${v.id}/moves`, { to: 'teardown', version: 1 })).status).toBe(200)
    const got = await stream.next((m) => m.type === 'card')
    expect(got.body.card).toMatchObject({ id: v.id, state: 'teardown', version: 2 })
    stream.close()
  })

  it('a counter payment retried on B with the key A answered is taken once, with one receipt', async () => {
    const staff = await makeStaff(db())
    const [a, b] = [await fetchSession(servers[A]!.url, staff.office), await fetchSession(servers[B]!.url, staff.office)]
    const v = await billedVehicle(db(), staff.yard.id)
    const body = { idempotencyKey: key(), method: 'cash', amountCents: 2_500, receiptEmail: 'retry@test.example' }
    const first = await a.post(`/api/vehicles/${v.id}/payments`, body)
    expect(first.status).toBe(201)
    const again = await b.post(`/api/vehicles/${v.id}/payments`, body)
    expect(again.status).toBe(200)
    expect(((await again.json()) as { payment: { id: string } }).payment.id).toBe(((await first.json()) as { payment: { id: string } }).payment.id)
    expect(await db().select().from(t.payments).where(eq(t.payments.vehicleId, v.id))).toHaveLength(1)
    expect(await db().select().from(t.outboundMessages).where(eq(t.outboundMessages.vehicleId, v.id))).toHaveLength(1)
  })

  it('a card checkout retried on B with the key A answered opens one page, and its webhook replayed to B records one payment', async () => {
    const staff = await makeStaff(db())
    const [a, b] = [await fetchSession(servers[A]!.url, staff.office), await fetchSession(servers[B]!.url, staff.office)]
    const v = await billedVehicle(db(), staff.yard.id)
    const body = { idempotencyKey: key(), amountCents: 3_000 }
    const first = await a.post(`/api/vehicles/${v.id}/card-checkouts`, body)
    expect(first.status).toBe(201)
    const opened = ((await first.json()) as { checkout: { id: string; url: string } }).checkout
    const again = await b.post(`/api/vehicles/${v.id}/card-checkouts`, body)
    expect(again.status).toBe(200)
    expect(((await again.json()) as { checkout: object }).checkout).toMatchObject({ id: opened.id, url: opened.url, replayed: true })
    const paid = await fetch(opened.url, { method: 'POST', body: new URLSearchParams({ card: '4242 4242 4242 4242' }), redirect: 'manual' })
    expect(paid.status).toBe(303)
    const sent = webhooks.at(-1)!
    expect((await postWebhook(B, sent.payload, sent.signature)).status).toBe(200)
    const rows = await db().select().from(t.payments).where(eq(t.payments.vehicleId, v.id))
    expect(rows.map((p) => [p.method, p.amountCents])).toEqual([['card', 3_000]])
  })

  it('a gate pass used on A is refused on B', async () => {
    const staff = await makeStaff(db())
    const s = await tab(A, staff.office)
    const { vehicle, items } = await vehicleInRelease(db(), staff.yard.id)
    await completeRelease(s, vehicle.id, items.map((i) => i.id))
    const issued = await s.post(`/api/vehicles/${vehicle.id}/release/gate-pass`)
    expect(issued.status).toBe(201)
    const pass = issued.body.code as string
    expect((await s.post('/api/gate/record-out', { pass })).status).toBe(200)
    const other = await tab(B, staff.manager)
    const again = await other.post('/api/gate/record-out', { pass })
    expect(again.status).toBe(410)
    expect(again.body).toMatchObject({ reason: 'used' })
  })

  it('each e-mail is sent exactly once, though both servers run a worker', async () => {
    const staff = await makeStaff(db())
    const before = smtp.received.length
    const clerks = [await fetchSession(servers[A]!.url, staff.office), await fetchSession(servers[B]!.url, staff.manager)]
    const to: string[] = []
    for (let i = 0; i < 12; i++) {
      const v = await billedVehicle(db(), staff.yard.id)
      to.push(`owner${i}@test.example`)
      const r = await clerks[i % 2]!.post(`/api/vehicles/${v.id}/payments`, { idempotencyKey: key(), method: 'cash', amountCents: 1_000, receiptEmail: to[i] })
      expect(r.status).toBe(201)
    }
    // Wait on the database's own signal: every message of this company sent (or the test's time-out).
    const mine = () => db().select({ status: t.outboundMessages.status }).from(t.outboundMessages).where(eq(t.outboundMessages.companyId, staff.company.id))
    while ((await mine()).some((m) => m.status !== 'sent')) await new Promise((r) => setTimeout(r, 100))
    // Both workers look once more: nothing is left to take.
    expect(await Promise.all(servers.map((s) => s.outbox.drain()))).toEqual([0, 0])
    const delivered = smtp.received.slice(before).map((m) => m.to[0]).sort()
    expect(delivered).toEqual([...to].sort())
  })
})
