import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { historyOf } from '@db/history'
import { isoDate, localDay } from '@shared/domain/time'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { DAY, sampleVersion } from '../helpers/board'
import { makeStaff, makeVehicle } from '../helpers/factories'

let t_: TestApp
beforeAll(async () => {
  t_ = await makeTestApp()
})
afterAll(() => t_.close())

const ZONE = 'America/Los_Angeles'
const base = (id: string) => `/api/vehicles/${id}/publications`
const yardDay = (offset = 0) => isoDate(localDay(ZONE, Date.now()) + offset)

/** California's sample: a vehicle valued over $4,000 falls under Civ. Code § 3071, which advertises the sale [V]. */
async function californian(valueCents: number) {
  const staff = await makeStaff(t_.db)
  const ruleSetVersionId = await sampleVersion(t_.db, 'california-sample')
  const v = await makeVehicle(t_.db, staff.yard.id, { state: 'storage', ruleSetVersionId, year: 2019, vin: '1M8GDM9AXKP042788', plate: '8KDE214', plateState: 'CA', estimatedValueCents: valueCents, estimatedValueSource: 'test', arrivedAt: new Date(Date.now() - 40 * DAY) })
  return { staff, v, s: await signedIn(t_.app, staff.office) }
}

describe('newspaper publication (Cal. Civ. Code § 3071, valued over $4,000)', () => {
  it('publication_over4000_isPlanned_recorded_meetsTheClockWithItsFirstDay', async () => {
    const { v, s } = await californian(650_000)
    const page = await s.get(base(v.id))
    expect(page.status).toBe(200)
    expect(page.body.plan).toMatchObject({ kind: 'publication', publishedAt: null })
    expect(page.body.plan.citation).toContain('§ 3071')

    const res = await s.post(base(v.id), { newspaper: 'Orrin Flats Ledger', days: [yardDay(-1), yardDay(-8)] })
    expect(res.status).toBe(201)
    expect(res.body.publications).toEqual([expect.objectContaining({ newspaper: 'Orrin Flats Ledger', days: [yardDay(-8), yardDay(-1)], proofFileId: null })])
    const [event] = await t_.db.select().from(t.clockEvents).where(eq(t.clockEvents.vehicleId, v.id))
    expect(event).toMatchObject({ kind: 'sale-advertised', source: 'publication', sourceId: res.body.publications[0].id })
    // The first day in print, from the start of that day on the yard's clock.
    expect(isoDate(localDay(ZONE, event!.at.getTime()))).toBe(yardDay(-8))
    expect(res.body.plan.publishedAt).toBe(event!.at.toISOString())
    expect((await historyOf(t_.db, v.id)).map((e) => e.kind)).toContain('publication_recorded')
  })

  it.each([
    ['newspaper', { newspaper: ' ', days: [yardDay()] }, 'Enter the newspaper the notice ran in.'],
    ['days', { newspaper: 'Orrin Flats Ledger', days: [] }, 'Enter the day it was published.'],
    ['days.0', { newspaper: 'Orrin Flats Ledger', days: [yardDay(1)] }, 'A day of publication cannot be in the future.'],
  ])('publication_bad %s_isRefusedNamingTheFieldAndWritesNothing', async (path, body, message) => {
    const { v, s } = await californian(650_000)
    const before = (await historyOf(t_.db, v.id)).length
    const res = await s.post(base(v.id), body)
    expect(res.status).toBe(400)
    expect(res.body.issues).toContainEqual(expect.objectContaining({ path, message }))
    expect(await t_.db.select().from(t.publications).where(eq(t.publications.vehicleId, v.id))).toEqual([])
    expect((await historyOf(t_.db, v.id)).length).toBe(before)
  })

  it('publication_4000OrLess_isNotAskedFor_andRefused (§ 3072 has no advertisement)', async () => {
    const { v, s } = await californian(250_000)
    expect((await s.get(base(v.id))).body.plan).toBeNull()
    expect((await s.post(base(v.id), { newspaper: 'Orrin Flats Ledger', days: [yardDay()] })).status).toBe(422)
    // No text to send: empty, not an error (the page may still ask as a value takes the vehicle out of it).
    const none = await s.get(`${base(v.id)}/text`)
    expect([none.status, none.text]).toEqual([200, ''])
  })

  it('publicationText_namesTheYardTheVehicleAndTheRule_inEnglishAndSpanish', async () => {
    const { staff, v, s } = await californian(650_000)
    const en = await s.get(`${base(v.id)}/text`)
    expect(en.status).toBe(200)
    expect(en.headers['content-type']).toMatch(/^text\/plain/)
    for (const words of ['NOTICE OF LIEN SALE', staff.yard.name, '1 Test Road', '2019 Halvard Finch', 'VIN 1M8GDM9AXKP042788', 'plate 8KDE214 CA', v.stockNumber, '§ 3071']) expect(en.text).toContain(words)
    const es = await s.get(`${base(v.id)}/text?lang=es`)
    expect(es.text).toContain('AVISO DE VENTA POR GRAVAMEN')
    expect(es.text).toContain('VIN 1M8GDM9AXKP042788')
  })

  it('publicationProof_pdf_isKeptAsADocument; a dispatcher may not record', async () => {
    const { staff, v, s } = await californian(650_000)
    const made = await s.post(base(v.id), { newspaper: 'Orrin Flats Ledger', days: [yardDay(-2)] })
    const id = made.body.publications[0].id
    const { PDFDocument } = await import('pdf-lib')
    const doc = await PDFDocument.create()
    doc.addPage([300, 300])
    const pdf = Buffer.from(await doc.save())
    const res = await s.agent.post(`${base(v.id)}/${id}/proof`).set('x-csrf-token', s.csrf).attach('files', pdf, 'affidavit.pdf')
    expect(res.status).toBe(201)
    const fileId = res.body.publications[0].proofFileId
    const [file] = await t_.db.select().from(t.files).where(eq(t.files.id, fileId))
    expect(file).toMatchObject({ vehicleId: v.id, kind: 'document', mime: 'application/pdf' })
    const text = await s.agent.post(`${base(v.id)}/${id}/proof`).set('x-csrf-token', s.csrf).attach('files', Buffer.from('not a paper'), 'affidavit.txt')
    expect(text.status).toBe(400)
    const dispatcher = await signedIn(t_.app, staff.dispatcher)
    expect((await dispatcher.post(base(v.id), { newspaper: 'X', days: [yardDay()] })).status).toBe(403)
  })
})
