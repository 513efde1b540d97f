import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { makeStaff, makeVehicle } from '../helpers/factories'
import { pdfInfo, pdfText, readQrOfPdf, renderFirstPage } from '../helpers/pdf'

let app: TestApp
let staff: Awaited<ReturnType<typeof makeStaff>>
beforeAll(async () => {
  app = await makeTestApp({ publicUrl: 'https://yard.test.example' })
})
afterAll(() => app.close())
beforeEach(async () => {
  staff = await makeStaff(app.db)
})

async function keyTagOf(role: 'dispatcher' | 'office' | 'manager' | 'technician', vehicleId: string, query = '') {
  const s = await signedIn(app.app, staff[role])
  return s.agent.get(`/api/vehicles/${vehicleId}/documents/key-tag${query}`).buffer(true).parse((res, done) => {
    const chunks: Buffer[] = []
    res.on('data', (c: Buffer) => chunks.push(c))
    res.on('end', () => done(null, Buffer.concat(chunks)))
  })
}

describe('the stock label / key tag', () => {
  it('is a 4 × 2 in PDF with the stock number, vehicle, colour and plate in the embedded Barlow, and a QR to the vehicle page', async () => {
    const v = await makeVehicle(app.db, staff.yard.id, { year: 2011, make: 'Halvard', model: 'Finch Wagon', colour: 'Moss green', plate: '7QRT412', plateState: 'CA' })
    const res = await keyTagOf('dispatcher', v.id)
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toBe('application/pdf')
    expect(res.headers['content-disposition']).toBe(`inline; filename="key-tag-${v.stockNumber}.pdf"`)
    expect(res.headers['cache-control']).toBe('private, no-store')
    const pdf = res.body as Buffer

    const info = await pdfInfo(pdf)
    expect(info).toMatchObject({ pages: 1, widthPt: 288, heightPt: 144 })
    expect(info.fonts.map((f) => f.name.replace(/-\d+$/, '')).sort()).toEqual(['Barlow-Bold', 'Barlow-Medium', 'Barlow-Regular'])
    for (const f of info.fonts) expect(f.embedded, f.name).toBe(true)
    // Subset: the three TTFs are about 300 KB together; only the glyphs used are in the file.
    expect(pdf.length).toBeLessThan(60_000)

    const text = await pdfText(pdf, { layout: true })
    expect(text).toContain(v.stockNumber)
    expect(text).toContain('2011 Halvard Finch Wagon')
    expect(text).toMatch(/Colour\s+Moss green/)
    expect(text).toMatch(/Plate\s+7QRT412 · CA/)
    expect(text).toContain(staff.yard.name)
    expect(text).toContain(`Scan, or search ${v.stockNumber}`)
    expect(text).toContain('at yard.test.example')

    // Rendered to test-results/pdf/key-tag.png as it is read, once, by the app scanner's reader.
    expect(await readQrOfPdf(pdf, 'key-tag')).toBe(`https://yard.test.example/vehicles/${v.id}`)
  })

  it('prints in Spanish on request, and says what was not recorded', async () => {
    const v = await makeVehicle(app.db, staff.yard.id, { year: null, make: null, model: null, colour: null, plate: null })
    const res = await keyTagOf('office', v.id, '?lang=es')
    expect(res.status).toBe(200)
    await renderFirstPage(res.body as Buffer, 'key-tag-es')
    const text = await pdfText(res.body as Buffer, { layout: true })
    expect(text).toMatch(/Color\s+sin registrar/)
    expect(text).toMatch(/Placa\s+sin registrar/)
    expect(text).toContain(`Escanee, o busque ${v.stockNumber}`)
    expect(text).toContain('en yard.test.example')
  })

  it.each([
    ['manager', 200],
    ['dispatcher', 200],
    ['office', 200],
    ['technician', 403],
  ] as const)('is printed by a %s: %i', async (role, status) => {
    const v = await makeVehicle(app.db, staff.yard.id)
    expect((await keyTagOf(role, v.id)).status).toBe(status)
  })

  it("is not made for another company's vehicle", async () => {
    const other = await makeStaff(app.db)
    const theirs = await makeVehicle(app.db, other.yard.id)
    expect((await keyTagOf('manager', theirs.id)).status).toBe(404)
  })
})
