import { Writable } from 'node:stream'
import { eq } from 'drizzle-orm'
import { pino } from 'pino'
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { historyOf } from '@db/history'
import { makeTestApp, signedIn, type BrowserSession, type TestApp } from '../helpers/app'
import { setHold, vehicleRow } from '../helpers/board'
import { makeStaff } from '../helpers/factories'
import { pdfText, readQrOfPdf, renderFirstPage } from '../helpers/pdf'
import { completeRelease, vehicleInRelease } from '../helpers/release'

// Every log line the app writes, as a log collector would read it: a pass's token or code must never be in one.
let lines: string[] = []
const captured = new Writable({
  write(chunk, _encoding, done) {
    lines.push(...String(chunk).split('\n').filter(Boolean))
    done()
  },
})

let app: TestApp
let staff: Awaited<ReturnType<typeof makeStaff>>
beforeAll(async () => {
  app = await makeTestApp({ publicUrl: 'https://yard.test.example', log: pino({ level: 'info' }, captured) })
})
afterAll(() => app.close())
beforeEach(async () => {
  staff = await makeStaff(app.db)
  lines = []
})

/** A vehicle whose release is complete, and its gate pass: the answer, the PDF and the link read off its QR. */
async function issued(s: BrowserSession, name = 'pass') {
  const { vehicle, items } = await vehicleInRelease(app.db, staff.yard.id)
  await completeRelease(s, vehicle.id, items.map((i) => i.id))
  // The first pass is read: no reissue (the app's reader reads every symbol; DEVELOPERS.md "QR codes").
  const res = await s.post(`/api/vehicles/${vehicle.id}/release/gate-pass`)
  expect(res.status).toBe(201)
  const pdf = Buffer.from(res.body.pdf, 'base64')
  const link = await readQrOfPdf(pdf, `gate-pass-${name}`)
  return { vehicle, code: res.body.code as string, pdf, link, token: link.split('/g/')[1]! }
}

