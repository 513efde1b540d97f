import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { historyOf } from '@db/history'
import { isoDate, localDay, startOfLocalDay } from '@shared/domain/time'
import { makeTestApp, signedIn, type BrowserSession, type TestApp } from '../helpers/app'
import { DAY, sampleVersion, vehicleRow } from '../helpers/board'
import { makeStaff, makeVehicle } from '../helpers/factories'
import { pdfText, renderFirstPage } from '../helpers/pdf'
import { signaturePng } from '../helpers/release'

let t_: TestApp
beforeAll(async () => {
  t_ = await makeTestApp()
})
afterAll(() => t_.close())

const ZONE = 'America/Los_Angeles' // the factories' yard
const base = (id: string) => `/api/vehicles/${id}/transfer`
const yardDay = (offsetDays = 0) => isoDate(localDay(ZONE, Date.now()) + offsetDays)

const SIGN_OVER = {
  kind: 'signed_over',
  sellerName: 'Dana Okafor',
  buyerKind: 'yard',
  buyerName: 'Test Towing yard',
  buyerAddress: '1 Test Road, Orrin Flats, CA 93201',
  priceCents: 0,
  odometer: 151_000,
  date: yardDay(),
}
const LIEN_SALE = {
  kind: 'lien_sale',
  sellerName: 'Test Towing yard, lienholder',
  buyerKind: 'other',
  buyerName: 'Rosalind Vey',
  buyerAddress: '22 Kestrel Lane, Orrin Flats, CA 93201',
  buyerIdType: 'drivers_license',
  buyerIdNumber: 'V5521098',
  priceCents: 150_000,
  odometer: 151_000,
  date: yardDay(),
}

/** Florida's sample: a lien sale no sooner than 35 days after storage for a vehicle over 3 years old (Fla. Stat. § 713.78 [S/M]). */
async function stored(daysAgo: number, over: Partial<typeof t.vehicles.$inferInsert> = {}) {
  const staff = await makeStaff(t_.db)
  const ruleSetVersionId = await sampleVersion(t_.db, 'florida-sample')
  const v = await makeVehicle(t_.db, staff.yard.id, { state: 'storage', ruleSetVersionId, year: 2009, odometer: 150_220, vin: '1G4AH59H45G118341', arrivedAt: new Date(Date.now() - daysAgo * DAY), ...over })
  const s = await signedIn(t_.app, staff.manager)
  return { staff, v, s }
}

async function nothingWritten(vehicleId: string, historyBefore: number) {
  expect(await t_.db.select().from(t.titleTransfers).where(eq(t.titleTransfers.vehicleId, vehicleId))).toEqual([])
  expect((await historyOf(t_.db, vehicleId)).length).toBe(historyBefore)
}

const close = (s: BrowserSession, id: string, version: number, disposition: string) =>
  s.post(`/api/vehicles/${id}/moves`, { to: 'closed', version, disposition, reason: null })

function pdfOf(s: BrowserSession, url: string) {
  return s.agent.get(url).buffer(true).parse((res, done) => {
    const chunks: Buffer[] = []
    res.on('data', (c: Buffer) => chunks.push(c))
    res.on('end', () => done(null, Buffer.concat(chunks)))
  })
}

