import { eq } from 'drizzle-orm'
import { pino } from 'pino'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { historyOf } from '@db/history'
import * as t from '@db/schema'
import { startLocalSmtp, type LocalSmtp } from '../../server/fakes/index'
import { OutboxWorker, smtpTransport } from '../../server/outbox/index'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { makeStaff, makeVehicle } from '../helpers/factories'
import { historyCount, sampleVersion } from '../helpers/board'
import { parseMail } from '../helpers/mime'
import { pdfText } from '../helpers/pdf'

// Notice letters (issue 10): made from the rule set's timeline for every owner and lienholder, in the
// recipient's language; sent by certified mail (the mailing day starts or meets the clocks) and/or
// e-mail (the outbox, the PDF attached); every notice, PDF and sending a history event.
let app: TestApp
let smtp: LocalSmtp
beforeAll(async () => {
  app = await makeTestApp({ publicUrl: 'https://yard.example.test' })
  smtp = await startLocalSmtp()
})
afterAll(async () => {
  await smtp.close()
  await app.close()
})

const ownerEs = {
  role: 'registered_owner',
  name: 'Marisol Quintero',
  street: '418 Alder Row',
  city: 'Orrin Flats',
  state: 'FL',
  zip: '32801',
  email: 'marisol@example.test',
  language: 'es',
  source: 'vehicle_papers',
}
const bank = { role: 'lienholder', name: 'Harbor Tide Credit Union', street: '90 Quay St', city: 'Port Ellery', state: 'FL', zip: '32034', language: 'en', source: 'records_request', sourceDate: '2026-12-01' }

// Stored on Monday 30 Nov 2026 (09:00 in the yard's zone, America/Los_Angeles).
const ARRIVED = new Date('2026-11-30T17:00:00Z')

async function fixture(more: { contacts?: object[] } = {}) {
  const staff = await makeStaff(app.db)
  const ruleSetVersionId = await sampleVersion(app.db, 'florida-sample')
  const vehicle = await makeVehicle(app.db, staff.yard.id, {
    state: 'storage',
    ruleSetVersionId,
    arrivedAt: ARRIVED,
    vin: '1G4AH59H45G118341',
    plate: '7KQM214',
    plateState: 'FL',
    year: 2013,
    make: 'Halvard',
    model: 'Finch',
  })
  const office = await signedIn(app.app, staff.office)
  for (const c of more.contacts ?? [ownerEs, bank]) expect((await office.post(`/api/vehicles/${vehicle.id}/contacts`, c)).status).toBe(201)
  return { staff, vehicle, office }
}

const today = (zone: string) => new Date().toLocaleDateString('en-CA', { timeZone: zone })

async function pdfOf(fileId: string, session: Awaited<ReturnType<typeof signedIn>>) {
  const res = await session.agent.get(`/api/files/${fileId}`).buffer(true).parse((r, done) => {
    const chunks: Buffer[] = []
    r.on('data', (c: Buffer) => chunks.push(c))
    r.on('end', () => done(null, Buffer.concat(chunks)))
  })
  expect(res.status).toBe(200)
  expect(res.headers['content-type']).toMatch(/application\/pdf/)
  return new Uint8Array(res.body as Buffer)
}

