import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import type { TowInInput } from '@shared/schemas/tow-in'
import { makeTestApp, signedIn, type BrowserSession, type TestApp } from '../helpers/app'
import { makeCompany, makeStaff, makeUser } from '../helpers/factories'
import { counts, sampleRuleSet, towInBody } from '../helpers/tow-in'

let app: TestApp
let staff: Awaited<ReturnType<typeof makeStaff>>
let d: BrowserSession
beforeAll(async () => {
  app = await makeTestApp()
})
afterAll(() => app.close())
beforeEach(async () => {
  staff = await makeStaff(app.db)
  await app.db.update(t.yards).set({ ruleSetId: await sampleRuleSet(app.db) }).where(eq(t.yards.id, staff.yard.id))
  d = await signedIn(app.app, staff.dispatcher)
})

type Issue = { path: string; message: string }

/** Sends a tow-in changed by `edit`, expects a refusal that wrote nothing, and returns its issues. */
async function refused(edit: (b: TowInInput) => void, status = 400): Promise<Issue[]> {
  const before = await counts(app.db)
  const res = await d.post('/api/vehicles', towInBody(staff.dispatcher.id, edit))
  expect(res.status, JSON.stringify(res.body)).toBe(status)
  expect(await counts(app.db)).toEqual(before)
  return res.body.issues
}

const message = (issues: Issue[], path: string) => issues.find((i) => i.path === path)?.message

describe('a refused tow-in names the field, says why, and writes nothing', () => {
  it('an empty form names every required field', async () => {
    const before = await counts(app.db)
    const res = await d.post('/api/vehicles', {})
    expect(res.status).toBe(400)
    expect(res.body.issues.map((i: Issue) => i.path).sort()).toEqual(['condition', 'tow', 'vehicle'])
    expect(await counts(app.db)).toEqual(before)
  })

  it.each<[string, (b: TowInInput) => void, string, string]>([
    ['no pin', (b) => (b.tow.pickup = undefined as never), 'tow.pickup', 'Drop a pin on the map or search for the address.'],
    ['no make', (b) => (b.vehicle.make = '  '), 'vehicle.make', 'Enter the make, or "Unknown".'],
    ['no colour', (b) => (b.vehicle.colour = ''), 'vehicle.colour', 'Enter the colour.'],
    ['no requester', (b) => (b.tow.requesterName = ''), 'tow.requesterName', 'Enter who asked for the tow.'],
    ['"other" without a note', (b) => (b.tow.reason = 'other'), 'tow.reasonNote', 'Say what the reason was.'],
    ['police tow without agency', (b) => (b.tow.reason = 'law_enforcement'), 'tow.requesterAgency', 'Name the agency that asked for the tow.'],
    ['hooked before the call', (b) => (b.tow.hookedAt = new Date(Date.now() - 3 * 3_600_000).toISOString()), 'tow.hookedAt', 'Hooked up cannot be before the call.'],
    ['arrival in the future', (b) => Object.assign(b.tow, { calledAt: null, hookedAt: null, arrivedAt: new Date(Date.now() + 3_600_000).toISOString() }), 'tow.arrivedAt', 'Arrival at the gate cannot be in the future.'],
    ['arrival in 1990, a mistyped year', (b) => Object.assign(b.tow, { calledAt: null, hookedAt: null, arrivedAt: '1990-01-01T08:00:00Z' }), 'tow.arrivedAt', 'Arrival at the gate cannot be more than 10 years ago: check the year.'],
    ['a latitude off the globe', (b) => (b.tow.pickup = { lat: 95, lng: -119.3, address: null }), 'tow.pickup.lat', 'Latitude is between -90 and 90.'],
    ['no odometer and not marked unreadable', (b) => (b.vehicle.odometer = null), 'vehicle.odometer', 'Enter the odometer reading, or mark it "Not readable".'],
    ['a state name for the plate state', (b) => (b.vehicle.plateState = 'Calif'), 'vehicle.plateState', 'Use the two-letter state code, e.g. CA.'],
    ['police hold without case number', (b) => (b.holds = [{ kind: 'law_enforcement', agency: 'Orrin Flats Police Department' }]), 'holds.0.caseNumber', "Enter the agency's case number."],
    ['a checker who is not a staff id', (b) => (b.condition.checkedById = 'someone'), 'condition.checkedById', 'Choose who checked the vehicle.'],
    ['property without a name', (b) => (b.condition.property = [{ item: '', count: 2 }]), 'condition.property.0.item', 'Name the item.'],
  ])('%s', async (_name, edit, path, text) => {
    expect(message(await refused(edit), path)).toBe(text)
  })

  it('a class the rule set does not have', async () => {
    const issues = await refused((b) => (b.vehicle.vehicleClass = 'tractor'))
    expect(message(issues, 'vehicle.vehicleClass')).toBe("Choose one of the rule set's classes: Passenger car or light truck, Over 25 ft or heavy duty, Motorcycle.")
  })

  it('a checker from another company', async () => {
    const other = await makeCompany(app.db, 'Rival Recovery')
    const stranger = await makeUser(app.db, other.company.id, 'dispatcher')
    expect(message(await refused((b) => (b.condition.checkedById = stranger.id)), 'condition.checkedById')).toBe('Choose who checked the vehicle from the staff list.')
  })

  it('a space of another yard', async () => {
    const other = await makeCompany(app.db, 'Rival Recovery')
    const [space] = await app.db.insert(t.yardSpaces).values({ yardId: other.yard.id, row: 'Z', number: 1 }).returning()
    expect(message(await refused((b) => (b.spaceId = space!.id)), 'spaceId')).toBe('That space is not in this yard.')
  })
})

