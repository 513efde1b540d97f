import { createHash } from 'node:crypto'
import { createServer, type AddressInfo } from 'node:net'
import { eq, sql } from 'drizzle-orm'
import { PDFDocument, StandardFonts } from 'pdf-lib'
import { pino } from 'pino'
import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from 'vitest'
import * as t from '@db/schema'
import { startLocalSmtp, type LocalSmtp } from '../../server/fakes/index'
import { OutboxWorker, queueMessage, smtpTransport, type WorkerOptions } from '../../server/outbox/index'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { makeStaff, makeVehicle } from '../helpers/factories'
import { parseMail } from '../helpers/mime'
import { pdfText } from '../helpers/pdf'

let app: TestApp
let smtp: LocalSmtp
let staff: Awaited<ReturnType<typeof makeStaff>>
const log = pino({ level: process.env.TEST_LOG ?? 'silent' })
const workers: OutboxWorker[] = []

beforeAll(async () => {
  app = await makeTestApp()
  smtp = await startLocalSmtp()
})
afterAll(async () => {
  await Promise.all(workers.map((w) => w.stop()))
  await smtp.close()
  await app.close()
})
beforeEach(async () => {
  staff = await makeStaff(app.db)
  smtp.received.length = 0
})

function worker(url = smtp.url, options: Partial<WorkerOptions> = {}) {
  const w = new OutboxWorker(app.db, smtpTransport(url), { where: 'nowhere', put: notUsed, get: notUsed, delete: notUsed, list: notUsed, check: notUsed }, log, { from: 'Test Yard <yard@test.example>', ...options })
  workers.push(w)
  return w
}
const notUsed = () => Promise.reject(new Error('no stored files in these tests'))

async function samplePdf(line: string) {
  const doc = await PDFDocument.create()
  const page = doc.addPage([300, 200])
  page.drawText(line, { x: 20, y: 100, size: 12, font: await doc.embedFont(StandardFonts.Helvetica) })
  return doc.save()
}

const sha = (b: Uint8Array) => createHash('sha256').update(b).digest('hex')

async function queue(overrides: Partial<Parameters<typeof queueMessage>[3]> = {}) {
  return queueMessage(app.db, staff.company.id, staff.office.id, {
    to: 'owner@test.example',
    toName: 'Rosa Quintero',
    subject: 'Your vehicle is at Test Yard',
    text: 'Your vehicle was towed to our yard. The letter is attached.',
    purpose: 'test',
    ...overrides,
  })
}

const rowOf = async (id: string) => (await app.db.select().from(t.outboundMessages).where(eq(t.outboundMessages.id, id)))[0]!