describe('title transfer: sign-over', () => {
  it('signOver_recordedThenSigned_opensTheTitleTransferGuardOnlyOnceSigned', async () => {
    const { v, s } = await stored(10)
    const put = await s.put(base(v.id), SIGN_OVER)
    expect(put.status).toBe(200)
    expect(put.body.record).toMatchObject({ kind: 'signed_over', buyerName: 'Test Towing yard', priceCents: 0, proceeds: null, signedAt: null })
    // Model year 2009 transferred in 2026: exempt under 49 CFR 580.17(a)(3) (10 years after 1 Jan 2009).
    expect(put.body.record.odometerDisclosure).toMatchObject({ required: false, clause: '49 CFR 580.17(a)(3)' })
    const refused = await close(s, v.id, (await vehicleRow(t_.db, v.id)).version, 'title_transferred')
    expect(refused.status).toBe(422)
    expect(refused.body.reasons).toMatchObject([{ code: 'release-signed', message: 'The title transfer is not signed.' }])

    const signed = await s.post(`${base(v.id)}/signature`, { signerName: 'Dana Okafor', image: await signaturePng() })
    expect(signed.status).toBe(201)
    expect(signed.body).toMatchObject({ editable: false, record: { signerName: 'Dana Okafor' } })
    const kinds = (await historyOf(t_.db, v.id)).map((e) => e.kind)
    expect(kinds).toEqual(expect.arrayContaining(['transfer_recorded', 'transfer_signed']))
    // A signed sign-over is not a lien sale's bill of sale.
    expect((await close(s, v.id, (await vehicleRow(t_.db, v.id)).version, 'lien_sale')).body.reasons.map((r: { code: string }) => r.code)).toContain('release-signed')
    const closed = await close(s, v.id, (await vehicleRow(t_.db, v.id)).version, 'title_transferred')
    expect(closed.status).toBe(200)
    expect(closed.body).toMatchObject({ state: 'closed', disposition: 'title_transferred' })
    // Once closed, nothing about it changes.
    expect((await s.put(base(v.id), SIGN_OVER)).status).toBe(409)
  })

  it.each([
    ['priceCents', { priceCents: -1 }, 'The price cannot be negative.'],
    ['buyerName', { buyerName: '  ' }, 'Enter the buyer.'],
    ['buyerName', { buyerName: undefined }, 'Enter the buyer.'],
    ['priceCents', { priceCents: 10.5 }, 'Enter the price in whole cents.'],
    ['buyerIdNumber', { buyerKind: 'salvage_buyer', buyerIdType: 'drivers_license' }, "Enter the buyer's ID number."],
    ['buyerKind', { buyerKind: 'other', buyerIdType: 'drivers_license', buyerIdNumber: 'X1' }, 'A vehicle is signed over to the yard or a salvage buyer; a sale to anyone else is a lien sale.'],
    ['date', { date: yardDay(1) }, 'The date of the sale cannot be in the future: record a sale once it is held.'],
  ])('signOver_bad %s_isRefusedNamingTheFieldAndWritesNothing (%#)', async (path, change, message) => {
    const { v, s } = await stored(10)
    const before = (await historyOf(t_.db, v.id)).length
    const res = await s.put(base(v.id), { ...SIGN_OVER, ...change })
    expect(res.status).toBe(400)
    expect(res.body.issues).toContainEqual(expect.objectContaining({ path, message }))
    await nothingWritten(v.id, before)
  })

  it('signOver_odometerRequiredButMissing_isRefusedNamingTheOdometer', async () => {
    // Model year 2018 in 2026: 580.17(a)(4) exempts it only from 1 January 2038, so 580.5 applies.
    const { v, s } = await stored(10, { year: 2018 })
    const before = (await historyOf(t_.db, v.id)).length
    const res = await s.put(base(v.id), { ...SIGN_OVER, odometer: null })
    expect(res.status).toBe(400)
    expect(res.body.issues[0].path).toBe('odometer')
    // The newer band's clause and the year its exemption starts, for the reader's language (transfers.odometerNewer).
    expect(res.body.issues[0]).toMatchObject({ code: 'transfers.odometerNewer', params: { year: '2038', clause: '49 CFR 580.17(a)(4)' } })
    await nothingWritten(v.id, before)
    expect((await s.put(base(v.id), { ...SIGN_OVER, odometer: 150_100 })).body.issues).toEqual([
      { path: 'odometer', message: 'The odometer cannot read less than at intake (150,220).', code: 'transfers.odometerBelowIntake', params: { intake: '150,220' } },
    ])
  })

  it('signTransfer_beforeAnyRecord_orEmptySignature_isRefused', async () => {
    const { v, s } = await stored(10)
    expect((await s.post(`${base(v.id)}/signature`, { signerName: 'Dana Okafor', image: await signaturePng() })).status).toBe(422)
    await s.put(base(v.id), SIGN_OVER)
    const empty = await s.post(`${base(v.id)}/signature`, { signerName: 'Dana Okafor', image: await signaturePng(false) })
    expect(empty.status).toBe(400)
    expect(empty.body.issues[0].path).toBe('image')
    expect((await s.get(base(v.id))).body.record.signedAt).toBeNull()
  })

  it('transfer_technician_isForbidden', async () => {
    const { staff, v } = await stored(10)
    const tech = await signedIn(t_.app, staff.technician)
    expect((await tech.get(base(v.id))).status).toBe(403)
    expect((await tech.put(base(v.id), SIGN_OVER)).status).toBe(403)
  })
})

