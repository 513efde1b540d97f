import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { dayFromCivil, startOfLocalDay } from '@shared/domain/time'
import { salvageSchema } from '@shared/schemas/reports'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { makeStaff, makeVehicle } from '../helpers/factories'
import { pdfText, renderFirstPage } from '../helpers/pdf'

// Issue 12, "Monthly salvage inventory": 28 CFR 25.56 asks junk and salvage yards for a monthly
// inventory of the vehicles obtained in the month — VIN, date obtained, from whom, and whether crushed or
// disposed of, to whom, and whether for export (REFERENCES.md, "Salvage reporting", [V/S]). Hand-built
// cases, on the yard's calendar (America/Los_Angeles): what closed in October 2026 as a title transfer,
// a lien sale or scrapped is listed; a vehicle returned to its owner, one closed on 1 November by the
// yard's clock (still 31 October nowhere that matters) and another company's are not.

let app: TestApp
beforeAll(async () => {
  app = await makeTestApp()
})
afterAll(() => app.close())

const ZONE = 'America/Los_Angeles'
/** An instant on the yard's clock: day of October or November 2026 and minutes after midnight. */
const at = (month: number, day: number, minutes: number) => new Date(startOfLocalDay(ZONE, dayFromCivil(2026, month, day)) + minutes * 60_000)
const ARRIVED = at(8, 1, 600)

async function october() {
  const staff = await makeStaff(app.db)
  const y = staff.yard.id
  const crushed = await makeVehicle(app.db, y, { state: 'closed', disposition: 'scrapped', vin: '1G4AH59H45G118341', arrivedAt: ARRIVED, closedAt: at(10, 15, 720) })
  await app.db.insert(t.vehicleContacts).values({ vehicleId: crushed.id, role: 'registered_owner', name: 'Iola Brandt', source: 'counter' })
  // 23:30 on 31 October in Los Angeles is already 1 November in UTC: still October's.
  const signedOver = await makeVehicle(app.db, y, { state: 'closed', disposition: 'title_transferred', ownerName: '=Dov Kessler', arrivedAt: ARRIVED, closedAt: at(10, 31, 23 * 60 + 30) })
  await app.db.insert(t.releases).values({ vehicleId: signedOver.id, claimantKind: 'salvage_buyer', claimantName: 'Ferrow Salvage', createdById: staff.office.id })
  const november = await makeVehicle(app.db, y, { state: 'closed', disposition: 'lien_sale', arrivedAt: ARRIVED, closedAt: at(11, 1, 30) })
  const returned = await makeVehicle(app.db, y, { state: 'closed', disposition: 'returned_to_owner', arrivedAt: ARRIVED, closedAt: at(10, 10, 600) })
  const other = await makeStaff(app.db)
  const theirs = await makeVehicle(app.db, other.yard.id, { state: 'closed', disposition: 'scrapped', arrivedAt: ARRIVED, closedAt: at(10, 5, 600) })
  return { staff, crushed, signedOver, november, returned, theirs, office: await signedIn(app.app, staff.office) }
}