// VIN rules: 49 CFR 565 — check digit in position 9, no I/O/Q, model year in position 10.
describe('VIN messages', () => {
  it.each([
    ['a mistyped character breaks the check digit', '1G4AH59H45G118351', 'The check digit (9th character) is 4 but the other characters give'],
    ['the letter O where a zero belongs', '1G4AH59H45G11834O', 'is the letter O, which a VIN never uses — is it the digit 0?'],
    ['too long', '1G4AH59H45G1183410', 'A VIN has 17 characters; this one has 18.'],
    ['a character that is no letter or digit', '1G4AH59H*5G118341', '"*" (9th character) cannot be part of a VIN.'],
  ])('%s', async (_name, vin, text) => {
    expect(message(await refused((b) => (b.vehicle.vin = vin)), 'vehicle.vin')).toContain(text)
  })

  // 49 CFR 565: 17 characters from model year 1981; shorter VINs belong to older vehicles only.
  it('a short VIN on a vehicle from 1981 on', async () => {
    expect(message(await refused((b) => Object.assign(b.vehicle, { vin: '1G4AH59H45G11834', year: 2005 })), 'vehicle.vin')).toBe(
      'A 2005 vehicle has a 17-character VIN; this one has 16. Correct it, or record it as read and give the reason.',
    )
  })

  it('a short VIN with no model year', async () => {
    expect(message(await refused((b) => Object.assign(b.vehicle, { vin: '1', year: null })), 'vehicle.vin')).toContain(
      'Only vehicles made before 1981 have shorter VINs',
    )
  })

  it('no VIN needs a reason', async () => {
    expect(message(await refused((b) => (b.vehicle.vin = '')), 'vehicle.vin')).toBe(
      'Enter the VIN, or give the reason it cannot be read (plate-only, VIN plate missing or damaged).',
    )
  })

  it('a year the VIN contradicts', async () => {
    // Position 10 "5" with a numeric position 7 is model year 2005 for a light vehicle.
    expect(message(await refused((b) => (b.vehicle.year = 2006)), 'vehicle.year')).toBe('The VIN gives model year 2005, not 2006. Correct the year or the VIN.')
  })

  it('a damaged VIN is recorded as read when a reason is given, and the reason is kept', async () => {
    const body = towInBody(staff.dispatcher.id, (b) => Object.assign(b.vehicle, { vin: '1g4ah59h45g1183 5 1', vinOverrideReason: 'VIN plate bent; last digits hard to read' }))
    const res = await d.post('/api/vehicles', body).expect(201)
    const [v] = await app.db.select().from(t.vehicles).where(eq(t.vehicles.id, res.body.id))
    expect(v).toMatchObject({ vin: '1G4AH59H45G118351', vinOverrideReason: 'VIN plate bent; last digits hard to read' })
  })

  it('a short VIN on a 1978 vehicle is accepted without a reason (before the 17-character rule)', async () => {
    const body = towInBody(staff.dispatcher.id, (b) => Object.assign(b.vehicle, { vin: '1J57H8R123456', year: 1978 }))
    const res = await d.post('/api/vehicles', body).expect(201)
    const [v] = await app.db.select().from(t.vehicles).where(eq(t.vehicles.id, res.body.id))
    expect(v).toMatchObject({ vin: '1J57H8R123456', vinOverrideReason: null, year: 1978 })
  })

  it('a plate-only tow-in is recorded with its reason', async () => {
    const body = towInBody(staff.dispatcher.id, (b) => Object.assign(b.vehicle, { vin: null, vinOverrideReason: 'Plate only: dash plate missing', odometer: null, odometerUnreadable: true }))
    const res = await d.post('/api/vehicles', body).expect(201)
    const [v] = await app.db.select().from(t.vehicles).where(eq(t.vehicles.id, res.body.id))
    expect(v).toMatchObject({ vin: null, plate: '7KQM214', odometer: null, odometerUnreadable: true })
  })
})