describe('making notice letters', () => {
  it('plans the first notice from the Florida sample and makes one letter per owner and lienholder, in their language', async () => {
    const { vehicle, office } = await fixture()
    const page = await office.get(`/api/vehicles/${vehicle.id}/notices`)
    expect(page.status).toBe(200)
    // Fla. Stat. § 713.78(4) as the sample reads it: notice of lien within 7 business days of storage —
    // Mon 30 Nov 2026 + 7 business days = Wed 9 Dec 2026 (no holiday between).
    expect(page.body.planned).toEqual([expect.objectContaining({ kind: 'owner_notice', dueDate: '2026-12-09', mailedAt: null })])

    const made = await office.post(`/api/vehicles/${vehicle.id}/notices`, { kind: 'owner_notice' })
    expect(made.status, JSON.stringify(made.body)).toBe(201)
    expect(made.body.notices).toHaveLength(2)
    const [es, en] = [made.body.notices.find((n: { language: string }) => n.language === 'es'), made.body.notices.find((n: { language: string }) => n.language === 'en')]
    expect(es.contact.name).toBe('Marisol Quintero')
    expect(en.contact.name).toBe('Harbor Tide Credit Union')
    // Fla. Stat. § 713.78 as the sample reads it: sale after 35 days from storage for a vehicle over 3 years old: 30 Nov + 35 = 4 Jan 2027.
    expect(es.nextDate).toBe('2027-01-04')

    const english = (await pdfText(await pdfOf(en.fileId, office))).replace(/\s+/g, ' ')
    for (const expected of [
      'Notice of stored vehicle and lien',
      vehicle.stockNumber,
      '1G4AH59H45G118341',
      '2013 Halvard Finch',
      '7KQM214 · FL',
      'Harbor Tide Credit Union',
      '90 Quay St',
      'Port Ellery, FL 32034',
      'the legal owner or a lienholder',
      'on or after January 4, 2027',
      'Total if collected on January 4, 2027',
      'Fla. Stat. § 713.78(4)',
      'mailed by December 9, 2026',
      'https://yard.example.test/o',
      'Check the rules where you are',
      'confirm each requirement against the local code and with your own legal counsel',
    ]) {
      expect(english).toContain(expected)
    }
    expect(english).toMatch(/type this code: [A-Z2-9]{5}-[A-Z2-9]{5}/)
    const spanish = (await pdfText(await pdfOf(es.fileId, office))).replace(/\s+/g, ' ')
    for (const expected of ['Aviso de vehículo almacenado y gravamen', 'usted es el dueño registrado', 'a partir del 4 de enero de 2027', 'Cómo recuperar el vehículo', 'Verifique las normas de su lugar', vehicle.stockNumber]) {
      expect(spanish).toContain(expected)
    }

    // Each letter has an owner link of its own, stored hashed; notice, PDF and link are history events.
    const kinds = (await historyOf(app.db, vehicle.id)).map((e) => e.kind)
    expect(kinds.filter((k) => k === 'notice_made')).toHaveLength(2)
    expect(kinds.filter((k) => k === 'owner_link_created')).toHaveLength(2)
    expect(kinds).toContain('file_added')
    const links = await app.db.select().from(t.ownerLinks).where(eq(t.ownerLinks.vehicleId, vehicle.id))
    expect(links).toHaveLength(2)
    // The link lasts at least two weeks past the letter's next date.
    expect(links[0]!.expiresAt.getTime()).toBeGreaterThanOrEqual(Date.parse('2027-01-18T00:00:00Z'))
  })

  it('refuses a notice the rule set does not ask for, and one with nobody to send it to — nothing written', async () => {
    const { vehicle, office } = await fixture({ contacts: [] })
    const none = await office.post(`/api/vehicles/${vehicle.id}/notices`, { kind: 'owner_notice' })
    expect(none.status).toBe(400)
    expect(none.body.issues[0].path).toBe('contactIds')
    const wrong = await office.post(`/api/vehicles/${vehicle.id}/notices`, { kind: 'sale_notice' })
    expect(wrong.status).toBe(400)
    expect(wrong.body.issues[0].path).toBe('kind')
    expect(await historyCount(app.db, vehicle.id)).toBe(0)
    expect(await app.db.select().from(t.files).where(eq(t.files.vehicleId, vehicle.id))).toEqual([])
  })
})