describe('sending from the outbox', () => {
  it('a queued message with a PDF reaches the SMTP server with its recipient, subject, body and the same PDF bytes', async () => {
    const pdf = await samplePdf('First notice TST-0001')
    const vehicle = await makeVehicle(app.db, staff.yard.id)
    const queued = await queue({
      subject: 'Aviso: su vehículo está en el depósito',
      text: 'Su vehículo fue remolcado. ¿Preguntas? Llámenos.',
      html: '<p>Su vehículo fue remolcado.</p>',
      language: 'es',
      vehicleId: vehicle.id,
      attachments: [{ filename: 'aviso.pdf', contentType: 'application/pdf', content: pdf }],
    })
    expect(queued.status).toBe('queued')

    expect(await worker().drain()).toBe(1)

    expect(smtp.received).toHaveLength(1)
    const got = smtp.received[0]!
    expect(got.to).toEqual(['owner@test.example'])
    expect(got.from).toBe('yard@test.example')
    const mail = parseMail(got.raw)
    expect(mail.subject).toBe('Aviso: su vehículo está en el depósito')
    expect(mail.headers.get('message-id')).toBe(queued.messageId)
    expect(mail.headers.get('content-language')).toBe('es')
    expect(mail.text?.trim()).toBe('Su vehículo fue remolcado. ¿Preguntas? Llámenos.')
    expect(mail.html).toContain('<p>Su vehículo fue remolcado.</p>')
    expect(mail.attachments.map((a) => [a.filename, a.contentType])).toEqual([['aviso.pdf', 'application/pdf']])
    expect(sha(mail.attachments[0]!.content)).toBe(sha(pdf))
    expect(await pdfText(mail.attachments[0]!.content)).toContain('First notice TST-0001')

    const row = await rowOf(queued.id)
    expect(row).toMatchObject({ status: 'sent', attempts: 1, lastError: null, claimToken: null })
    expect(row.smtpResponse).toMatch(/^250 /)
  })

  it('a crash between claiming and sending loses nothing: the job waits out its lease, then is sent exactly once', async () => {
    const queued = await queue()
    // Worker A claims the job and never gets an answer from its SMTP connection: as good as dead.
    const hung = new OutboxWorker(app.db, { send: () => new Promise(() => {}), close() {} }, { where: 'nowhere', put: notUsed, get: notUsed, delete: notUsed, list: notUsed, check: notUsed }, log, { from: 'yard@test.example' })
    void hung.drain()
    await vi.waitFor(async () => expect((await rowOf(queued.id)).status).toBe('sending'))
    const restarted = worker()

    expect(await restarted.drain()).toBe(0)
    expect(smtp.received).toHaveLength(0)
    expect((await rowOf(queued.id)).status).toBe('sending')

    // The lease runs out (moved into the past rather than waited for).
    await app.db.update(t.outboundMessages).set({ leaseUntil: sql`now() - interval '1 second'` as unknown as Date }).where(eq(t.outboundMessages.id, queued.id))
    expect(await restarted.drain()).toBe(1)
    expect(await restarted.drain()).toBe(0)
    expect(await worker().drain()).toBe(0)

    expect(smtp.received).toHaveLength(1)
    expect(parseMail(smtp.received[0]!.raw).headers.get('message-id')).toBe(queued.messageId)
    expect(await rowOf(queued.id)).toMatchObject({ status: 'sent', attempts: 2 })
  })

  it('two workers draining one queue at once send each message exactly once', async () => {
    const ids = []
    for (let i = 0; i < 6; i++) ids.push((await queue({ to: `owner${i}@test.example` })).id)
    const counts = await Promise.all([worker().drain(), worker().drain()])
    expect(counts[0]! + counts[1]!).toBe(6)
    expect(smtp.received.map((m) => m.to[0]).sort()).toEqual(ids.map((_, i) => `owner${i}@test.example`).sort())
  })

  it('a recipient the server refuses (550) is marked failed at once with the reason, and a retry sends it', async () => {
    const queued = await queue({ to: 'nobody@yard.invalid' })
    expect(await worker().drain()).toBe(0)
    const failed = await rowOf(queued.id)
    expect(failed).toMatchObject({ status: 'failed', attempts: 1 })
    expect(failed.lastError).toMatch(/550/)
    expect(failed.lastError).toMatch(/no such mailbox/)
    expect(smtp.received).toHaveLength(0)
  })

  it('an SMTP server that cannot be reached is tried again later, then marked failed; the office retries it and it is sent', async () => {
    const closedPort = await freePort()
    const unreachable = worker(`smtp://127.0.0.1:${closedPort}`, { maxAttempts: 2 })
    const queued = await queue()

    expect(await unreachable.drain()).toBe(0)
    const waiting = await rowOf(queued.id)
    expect(waiting).toMatchObject({ status: 'queued', attempts: 1 })
    expect(waiting.lastError).toMatch(/ECONNREFUSED/)
    expect(waiting.nextAttemptAt.getTime()).toBeGreaterThan(Date.now())

    await app.db.update(t.outboundMessages).set({ nextAttemptAt: sql`now()` as unknown as Date }).where(eq(t.outboundMessages.id, queued.id))
    expect(await unreachable.drain()).toBe(0)
    const failed = await rowOf(queued.id)
    expect(failed).toMatchObject({ status: 'failed', attempts: 2 })
    expect(failed.lastError).toMatch(/ECONNREFUSED/)

    const office = await signedIn(app.app, staff.office)
    const listed = (await office.get('/api/outbox?status=failed').expect(200)).body
    expect(listed.rows.map((r: { id: string }) => r.id)).toEqual([queued.id])
    expect(listed.rows[0].lastError).toMatch(/ECONNREFUSED/)
    expect(listed.counts).toMatchObject({ failed: 1, sent: 0 })

    const retried = await office.post(`/api/outbox/${queued.id}/retry`)
    expect(retried.status, JSON.stringify(retried.body)).toBe(200)
    expect(retried.body).toMatchObject({ status: 'queued', attempts: 0 })
    expect(await worker().drain()).toBe(1)
    expect(smtp.received).toHaveLength(1)
    expect(await rowOf(queued.id)).toMatchObject({ status: 'sent', lastError: null, retriedById: staff.office.id })

    const again = await office.post(`/api/outbox/${queued.id}/retry`)
    expect(again.status).toBe(409)
    expect(again.body.error).toBe('This message is sent: only a failed message can be sent again.')
  })
})

