import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { makeTestApp, signedIn, type BrowserSession, type TestApp } from '../helpers/app'
import { makeStaff } from '../helpers/factories'
import { anotherVehicle, counts, towInBody } from '../helpers/tow-in'

let app: TestApp
let staff: Awaited<ReturnType<typeof makeStaff>>
let d: BrowserSession
let id: string
let spaces: (typeof t.yardSpaces.$inferSelect)[]
beforeAll(async () => {
  app = await makeTestApp()
})
afterAll(() => app.close())
beforeEach(async () => {
  staff = await makeStaff(app.db)
  spaces = await app.db.insert(t.yardSpaces).values([1, 2].map((number) => ({ yardId: staff.yard.id, row: 'B', number }))).returning()
  d = await signedIn(app.app, staff.dispatcher)
  id = (await d.post('/api/vehicles', towInBody(staff.dispatcher.id)).expect(201)).body.id
})

const history = async () => (await d.get(`/api/vehicles/${id}/history`).expect(200)).body.events as { kind: string; reason: string | null; before: unknown; after: unknown }[]
const version = async () => (await d.get(`/api/vehicles/${id}`)).body.vehicle.version as number

describe('holds', () => {
  it('a dispatcher sets a dispute hold and lifts it with a reason; both are in the history and the hold is kept', async () => {
    const set = await d.post(`/api/vehicles/${id}/holds`, { kind: 'dispute', note: 'Owner disputes the tow authorisation' })
    expect(set.status, JSON.stringify(set.body)).toBe(201)
    const holdId = set.body.holds[0].id
    const lift = await d.post(`/api/vehicles/${id}/holds/${holdId}/lift`, { reason: 'Plaza manager sent the signage photos' })
    expect(lift.status).toBe(200)
    expect(lift.body.holds[0]).toMatchObject({ kind: 'dispute', liftedBy: 'Test dispatcher', liftReason: 'Plaza manager sent the signage photos' })
    expect((await history()).map((e) => e.kind)).toEqual(['towed_in', 'hold_set', 'hold_lifted'])
    expect(await version()).toBe(3)
  })

  it('lifting a hold twice is a conflict; lifting needs a reason', async () => {
    const holdId = (await d.post(`/api/vehicles/${id}/holds`, { kind: 'lien', note: 'Mechanic lien claimed' })).body.holds[0].id
    expect((await d.post(`/api/vehicles/${id}/holds/${holdId}/lift`, { reason: '' })).body.issues).toEqual([
      { path: 'reason', message: 'Say why the hold is lifted, e.g. the release letter and who signed it.', code: 'holds.sayWhyHoldLifted' },
    ])
    await d.post(`/api/vehicles/${id}/holds/${holdId}/lift`, { reason: 'Paid off' }).expect(200)
    expect((await d.post(`/api/vehicles/${id}/holds/${holdId}/lift`, { reason: 'Again' })).status).toBe(409)
  })

  it('a law-enforcement hold needs the agency and its case number, and a refusal writes nothing', async () => {
    const before = await counts(app.db)
    const res = await d.post(`/api/vehicles/${id}/holds`, { kind: 'law_enforcement' })
    expect(res.body.issues.map((i: { path: string }) => i.path).sort()).toEqual(['agency', 'caseNumber'])
    expect(await counts(app.db)).toEqual(before)
  })

  it('a hold that ended in the past is refused on its date, and nothing is written', async () => {
    const before = await counts(app.db)
    const res = await d.post(`/api/vehicles/${id}/holds`, { kind: 'dispute', note: 'Owner disputes the tow', until: '2000-01-01T00:00:00Z' })
    expect(res.status).toBe(400)
    expect(res.body.issues).toEqual([{ path: 'until', message: 'This date has passed: a hold that has already ended need not be set.', code: 'holds.thisDateHasPassed' }])
    expect(await counts(app.db)).toEqual(before)
  })

  it('an office clerk may not set a hold', async () => {
    const o = await signedIn(app.app, staff.office)
    expect((await o.post(`/api/vehicles/${id}/holds`, { kind: 'dispute', note: 'x' })).status).toBe(403)
  })
})

describe('yard spaces', () => {
  it('lists the spaces and who is in them', async () => {
    await d.agent.put(`/api/vehicles/${id}/space`).set('x-csrf-token', d.csrf).send({ version: 1, spaceId: spaces[0]!.id }).expect(200)
    const tech = await signedIn(app.app, staff.technician)
    const list = (await tech.get('/api/spaces').expect(200)).body.spaces
    expect(list.map((s: { label: string; occupant: { id: string } | null }) => [s.label, s.occupant?.id ?? null])).toEqual([['B-1', id], ['B-2', null]])
  })

  it('moving a vehicle records from and to; a taken space is a conflict naming the vehicle in it', async () => {
    const put = (vehicleId: string, body: object) => d.agent.put(`/api/vehicles/${vehicleId}/space`).set('x-csrf-token', d.csrf).send(body)
    await put(id, { version: 1, spaceId: spaces[0]!.id }).expect(200)
    const res = await put(id, { version: 2, spaceId: spaces[1]!.id })
    expect(res.body).toEqual({ version: 3, space: 'B-2' })
    expect((await history()).at(-1)).toMatchObject({ kind: 'space_assigned', before: { space: 'B-1' }, after: { space: 'B-2' } })

    const other = await d.post('/api/vehicles', towInBody(staff.dispatcher.id, anotherVehicle)).expect(201)
    const taken = await put(other.body.id, { version: 1, spaceId: spaces[1]!.id })
    expect(taken.status).toBe(409)
    expect(taken.body.error).toBe(`Space B-2 already holds ${(await d.get(`/api/vehicles/${id}`)).body.vehicle.stockNumber}. Choose another space.`)
    const [row] = await app.db.select().from(t.vehicles).where(eq(t.vehicles.id, other.body.id))
    expect(row!.spaceId).toBeNull()
  })

  it('a space change against an old version is refused', async () => {
    const res = await d.agent.put(`/api/vehicles/${id}/space`).set('x-csrf-token', d.csrf).send({ version: 7, spaceId: spaces[0]!.id })
    expect(res.status).toBe(409)
  })

  it('the database itself refuses two vehicles in one space', async () => {
    const other = (await d.post('/api/vehicles', towInBody(staff.dispatcher.id, anotherVehicle)).expect(201)).body.id
    await app.db.update(t.vehicles).set({ spaceId: spaces[0]!.id }).where(eq(t.vehicles.id, id))
    await expect(app.db.update(t.vehicles).set({ spaceId: spaces[0]!.id }).where(eq(t.vehicles.id, other))).rejects.toThrow()
  })
})