describe('sending notices', () => {
  it('certified mail: the mailing day meets the notice deadline, and a returned letter is recorded', async () => {
    const { staff, vehicle, office } = await fixture()
    const made = await office.post(`/api/vehicles/${vehicle.id}/notices`, { kind: 'owner_notice' })
    const notice = made.body.notices.find((n: { language: string }) => n.language === 'en')
    const day = today(staff.yard.timeZone)
    const sent = await office.post(`/api/vehicles/${vehicle.id}/notices/${notice.id}/send`, { certifiedMail: true, trackingNumber: '9407 1112 0620 1234 5678 90', mailedOn: day })
    expect(sent.status, JSON.stringify(sent.body)).toBe(200)
    const planned = sent.body.planned.find((p: { kind: string }) => p.kind === 'owner_notice')
    expect(planned.mailedAt).not.toBeNull()
    expect(['sent', 'late']).toContain(planned.status)
    const events = await app.db.select().from(t.clockEvents).where(eq(t.clockEvents.vehicleId, vehicle.id))
    expect(events.map((e) => e.kind)).toEqual(['owner-notice-mailed'])
    const card = await office.get(`/api/vehicles/${vehicle.id}`)
    expect(card.body.summary.nextDeadline?.code ?? null).not.toBe('notice-of-lien')

    const sending = sent.body.notices.find((n: { id: string }) => n.id === notice.id).sendings[0]
    expect(sending).toMatchObject({ method: 'certified_mail', trackingNumber: '9407 1112 0620 1234 5678 90', mailedOn: day })
    const back = await office.post(`/api/vehicles/${vehicle.id}/notices/${notice.id}/sendings/${sending.id}/returned`, { returnedOn: day, note: 'Unclaimed' })
    expect(back.status, JSON.stringify(back.body)).toBe(200)
    expect(back.body.notices.find((n: { id: string }) => n.id === notice.id).sendings[0]).toMatchObject({ returnedOn: day, returnNote: 'Unclaimed' })
    const kinds = (await historyOf(app.db, vehicle.id)).map((e) => e.kind)
    expect(kinds.slice(-2)).toEqual(['notice_sent', 'notice_returned'])
  })

  it('the mailing day starts the clock: a notice mailed starts the ordinance template’s 30-day wait', async () => {
    const staff = await makeStaff(app.db)
    const ruleSetVersionId = await sampleVersion(app.db, 'ordinance-24h-template')
    const vehicle = await makeVehicle(app.db, staff.yard.id, { state: 'storage', ruleSetVersionId, arrivedAt: ARRIVED })
    const office = await signedIn(app.app, staff.office)
    await office.post(`/api/vehicles/${vehicle.id}/contacts`, { ...bank, role: 'registered_owner' })
    const made = await office.post(`/api/vehicles/${vehicle.id}/notices`, { kind: 'owner_notice' })
    const before = await office.get(`/api/vehicles/${vehicle.id}`)
    expect(before.body.summary.lienSale.code).toBe('waiting')
    const sent = await office.post(`/api/vehicles/${vehicle.id}/notices/${made.body.notices[0].id}/send`, { certifiedMail: true, trackingNumber: '9407111206201234567890', mailedOn: '2026-12-01' })
    expect(sent.status, JSON.stringify(sent.body)).toBe(200)
    // The ordinance template: disposal not before 30 calendar days after the owner notice was mailed: 1 Dec 2026 + 30 = 31 Dec 2026.
    const after = await office.get(`/api/vehicles/${vehicle.id}`)
    expect(after.body.summary.lienSale.date).toBe('2026-12-31')
  })

  it('e-mail: queued in the outbox and delivered by the local SMTP server with the PDF attached', async () => {
    const { vehicle, office } = await fixture()
    const made = await office.post(`/api/vehicles/${vehicle.id}/notices`, { kind: 'owner_notice' })
    const notice = made.body.notices.find((n: { language: string }) => n.language === 'es')
    const sent = await office.post(`/api/vehicles/${vehicle.id}/notices/${notice.id}/send`, { email: true })
    expect(sent.status, JSON.stringify(sent.body)).toBe(200)
    // E-mail alone is no mailing: no clock event.
    expect(await app.db.select().from(t.clockEvents).where(eq(t.clockEvents.vehicleId, vehicle.id))).toEqual([])

    smtp.received.length = 0
    const worker = new OutboxWorker(app.db, smtpTransport(smtp.url), app.files, pino({ level: 'silent' }), { from: 'Test Yard <yard@test.example>' })
    expect(await worker.drain()).toBe(1)
    await worker.stop()
    expect(smtp.received).toHaveLength(1)
    const mail = parseMail(smtp.received[0]!.raw)
    expect(smtp.received[0]!.to).toEqual(['marisol@example.test'])
    expect(mail.subject).toBe(`Aviso de vehículo almacenado y gravamen: vehículo ${vehicle.stockNumber} en Test Towing yard`)
    expect(mail.headers.get('content-language')).toBe('es')
    expect(mail.attachments.map((a) => a.contentType)).toEqual(['application/pdf'])
    const text = (await pdfText(mail.attachments[0]!.content)).replace(/\s+/g, ' ')
    expect(text).toContain('Aviso de vehículo almacenado y gravamen')
    expect(text).toContain(vehicle.stockNumber)
    // The owner link's token is in the letter only, never in the message text kept in the database.
    const [row] = await app.db.select().from(t.outboundMessages).where(eq(t.outboundMessages.vehicleId, vehicle.id))
    expect(row!.text).not.toMatch(/\/o\/[A-Za-z0-9_-]{43}/)
  })

  it('refuses each bad sending naming the field, and writes nothing', async () => {
    const { staff, vehicle, office } = await fixture({ contacts: [{ ...bank, street: null, city: null, state: null, zip: null, source: 'counter', sourceDate: null }] })
    const made = await office.post(`/api/vehicles/${vehicle.id}/notices`, { kind: 'owner_notice' })
    expect(made.status, JSON.stringify(made.body)).toBe(201)
    const url = `/api/vehicles/${vehicle.id}/notices/${made.body.notices[0].id}/send`
    const day = today(staff.yard.timeZone)
    const before = await historyCount(app.db, vehicle.id)
    const cases: [object, string][] = [
      [{ certifiedMail: true, trackingNumber: '9407111206201234567890', mailedOn: day }, 'certifiedMail'],
      [{ email: true }, 'email'],
      [{ certifiedMail: true, trackingNumber: '  ', mailedOn: day }, 'trackingNumber'],
      [{ certifiedMail: true, trackingNumber: '9407111206201234567890' }, 'mailedOn'],
      [{}, 'certifiedMail'],
    ]
    for (const [body, field] of cases) {
      const res = await office.post(url, body)
      expect(res.status, field).toBe(400)
      expect(res.body.issues.map((i: { path: string }) => i.path), field).toContain(field)
    }
    // With an address on record, a mailing day in the future is refused by the server.
    const contact = (await office.get(`/api/vehicles/${vehicle.id}/contacts`)).body.contacts[0]
    await office.put(`/api/vehicles/${vehicle.id}/contacts/${contact.id}`, { ...bank })
    const future = await office.post(url, { certifiedMail: true, trackingNumber: '9407111206201234567890', mailedOn: '2999-01-01' })
    expect(future.status).toBe(400)
    expect(future.body.issues[0].path).toBe('mailedOn')
    expect(await historyCount(app.db, vehicle.id)).toBe(before + 1)
    expect(await app.db.select().from(t.noticeSendings)).not.toContainEqual(expect.objectContaining({ noticeId: made.body.notices[0].id }))
    expect(await app.db.select().from(t.clockEvents).where(eq(t.clockEvents.vehicleId, vehicle.id))).toEqual([])
  })

  it('lets only the office and managers make and send notices; everyone on the board reads them', async () => {
    const { staff, vehicle } = await fixture()
    for (const role of ['dispatcher', 'technician'] as const) {
      const s = await signedIn(app.app, staff[role])
      expect((await s.get(`/api/vehicles/${vehicle.id}/notices`)).status, role).toBe(200)
      expect((await s.post(`/api/vehicles/${vehicle.id}/notices`, { kind: 'owner_notice' })).status, role).toBe(403)
      expect((await s.post(`/api/vehicles/${vehicle.id}/notices/due`)).status, role).toBe(403)
      expect((await s.get('/api/notices/due')).status, role).toBe(403)
    }
  })
})