describe('the outbox API', () => {
  it('lists messages newest first with paging, and shows one with its body and attachments', async () => {
    const pdf = await samplePdf('Receipt')
    const first = await queue({ subject: 'First' })
    const second = await queue({ subject: 'Second', html: '<p>Second</p>', attachments: [{ filename: 'receipt.pdf', contentType: 'application/pdf', content: pdf }] })
    await app.db.update(t.outboundMessages).set({ createdAt: new Date(Date.now() - 60_000) }).where(eq(t.outboundMessages.id, first.id))
    const manager = await signedIn(app.app, staff.manager)

    const page1 = (await manager.get('/api/outbox?pageSize=25').expect(200)).body
    expect(page1.rows.map((r: { subject: string }) => r.subject)).toEqual(['Second', 'First'])
    expect(page1).toMatchObject({ total: 2, page: 1, pageSize: 25, counts: { queued: 2, sending: 0, sent: 0, failed: 0 } })
    expect(page1.rows[0]).toMatchObject({ to: 'owner@test.example', toName: 'Rosa Quintero', queuedBy: 'Test office', attachmentCount: 1, status: 'queued' })
    expect((await manager.get('/api/outbox?page=2').expect(200)).body.rows).toEqual([])

    const one = (await manager.get(`/api/outbox/${second.id}`).expect(200)).body
    expect(one).toMatchObject({ subject: 'Second', html: '<p>Second</p>', messageId: second.messageId })
    expect(one.attachments).toEqual([{ id: expect.any(String), filename: 'receipt.pdf', contentType: 'application/pdf', bytes: pdf.length }])
    const file = await manager.get(`/api/outbox/${second.id}/attachments/${one.attachments[0].id}`).buffer(true).parse((res, done) => {
      const chunks: Buffer[] = []
      res.on('data', (c: Buffer) => chunks.push(c))
      res.on('end', () => done(null, Buffer.concat(chunks)))
    })
    expect(file.status).toBe(200)
    expect(file.headers['content-type']).toBe('application/pdf')
    expect(file.headers['content-security-policy']).toMatch(/sandbox/)
    expect(sha(file.body as Buffer)).toBe(sha(pdf))
  })

  it('refuses a bad filter and page size with the reason', async () => {
    const manager = await signedIn(app.app, staff.manager)
    const res = await manager.get('/api/outbox?status=lost&pageSize=7')
    expect(res.status).toBe(400)
    expect(res.body.issues.map((i: { path: string }) => i.path).sort()).toEqual(['pageSize', 'status'])
  })

  it("another company's messages are neither listed nor found nor retried", async () => {
    const other = await makeStaff(app.db)
    const theirs = await queueMessage(app.db, other.company.id, other.office.id, { to: 'x@test.example', subject: 'Theirs', text: 'Theirs', purpose: 'test' })
    await app.db.update(t.outboundMessages).set({ status: 'failed', lastError: 'x' }).where(eq(t.outboundMessages.id, theirs.id))
    const manager = await signedIn(app.app, staff.manager)
    expect((await manager.get('/api/outbox').expect(200)).body.total).toBe(0)
    expect((await manager.get(`/api/outbox/${theirs.id}`)).status).toBe(404)
    expect((await manager.post(`/api/outbox/${theirs.id}/retry`)).status).toBe(404)
    expect((await rowOf(theirs.id)).status).toBe('failed')
  })

  it.each([
    ['manager', 200],
    ['office', 200],
    ['dispatcher', 403],
    ['technician', 403],
  ] as const)('the outbox is open to %s: %i', async (role, status) => {
    const queued = await queue()
    await app.db.update(t.outboundMessages).set({ status: 'failed', lastError: 'refused' }).where(eq(t.outboundMessages.id, queued.id))
    const s = await signedIn(app.app, staff[role])
    expect((await s.get('/api/outbox')).status).toBe(status)
    expect((await s.get(`/api/outbox/${queued.id}`)).status).toBe(status)
    expect((await s.post(`/api/outbox/${queued.id}/retry`)).status).toBe(status)
    expect((await rowOf(queued.id)).status).toBe(status === 200 ? 'queued' : 'failed')
  })
})

function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const s = createServer().listen(0, '127.0.0.1', () => {
      const { port } = s.address() as AddressInfo
      s.close(() => resolve(port))
    })
  })
}