describe('the gate pass', () => {
  it('is a PDF with a QR link to /g/<256-bit token>, the typed code, the vehicle and the caution; only hashes are stored', async () => {
    const s = await signedIn(app.app, staff.office)
    const { vehicle, code, pdf, link, token } = await issued(s, 'issued')
    expect(link).toMatch(/^https:\/\/yard\.test\.example\/g\/[A-Za-z0-9_-]{43}$/)
    // 43 base64url characters carry 256 bits; the brief asks at least 128.
    expect(Buffer.from(token, 'base64url')).toHaveLength(32)
    expect(code).toMatch(/^[2-9A-HJKMNP-Z]{5}-[2-9A-HJKMNP-Z]{5}$/)
    const text = await pdfText(pdf, { layout: true })
    for (const words of [vehicle.stockNumber, code, 'Dana Okafor', 'Returned to owner', 'Moss green', 'Check the rules where you are']) expect(text).toContain(words)
    const [row] = await app.db.select().from(t.gatePasses).where(eq(t.gatePasses.vehicleId, vehicle.id))
    expect(JSON.stringify(row)).not.toContain(token)
    expect(JSON.stringify(row)).not.toContain(code.replace('-', ''))
    const issuedEvent = (await historyOf(app.db, vehicle.id)).find((e) => e.kind === 'gate_pass_issued')!
    expect(issuedEvent.after).toEqual({ passId: row!.id, disposition: 'returned_to_owner', expiresAt: row!.expiresAt.toISOString() })
  })

  it('opens the gate once: the vehicle leaves as Closed by the lifecycle move, a second scan is refused as used', async () => {
    const s = await signedIn(app.app, staff.office)
    const { vehicle, link } = await issued(s, 'once')
    const check = await s.post('/api/gate/check', { pass: link })
    expect(check.status).toBe(200)
    expect(check.body).toMatchObject({ vehicleId: vehicle.id, stockNumber: vehicle.stockNumber, disposition: 'returned_to_owner', claimantName: 'Dana Okafor' })
    const out = await s.post('/api/gate/record-out', { pass: link })
    expect(out.status).toBe(200)
    expect(out.body).toMatchObject({ vehicleId: vehicle.id, state: 'closed', disposition: 'returned_to_owner' })
    expect(await vehicleRow(app.db, vehicle.id)).toMatchObject({ state: 'closed', disposition: 'returned_to_owner', spaceId: null })
    const history = await historyOf(app.db, vehicle.id)
    const [pass] = await app.db.select().from(t.gatePasses).where(eq(t.gatePasses.vehicleId, vehicle.id))
    expect(history.find((e) => e.kind === 'moved')).toMatchObject({ fromState: 'release', toState: 'closed', actorId: staff.office.id, after: { disposition: 'returned_to_owner', gatePassId: pass!.id } })
    const board = await s.get('/api/board')
    expect(board.body.columns.flatMap((c: { cards: { id: string }[] }) => c.cards).map((c: { id: string }) => c.id)).not.toContain(vehicle.id)

    for (const call of ['check', 'record-out']) {
      const again = await s.post(`/api/gate/${call}`, { pass: link })
      expect(again.status).toBe(410)
      expect(again.body).toMatchObject({ reason: 'used', error: expect.stringMatching(/^This pass was already used: the vehicle was recorded out on /) })
    }
    expect((await historyOf(app.db, vehicle.id)).filter((e) => e.kind === 'moved')).toHaveLength(1)
  })

  it('takes the typed code in any case, with or without its dash', async () => {
    const s = await signedIn(app.app, staff.manager)
    const { vehicle, code } = await issued(s, 'code')
    const res = await s.post('/api/gate/record-out', { pass: code.replace('-', ' ').toLowerCase() })
    expect(res.status).toBe(200)
    expect(res.body.vehicleId).toBe(vehicle.id)
  })

  it('refuses an expired pass with its reason and leaves the vehicle in Release', async () => {
    const s = await signedIn(app.app, staff.office)
    const { vehicle, link } = await issued(s, 'expired')
    const past = new Date(Date.now() - 60_000)
    await app.db.update(t.gatePasses).set({ issuedAt: new Date(past.getTime() - 86_400_000), expiresAt: past }).where(eq(t.gatePasses.vehicleId, vehicle.id))
    const res = await s.post('/api/gate/record-out', { pass: link })
    expect(res.status).toBe(410)
    expect(res.body).toMatchObject({ reason: 'expired', error: expect.stringMatching(/^This pass expired on .*\. The office issues a new one\.$/) })
    // The instant and the yard's zone, for the reader's language and clock (refusals.passExpired).
    expect(res.body).toMatchObject({ code: 'passExpired', params: { at: past.toISOString(), timeZone: expect.any(String) } })
    expect(await vehicleRow(app.db, vehicle.id)).toMatchObject({ state: 'release' })
  })

  it.each([
    ['a forged token', 'https://yard.test.example/g/Zm9yZ2VkLXBhc3MtdGhhdC1uby15YXJkLWlzc3VlZC14eA'],
    ['a mistyped code', 'ABCDE-FGHJK'],
    ['nonsense', 'hello gate'],
  ])('refuses %s as not one this yard issued', async (_what, pass) => {
    const s = await signedIn(app.app, staff.office)
    const { vehicle } = await issued(s, 'forged')
    const res = await s.post('/api/gate/record-out', { pass })
    expect(res.status).toBe(404)
    expect(res.body).toMatchObject({ reason: 'unknown', error: 'This pass is not one this yard issued: it may be forged or mistyped. Check the code, or ask the office.' })
    expect(await vehicleRow(app.db, vehicle.id)).toMatchObject({ state: 'release' })
  })

  it("refuses another company's pass as unknown", async () => {
    const s = await signedIn(app.app, staff.office)
    const { link } = await issued(s, 'other-company')
    const other = await makeStaff(app.db)
    const res = await (await signedIn(app.app, other.office)).post('/api/gate/check', { pass: link })
    expect(res.status).toBe(404)
  })

  it('refuses a pass replaced by a newer one', async () => {
    const s = await signedIn(app.app, staff.office)
    const { vehicle, link } = await issued(s, 'replaced')
    await s.post(`/api/vehicles/${vehicle.id}/release/gate-pass`).expect(201)
    const res = await s.post('/api/gate/check', { pass: link })
    expect(res.status).toBe(410)
    expect(res.body.reason).toBe('withdrawn')
    expect(res.body.code).toBe('passWithdrawn')
  })

  it('judges the guards again at the gate: a hold set after the pass was issued keeps the vehicle in, and the pass unused', async () => {
    const s = await signedIn(app.app, staff.office)
    const { vehicle, link } = await issued(s, 'hold-after')
    await setHold(app.db, vehicle.id, 'law_enforcement', { agency: 'Orrin Flats PD', caseNumber: 'OF-26-20001' })
    const res = await s.post('/api/gate/record-out', { pass: link })
    expect(res.status).toBe(422)
    expect(res.body.reasons.map((r: { code: string }) => r.code)).toEqual(['hold'])
    expect(await vehicleRow(app.db, vehicle.id)).toMatchObject({ state: 'release' })
    const [pass] = await app.db.select().from(t.gatePasses).where(eq(t.gatePasses.vehicleId, vehicle.id))
    expect(pass!.usedAt).toBeNull()
  })

  it('never writes the token or the typed code into the log, whatever path or body carries them', async () => {
    const s = await signedIn(app.app, staff.office)
    const { link, token, code } = await issued(s, 'logs')
    await s.post('/api/gate/check', { pass: link })
    await s.get(`/g/${token}`)
    await s.get(`/api/gate/${token}`)
    await s.post('/api/gate/record-out', { pass: code })
    expect(lines.length).toBeGreaterThan(4)
    const log = lines.join('\n')
    for (const secret of [token, code, code.replace('-', '')]) expect(log).not.toContain(secret)
    expect(log).toContain('/g/[Redacted]')
  })
})