describe('all notices due today', () => {
  it('lists the due notices of the yard, makes and e-mails each, and reports a letter with no address as failed, not dropped', async () => {
    const { vehicle, office } = await fixture()
    const due = await office.get('/api/notices/due')
    expect(due.status).toBe(200)
    expect(due.body.due).toContainEqual(expect.objectContaining({ vehicleId: vehicle.id, kind: 'owner_notice', dueDate: '2026-12-09' }))
    const run = await office.post(`/api/vehicles/${vehicle.id}/notices/due`)
    expect(run.status, JSON.stringify(run.body)).toBe(200)
    const results = run.body.results as { contactName: string; outcome: string; reason: string | null; noticeId: string }[]
    expect(results.map((r) => [r.contactName, r.outcome]).sort()).toEqual([
      ['Harbor Tide Credit Union', 'failed'],
      ['Marisol Quintero', 'queued'],
    ])
    expect(results.find((r) => r.outcome === 'failed')!.reason).toMatch(/No e-mail address/)
    expect(results.find((r) => r.outcome === 'failed')!.noticeId).not.toBeNull()
    // Made once: the list no longer has it, and a second run makes nothing more.
    expect((await office.get('/api/notices/due')).body.due).not.toContainEqual(expect.objectContaining({ vehicleId: vehicle.id }))
    expect((await office.post(`/api/vehicles/${vehicle.id}/notices/due`)).body.results).toEqual([])
  })
})
