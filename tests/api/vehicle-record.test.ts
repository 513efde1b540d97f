import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { makeTestApp, signedIn, type BrowserSession, type TestApp } from '../helpers/app'
import { makeCompany, makeStaff, makeUser } from '../helpers/factories'
import { counts, DEMO_RATES, sampleRuleSet, towInBody } from '../helpers/tow-in'

let app: TestApp
let staff: Awaited<ReturnType<typeof makeStaff>>
let d: BrowserSession
let id: string
beforeAll(async () => {
  app = await makeTestApp()
})
afterAll(() => app.close())
beforeEach(async () => {
  staff = await makeStaff(app.db)
  await app.db.update(t.yards).set({ towRates: DEMO_RATES, ruleSetId: await sampleRuleSet(app.db) }).where(eq(t.yards.id, staff.yard.id))
  d = await signedIn(app.app, staff.dispatcher)
  id = (await d.post('/api/vehicles', towInBody(staff.dispatcher.id)).expect(201)).body.id
})

const page = async () => (await d.get(`/api/vehicles/${id}`).expect(200)).body

describe('the vehicle page', () => {
  it.each(['manager', 'dispatcher', 'technician', 'office'] as const)('a %s sees the whole record, with the running bill and the next legal date', async (role) => {
    const s = await signedIn(app.app, staff[role])
    const body = (await s.get(`/api/vehicles/${id}`).expect(200)).body
    expect(body.vehicle.stockNumber).toMatch(/^T[A-Z]+-\d{4}-00001$/)
    expect(body.yard.code).toBe(staff.yard.code)
    expect(body.ruleSet).toMatchObject({ name: 'California (sample)', version: 1 })
    expect(body.ruleSet.caution).toMatch(/^Sample — verify with your local code/)
    // Arrived five minutes ago: the first storage day ($65) and the sample's impound fee ($95) run, and the tow is on the bill.
    expect(body.summary).toMatchObject({ daysOnLot: 1, towCents: 19_500, balanceCents: 6_500 + 9_500 + 19_500 })
  })

  it('a record the core refuses to bill (arrival 25 years ago) still opens, says why, and leaves the board working', async () => {
    const arrivedAt = new Date()
    arrivedAt.setFullYear(arrivedAt.getFullYear() - 25)
    await app.db.update(t.vehicles).set({ arrivedAt }).where(eq(t.vehicles.id, id))
    const body = await page()
    expect(body.summary).toBeNull()
    expect(body.billProblem).toMatch(/longer than 20 years/)
    const board = (await d.get('/api/board').expect(200)).body
    const card = board.columns.flatMap((c: { cards: { id: string }[] }) => c.cards).find((c: { id: string }) => c.id === id)
    expect(card.summary).toBeNull()
  })

  it('another company gets "not found" for the vehicle and its history', async () => {
    const other = await makeCompany(app.db, 'Rival Recovery')
    const s = await signedIn(app.app, await makeUser(app.db, other.company.id, 'manager'))
    expect((await s.get(`/api/vehicles/${id}`)).status).toBe(404)
    expect((await s.get(`/api/vehicles/${id}/history`)).status).toBe(404)
    expect((await s.get(`/api/vehicles/${id}/history/verify`)).status).toBe(404)
  })
})

describe('correcting the record', () => {
  const vehicleSection = (edit: Record<string, unknown>) => ({ ...towInBody(staff.dispatcher.id).vehicle, ...edit })

  it('records each changed field before and after, with who and why, and bumps the version', async () => {
    const res = await d.patch(`/api/vehicles/${id}`, { version: 1, reason: 'Plate misread at the gate', vehicle: vehicleSection({ plate: '7KQM241', colour: 'Grey' }) })
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    expect(res.body.version).toBe(2)
    const after = await page()
    expect(after.vehicle).toMatchObject({ plate: '7KQM241', colour: 'Grey', version: 2 })
    expect(after.history.at(-1)).toMatchObject({
      kind: 'corrected',
      actor: 'Test dispatcher',
      reason: 'Plate misread at the gate',
      before: { plate: '7KQM214', colour: 'Silver' },
      after: { plate: '7KQM241', colour: 'Grey' },
    })
  })

  it('a tow correction recomputes the charge and moves the arrival the bill runs from', async () => {
    const tow = towInBody(staff.dispatcher.id).tow
    const arrivedAt = new Date(Date.now() - 26 * 3_600_000).toISOString()
    const res = await d.patch(`/api/vehicles/${id}`, { version: 1, reason: 'Driver logged the wrong gate time; 12 road miles', tow: { ...tow, calledAt: null, hookedAt: null, arrivedAt, roadMiles: 12 } })
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    const after = await page()
    expect(after.vehicle.arrivedAt).toBe(arrivedAt)
    expect(after.tow.chargeCents).toBe(19_500 + 7 * 650)
    expect(after.history.at(-1).after).toMatchObject({ roadMiles: 12, chargeCents: 24_050, arrivedAt })
  })

  it('a correction made against an old version is a conflict and changes nothing', async () => {
    await d.patch(`/api/vehicles/${id}`, { version: 1, reason: 'Colour', vehicle: vehicleSection({ colour: 'Grey' }) }).expect(200)
    const before = await counts(app.db)
    const res = await d.patch(`/api/vehicles/${id}`, { version: 1, reason: 'Plate', vehicle: vehicleSection({ plate: 'XXX' }) })
    expect(res.status).toBe(409)
    expect(res.body).toMatchObject({ version: 2 })
    expect(await counts(app.db)).toEqual(before)
    expect((await page()).vehicle.plate).toBe('7KQM214')
  })

  it('a correction that changes nothing is refused', async () => {
    const res = await d.patch(`/api/vehicles/${id}`, { version: 1, reason: 'Checking', vehicle: vehicleSection({}) })
    expect(res.status).toBe(422)
    expect((await page()).history).toHaveLength(1)
  })

  it('an invalid correction names the field and writes nothing', async () => {
    const before = await counts(app.db)
    const res = await d.patch(`/api/vehicles/${id}`, { version: 1, reason: '', vehicle: vehicleSection({ vin: '1G4AH59H45G118351' }) })
    expect(res.status).toBe(400)
    expect(res.body.issues.map((i: { path: string }) => i.path).sort()).toEqual(['reason', 'vehicle.vin'])
    expect(await counts(app.db)).toEqual(before)
  })

  it('a technician may not correct the tow-in record', async () => {
    const s = await signedIn(app.app, staff.technician)
    expect((await s.patch(`/api/vehicles/${id}`, { version: 1, reason: 'x', vehicle: vehicleSection({ colour: 'Red' }) })).status).toBe(403)
  })
})