describe('the release form and the pickup ticket', () => {
  it('the release form carries the yard, vehicle, claimant and ID record, charges, property, signature and caution', async () => {
    const s = await signedIn(app.app, staff.office)
    const { vehicle, items } = await vehicleInRelease(app.db, staff.yard.id)
    await completeRelease(s, vehicle.id, items.map((i) => i.id))
    const res = await pdfOf(s, `/api/vehicles/${vehicle.id}/release/form`)
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toBe('application/pdf')
    expect(res.headers['cache-control']).toBe('private, no-store')
    const pdf = res.body as Buffer
    const text = await pdfText(pdf, { layout: true })
    for (const words of [
      staff.yard.name, vehicle.stockNumber, '2013 Halvard Finch', 'Dana Okafor', 'Registered owner', "Driver's licence · D4471902", 'California · expires 2030-05-31',
      'Registration · Registration card, plate 7QRT412', '88,140', 'Returned to owner', 'Storage, 1 day', 'Handed back', 'Child car seat', 'Not handed back',
      'Toolbox — Owner left it for now', 'Signed by Dana Okafor', 'Check the rules where you are',
    ]) expect(text).toContain(words)
    expect(text).toMatch(/Due\s+\$0\.00/)
    // Everything, signature and caution included, on one page.
    expect(text).toContain('Page 1 of 1')
    await renderFirstPage(pdf, 'release-form')
    const es = await pdfOf(s, `/api/vehicles/${vehicle.id}/release/form?lang=es`)
    const esText = await pdfText(es.body as Buffer)
    for (const words of ['ENTREGA DEL VEHÍCULO', 'Dueño registrado', 'Verifique las normas de su lugar']) expect(esText).toContain(words)
    await renderFirstPage(es.body as Buffer, 'release-form-es')
  })

  it('the pickup ticket says what the truck must bring, from the technician’s marks, with the loading cautions', async () => {
    const s = await signedIn(app.app, staff.office)
    const { vehicle } = await vehicleInRelease(app.db, staff.yard.id, { rolls: false, steers: true, brakes: true, keys: 'yes', keysWhere: 'Key box, hook 14' })
    const res = await pdfOf(s, `/api/vehicles/${vehicle.id}/documents/pickup-ticket`)
    expect(res.status).toBe(200)
    const text = await pdfText(res.body as Buffer)
    for (const words of [vehicle.stockNumber, 'PICKUP TICKET', 'Flatbed + Dollies or skates', 'Key box, hook 14', 'It does not roll', 'Loading cautions', 'chock the wheels', 'Check the rules where you are']) {
      expect(text.replace(/\s+/g, ' ')).toContain(words)
    }
    await renderFirstPage(res.body as Buffer, 'pickup-ticket')
    // In Spanish, the reasons too (issue 14: they travel as codes, worded from shared/messages).
    const es = await pdfOf(s, `/api/vehicles/${vehicle.id}/documents/pickup-ticket?lang=es`)
    const esText = (await pdfText(es.body as Buffer)).replace(/\s+/g, ' ')
    for (const words of ['BOLETA DE RECOGIDA', 'No rueda: súbalo a la plataforma con el malacate', 'Verifique las normas de su lugar']) expect(esText).toContain(words)
    expect(esText).not.toContain('It does not roll')
    await renderFirstPage(es.body as Buffer, 'pickup-ticket-es')
  })
})

/** A PDF route's answer with its bytes as the body. */
function pdfOf(s: BrowserSession, url: string) {
  return s.agent.get(url).buffer(true).parse((res, done) => {
    const chunks: Buffer[] = []
    res.on('data', (c: Buffer) => chunks.push(c))
    res.on('end', () => done(null, Buffer.concat(chunks)))
  })
}