describe('salvage inventory', () => {
  it('salvage_october_listsWhatClosedAsSalvageOnTheYardsCalendar_withVinFromWhomAndDisposition', async () => {
    const { office, crushed, signedOver } = await october()
    const r = salvageSchema.parse((await office.get('/api/reports/salvage?month=2026-10').expect(200)).body)
    expect(r.month).toBe('2026-10')
    expect(r.rows).toEqual([
      expect.objectContaining({ vehicleId: crushed.id, vin: '1G4AH59H45G118341', obtainedOn: '2026-10-15', fromWhom: 'Iola Brandt', disposition: 'scrapped', crushed: true, toWhom: null, forExport: null }),
      expect.objectContaining({ vehicleId: signedOver.id, vin: null, obtainedOn: '2026-10-31', fromWhom: '=Dov Kessler', disposition: 'title_transferred', crushed: false, toWhom: 'Ferrow Salvage', forExport: null }),
    ])
  })

  it('salvage_november_listsTheLienSaleClosedJustAfterMidnight', async () => {
    const { office, november } = await october()
    const r = salvageSchema.parse((await office.get('/api/reports/salvage?month=2026-11').expect(200)).body)
    expect(r.rows.map((x) => [x.vehicleId, x.obtainedOn, x.disposition])).toEqual([[november.id, '2026-11-01', 'lien_sale']])
  })

  it('salvageCsv_namesTheColumnsOfTheRule_andEscapesFormulaCells', async () => {
    const { office, signedOver } = await october()
    const res = await office.get('/api/reports/salvage.csv?month=2026-10').expect(200)
    expect(res.headers['content-disposition']).toBe('attachment; filename="salvage-inventory-2026-10.csv"')
    const lines = res.text.split('\r\n').filter(Boolean)
    expect(lines[0]).toBe('VIN,Stock number,Vehicle,Date obtained,Obtained from,Disposition,Crushed,Disposed of to,For export')
    expect(lines).toHaveLength(3)
    // OWASP "CSV Injection": a name beginning with = is written with a leading apostrophe.
    expect(lines[2]).toBe(`not recorded,${signedOver.stockNumber},2013 Halvard Finch,2026-10-31,'=Dov Kessler,Title transferred,no,Ferrow Salvage,not recorded`)
  })

  const pdfOf = (s: Awaited<ReturnType<typeof october>>['office'], url: string) =>
    s.get(url).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = []
      r.on('data', (c: Buffer) => chunks.push(c))
      r.on('end', () => cb(null, Buffer.concat(chunks)))
    })

  it('salvagePdf_inEnglish_readsBackWithTheRulesColumnsEachVehicleAndTheCaution', async () => {
    const { office, crushed, signedOver, november } = await october()
    const res = await pdfOf(office, '/api/reports/salvage.pdf?month=2026-10').expect(200)
    expect(res.headers['content-type']).toBe('application/pdf')
    expect(res.headers['content-disposition']).toBe('inline; filename="salvage-inventory-2026-10.pdf"')
    const pdf = res.body as Buffer
    const text = await pdfText(pdf)
    expect(text).toContain('MONTHLY SALVAGE INVENTORY — 2026-10')
    expect(text).toContain('28 CFR 25.56')
    expect(text).toMatch(/Vehicles\s+2/)
    expect(text).toContain(crushed.stockNumber)
    expect(text).toContain('1G4AH59H45G118341')
    expect(text).toContain('Iola Brandt')
    expect(text).toContain('Ferrow Salvage')
    expect(text).toContain('2026-10-31')
    expect(text).toContain(signedOver.stockNumber)
    expect(text).not.toContain(november.stockNumber)
    // The legal caution every legal document carries (DESIGN.md, "Documents").
    expect(text).toContain('Check the rules where you are')
    await renderFirstPage(pdf, 'salvage-inventory-en')
  })

  it('salvagePdf_inSpanish_saysItInSpanish_andAnEmptyMonthSaysSo', async () => {
    const { office } = await october()
    const es = await pdfText((await pdfOf(office, '/api/reports/salvage.pdf?month=2026-10&lang=es').expect(200)).body as Buffer)
    expect(es).toContain('INVENTARIO MENSUAL DE SALVAMENTO — 2026-10')
    expect(es).toContain('Chatarra')
    expect(es).toContain('Verifique las normas de su lugar')
    const emptyPdf = (await pdfOf(office, '/api/reports/salvage.pdf?month=2026-09&lang=es').expect(200)).body as Buffer
    expect(await pdfText(emptyPdf)).toContain('Ningún vehículo se obtuvo como chatarra o salvamento en este mes.')
    await renderFirstPage(((await pdfOf(office, '/api/reports/salvage.pdf?month=2026-10&lang=es')).body as Buffer), 'salvage-inventory-es')
  })

  it('salvage_badMonth_isRefusedNamingTheField_andOnlyTheOfficeAndManagersReadIt', async () => {
    const { office, staff } = await october()
    for (const m of ['2026-13', '2026-1', 'october']) {
      const res = await office.get(`/api/reports/salvage?month=${m}`)
      expect(res.status, m).toBe(400)
      expect(res.body.issues[0].path).toBe('month')
    }
    const dispatcher = await signedIn(app.app, staff.dispatcher)
    await dispatcher.get('/api/reports/salvage').expect(403)
    await dispatcher.get('/api/reports/salvage.csv').expect(403)
    await dispatcher.get('/api/reports/salvage.pdf').expect(403)
    expect((await office.get('/api/reports/salvage.pdf?lang=fr')).body.issues[0].path).toBe('lang')
  })
})