describe('title transfer: lien sale', () => {
  it('lienSale_datedBeforeTheLawAllows_isRefusedNamingTheDate', async () => {
    // Arrived 60 days ago: the gate opened 35 days after storage (Fla. Stat. § 713.78 [S/M]), i.e. 25 days ago.
    const { v, s } = await stored(60)
    const before = (await historyOf(t_.db, v.id)).length
    const gate = (await s.get(base(v.id))).body.lienSale
    expect(gate).toMatchObject({ open: true, code: 'open' })
    const early = isoDate(localDay(ZONE, Date.now()) - 27)
    expect(early < gate.date).toBe(true)
    const res = await s.put(base(v.id), { ...LIEN_SALE, date: early })
    expect(res.status).toBe(400)
    expect(res.body.issues).toEqual([
      { path: 'date', message: expect.stringContaining(`The law allows the lien sale from ${gate.date}`), code: 'transfers.saleBeforeLaw', params: expect.objectContaining({ date: gate.date, day: early }) },
    ])
    await nothingWritten(v.id, before)
  })

  it('lienSale_whileTheGateIsShut_isRefusedNamingTheDate', async () => {
    // Arrived 20 days ago: not before day 35 (Fla. Stat. § 713.78 [S/M]).
    const { v, s } = await stored(20)
    const before = (await historyOf(t_.db, v.id)).length
    const res = await s.put(base(v.id), LIEN_SALE)
    expect(res.status).toBe(400)
    expect(res.body.issues[0].path).toBe('date')
    expect(res.body.issues[0].message).toMatch(/^The law allows the lien sale from \d{4}-\d\d-\d\d/)
    await nothingWritten(v.id, before)
  })

  it('lienSale_proceeds_payTheChargesFirst_surplusOwedToTheOwner_toTheCent', async () => {
    const { v, s } = await stored(60)
    // A cash payment first: what the sale pays is what is still owed on the sale day.
    const paid = await s.post(`/api/vehicles/${v.id}/payments`, { method: 'cash', amountCents: 10_000, tenderedCents: 10_000, idempotencyKey: crypto.randomUUID() })
    expect(paid.status).toBe(201)
    const saleDay = yardDay(-1)
    const endOfSaleDay = new Date(startOfLocalDay(ZONE, localDay(ZONE, Date.now()))).toISOString()
    const invoice = await s.get(`/api/vehicles/${v.id}/invoice?asOf=${encodeURIComponent(endOfSaleDay)}`)
    const due = invoice.body.invoice.dueCents as number
    expect(due).toBeGreaterThan(0)
    expect(due).toBe(invoice.body.invoice.totalCents - 10_000)

    const over = await s.put(base(v.id), { ...LIEN_SALE, date: saleDay, priceCents: due + 12_345 })
    expect(over.status).toBe(200)
    expect(over.body.record.proceeds).toEqual({ dueCents: due, appliedCents: due, surplusCents: 12_345, shortfallCents: 0 })
    // The proceeds pay the bill (a payment line of method lien_sale, written with the transfer and its event);
    // the bill runs to the end of the sale day and shows the surplus owed to the owner.
    const paidBySale = (await s.get(`/api/vehicles/${v.id}/invoice`)).body.invoice
    expect(paidBySale).toMatchObject({ dueCents: 0, endsAt: endOfSaleDay, lienSale: { saleDate: saleDay, appliedCents: due, surplusCents: 12_345, shortfallCents: 0 } })
    const salePayment = paidBySale.payments.find((p: { method: string }) => p.method === 'lien_sale')
    expect(salePayment).toMatchObject({ kind: 'payment', amountCents: due })
    const overEvent = (await historyOf(t_.db, v.id)).filter((e) => e.kind === 'transfer_recorded').at(-1)!
    expect(overEvent.after).toMatchObject({ proceedsPaymentId: salePayment.id, proceedsReversedCents: null })
    // Recorded again with a lower price (not yet signed): the charges take all of it, one cent short.
    const under = await s.put(base(v.id), { ...LIEN_SALE, date: saleDay, priceCents: due - 1 })
    expect(under.body.record.proceeds).toEqual({ dueCents: due, appliedCents: due - 1, surplusCents: 0, shortfallCents: 1 })
    // The earlier proceeds come off the bill by a reversing line, the new ones go on: one cent is left owing.
    const reRecorded = (await s.get(`/api/vehicles/${v.id}/invoice`)).body.invoice
    expect(reRecorded.payments.map((p: { kind: string; method: string; amountCents: number }) => [p.kind, p.method, p.amountCents])).toEqual([
      ['payment', 'cash', 10_000],
      ['payment', 'lien_sale', due],
      ['refund', 'lien_sale', due],
      ['payment', 'lien_sale', due - 1],
    ])
    expect(reRecorded).toMatchObject({ dueCents: 1, lienSale: { surplusCents: 0, shortfallCents: 1 } })
    const events = (await historyOf(t_.db, v.id)).filter((e) => e.kind === 'transfer_recorded')
    expect(events).toHaveLength(2)
    expect(events.at(-1)!.after).toMatchObject({ priceCents: due - 1, buyerId: '…1098', proceeds: { appliedCents: due - 1, shortfallCents: 1 } })
    expect(JSON.stringify(events)).not.toContain('V5521098')

    const refused = await close(s, v.id, (await vehicleRow(t_.db, v.id)).version, 'lien_sale')
    expect(refused.status).toBe(422)
    expect(refused.body.reasons.map((r: { code: string }) => r.code)).toEqual(['release-signed'])
    await s.post(`${base(v.id)}/signature`, { signerName: 'Pat Lindqvist, for the yard', image: await signaturePng() })
    const closed = await close(s, v.id, (await vehicleRow(t_.db, v.id)).version, 'lien_sale')
    expect(closed.status).toBe(200)
    // The closed record and its frozen bill agree: what the sale did not cover is still owed, nothing more.
    const frozen = (await s.get(`/api/vehicles/${v.id}/invoice`)).body.invoice
    expect(frozen).toMatchObject({ frozen: true, endsAt: endOfSaleDay, dueCents: 1, lienSale: { shortfallCents: 1 } })
    expect((await s.get(base(v.id))).body.record.proceeds).toMatchObject({ shortfallCents: frozen.dueCents })
    expect((await s.put(base(v.id), LIEN_SALE)).status).toBe(409)
  })

  it('packet_lienSale_readsBackTheBillOfSaleProceedsChecklistAndCaution', async () => {
    const { v, s } = await stored(60, { year: 2018, make: 'Halvard', model: 'Finch' })
    await s.put(base(v.id), { ...LIEN_SALE, priceCents: 1_000_000 })
    const record = (await s.get(base(v.id))).body.record
    await s.post(`${base(v.id)}/signature`, { signerName: 'Pat Lindqvist', image: await signaturePng() })
    const res = await pdfOf(s, `${base(v.id)}/packet`)
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toBe('application/pdf')
    const text = (await pdfText(res.body as Buffer)).replace(/\s+/g, ' ')
    for (const words of ['Bill of sale', 'Rosalind Vey', 'V5521098', '$10,000.00', '1G4AH59H45G118341', '2018', 'Halvard', 'Finch', 'Proceeds of the sale', 'Surplus owed to the owner', 'Signed by Pat Lindqvist', 'What must be brought and signed', 'A release of lien', 'Check the rules where you are', 'legal counsel']) {
      expect(text, words).toContain(words)
    }
    expect(text).toContain(`$${((1_000_000 - record.proceeds.appliedCents) / 100).toLocaleString('en-US', { minimumFractionDigits: 2 })}`)
    // Model year 2018 transferred in 2026: 580.5 applies (580.17(a)(4) exempts it only from 2038).
    expect(text).toContain('Odometer disclosure statement (49 CFR 580.5)')
    expect(text).toContain('odometer now reads 151,000 miles')
    await renderFirstPage(res.body as Buffer, 'transfer-packet-lien-sale')
  })

  it('packet_exemptSignOver_saysWhyWithNoStatement_inSpanishToo', async () => {
    const { v, s } = await stored(10)
    await s.put(base(v.id), SIGN_OVER)
    const en = (await pdfText((await pdfOf(s, `${base(v.id)}/packet`)).body as Buffer)).replace(/\s+/g, ' ')
    expect(en).toContain('No odometer statement is needed for this transfer.')
    expect(en).toContain('(49 CFR 580.17(a)(3))')
    expect(en).not.toContain('odometer now reads')
    expect(en).not.toContain('Proceeds of the sale')
    const es = await pdfOf(s, `${base(v.id)}/packet?lang=es`)
    const esText = (await pdfText(es.body as Buffer)).replace(/\s+/g, ' ')
    expect(esText).toContain('Contrato de compraventa')
    expect(esText).toContain('Esta transferencia no necesita declaración de odómetro.')
    await renderFirstPage(es.body as Buffer, 'transfer-packet-sign-over-es')
  })
})
