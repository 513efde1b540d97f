import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { verifyChain, historyOf } from '@db/history'
import * as t from '@db/schema'
import { makeTestApp, signedIn, type TestApp, TEST_HISTORY_KEY } from '../helpers/app'
import { makeStaff } from '../helpers/factories'
import { anotherVehicle, counts, DEMO_RATES, sampleRuleSet, towInBody } from '../helpers/tow-in'

let app: TestApp
let staff: Awaited<ReturnType<typeof makeStaff>>
beforeAll(async () => {
  app = await makeTestApp()
})
afterAll(() => app.close())
beforeEach(async () => {
  staff = await makeStaff(app.db)
  await app.db.update(t.yards).set({ towRates: DEMO_RATES, ruleSetId: await sampleRuleSet(app.db) }).where(eq(t.yards.id, staff.yard.id))
})

const year = () => new Date().getFullYear()

describe('logging a tow-in', () => {
  it('a dispatcher logs a vehicle and it gets a stock number, a tow, its property and a first history entry', async () => {
    const d = await signedIn(app.app, staff.dispatcher)
    const res = await d.post('/api/vehicles', towInBody(staff.dispatcher.id))
    expect(res.status).toBe(201)
    expect(res.body.stockNumber).toBe(`${staff.yard.code}-${year()}-00001`)
    const page = (await d.get(`/api/vehicles/${res.body.id}`)).body
    expect(page.vehicle).toMatchObject({ state: 'arrival', make: 'Orlan', plate: '7KQM214', vin: '1G4AH59H45G118341', checkedBy: { name: 'Test dispatcher' } })
    expect(page.vehicle.vehicleClassLabel).toBe('Passenger car or light truck')
    expect(page.tow).toMatchObject({ reason: 'breakdown', requesterName: 'Owner by phone', driver: 'Tomas Reyna' })
    expect(page.property).toEqual([expect.objectContaining({ item: 'Child seat', location: 'Back seat', count: 1 })])
    expect(page.history).toEqual([expect.objectContaining({ seq: 1, kind: 'towed_in', actor: 'Test dispatcher', toState: 'arrival', reason: 'Breakdown' })])
    // The board's shape belongs to the board; here it only has to list the new vehicle.
    const board = await d.get('/api/board')
    expect(board.status).toBe(200)
    expect(JSON.stringify(board.body)).toContain(res.body.stockNumber)
  })

  it('stores the rule-set version the vehicle arrived under', async () => {
    const d = await signedIn(app.app, staff.dispatcher)
    const res = await d.post('/api/vehicles', towInBody(staff.dispatcher.id))
    const [v] = await app.db.select().from(t.vehicles).where(eq(t.vehicles.id, res.body.id))
    const [version] = await app.db.select().from(t.ruleSetVersions).where(eq(t.ruleSetVersions.ruleSetId, (await sampleRuleSet(app.db))))
    expect(v!.ruleSetVersionId).toBe(version!.id)
  })

  it('stock numbers run on per yard and year, and a refused tow-in takes none', async () => {
    const d = await signedIn(app.app, staff.dispatcher)
    const first = await d.post('/api/vehicles', towInBody(staff.dispatcher.id))
    await d.post('/api/vehicles', towInBody(staff.dispatcher.id, (b) => (b.vehicle.make = ''))).expect(400)
    const second = await d.post('/api/vehicles', towInBody(staff.dispatcher.id, anotherVehicle))
    expect([first.body.stockNumber, second.body.stockNumber]).toEqual([`${staff.yard.code}-${year()}-00001`, `${staff.yard.code}-${year()}-00002`])
  })

  it('works the tow charge out on the server from the yard rates; road miles typed in win over the pin', async () => {
    const d = await signedIn(app.app, staff.dispatcher)
    // The pin is under two great-circle miles from the yard, inside the five the hook-up includes.
    const near = await d.post('/api/vehicles', { ...towInBody(staff.dispatcher.id), chargeCents: 1 })
    const road = await d.post('/api/vehicles', towInBody(staff.dispatcher.id, (b) => (anotherVehicle(b), Object.assign(b.tow, { roadMiles: 12, dollies: true }))))
    const charge = async (id: string) => (await d.get(`/api/vehicles/${id}`)).body.tow
    expect((await charge(near.body.id)).chargeCents).toBe(19_500)
    // 12 road miles less 5 included = 7 × $6.50, plus $75 for dollies.
    const r = await charge(road.body.id)
    expect(r.chargeCents).toBe(19_500 + 7 * 650 + 7_500)
    expect(r.chargeLines.map((l: { code: string }) => l.code)).toEqual(['hook-up', 'mileage', 'dollies'])
    expect(r.straightMiles).toBeGreaterThan(1)
    expect(r.straightMiles).toBeLessThan(2)
  })

  it('sets the holds given at intake, each with its own history entry, and keeps the chain valid', async () => {
    const d = await signedIn(app.app, staff.dispatcher)
    const body = towInBody(staff.dispatcher.id, (b) => {
      b.tow.reason = 'law_enforcement'
      b.tow.requesterAgency = 'Orrin Flats Police Department'
      b.holds = [{ kind: 'law_enforcement', agency: 'Orrin Flats Police Department', caseNumber: 'OF-26-12001', until: new Date(Date.now() + 9 * 86_400_000).toISOString() }]
    })
    const res = await d.post('/api/vehicles', body).expect(201)
    const page = (await d.get(`/api/vehicles/${res.body.id}`)).body
    expect(page.holds).toEqual([expect.objectContaining({ kind: 'law_enforcement', caseNumber: 'OF-26-12001', setBy: 'Test dispatcher', liftedAt: null })])
    expect(page.history.map((e: { kind: string }) => e.kind)).toEqual(['towed_in', 'hold_set'])
    expect(verifyChain(TEST_HISTORY_KEY, await historyOf(app.db, res.body.id)).ok).toBe(true)
  })

  it('a space given at intake is taken, and a second vehicle cannot have it', async () => {
    const [space] = await app.db.insert(t.yardSpaces).values({ yardId: staff.yard.id, row: 'A', number: 3 }).returning()
    const d = await signedIn(app.app, staff.dispatcher)
    const first = await d.post('/api/vehicles', towInBody(staff.dispatcher.id, (b) => (b.spaceId = space!.id))).expect(201)
    const before = await counts(app.db)
    const second = await d.post('/api/vehicles', towInBody(staff.dispatcher.id, (b) => (anotherVehicle(b), (b.spaceId = space!.id))))
    expect(second.status).toBe(409)
    expect(second.body.error).toBe(`Space A-3 already holds ${first.body.stockNumber}. Choose another space.`)
    expect(second.body.issues).toEqual([{ path: 'spaceId', message: second.body.error, code: 'spaces.takenBy', params: { label: 'A-3', stock: first.body.stockNumber } }])
    expect(await counts(app.db)).toEqual(before)
  })

  it.each(['technician', 'office'] as const)('a %s cannot log a tow-in and nothing is written', async (role) => {
    const s = await signedIn(app.app, staff[role])
    const before = await counts(app.db)
    expect((await s.post('/api/vehicles', towInBody(staff[role].id))).status).toBe(403)
    expect((await s.get('/api/vehicles/intake-options')).status).toBe(403)
    expect(await counts(app.db)).toEqual(before)
  })

  it('offers the yard, its rule-set classes and the company staff to the form', async () => {
    const d = await signedIn(app.app, staff.dispatcher)
    const res = await d.get('/api/vehicles/intake-options').expect(200)
    expect(res.body.yard).toMatchObject({ code: staff.yard.code, ratesSet: true, towRates: { hookUpCents: 19_500 } })
    expect(res.body.vehicleClasses.map((c: { code: string }) => c.code)).toEqual(['standard', 'heavy', 'motorcycle'])
    expect(res.body.staff.map((u: { id: string }) => u.id).sort()).toEqual([staff.manager, staff.dispatcher, staff.technician, staff.office].map((u) => u.id).sort())
  })
})
