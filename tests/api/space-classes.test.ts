import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { makeTestApp, signedIn, type BrowserSession, type TestApp } from '../helpers/app'
import { makeStaff } from '../helpers/factories'
import { anotherVehicle, sampleRuleSet, towInBody } from '../helpers/tow-in'

// Issue 12: a space has a size class; a vehicle's class decides which spaces it fits (shared/domain/vehicle/space-fit.ts).
let app: TestApp
let staff: Awaited<ReturnType<typeof makeStaff>>
let d: BrowserSession
let space: Record<'bay' | 'car' | 'wide' | 'retired', string>
beforeAll(async () => {
  app = await makeTestApp()
})
afterAll(() => app.close())
beforeEach(async () => {
  staff = await makeStaff(app.db)
  // The California sample's classes: standard, heavy, motorcycle.
  await app.db.update(t.yards).set({ ruleSetId: await sampleRuleSet(app.db) }).where(eq(t.yards.id, staff.yard.id))
  const rows = await app.db
    .insert(t.yardSpaces)
    .values([
      { yardId: staff.yard.id, row: 'M', number: 1, size: 'motorcycle' as const },
      { yardId: staff.yard.id, row: 'C', number: 1, size: 'standard' as const },
      { yardId: staff.yard.id, row: 'H', number: 1, size: 'wide' as const },
      { yardId: staff.yard.id, row: 'C', number: 2, size: 'standard' as const, retiredAt: new Date() },
    ])
    .returning()
  space = { bay: rows[0]!.id, car: rows[1]!.id, wide: rows[2]!.id, retired: rows[3]!.id }
  d = await signedIn(app.app, staff.dispatcher)
})

const towIn = (vehicleClass: string, spaceId?: string) =>
  d.post(
    '/api/vehicles',
    towInBody(staff.dispatcher.id, (b) => {
      anotherVehicle(b)
      b.vehicle.vehicleClass = vehicleClass
      if (spaceId) b.spaceId = spaceId
    }),
  )
const put = (id: string, version: number, spaceId: string) => d.agent.put(`/api/vehicles/${id}/space`).set('x-csrf-token', d.csrf).send({ version, spaceId })
const events = async (id: string) => app.db.$count(t.historyEvents, eq(t.historyEvents.vehicleId, id))

describe('space classes', () => {
  it('a car put in a motorcycle bay is refused with the reason, naming spaceId; nothing is written', async () => {
    const id = (await towIn('standard').expect(201)).body.id
    const before = await events(id)
    const res = await put(id, 1, space.bay)
    expect(res.status).toBe(422)
    expect(res.body.issues).toEqual([
      {
        path: 'spaceId',
        message: 'Space M-1: This vehicle needs a car space or larger; this is a motorcycle bay.',
        code: 'spaces.tooSmall',
        params: { label: 'M-1', reason: 'This vehicle needs a car space or larger; this is a motorcycle bay.', fitCode: 'tooSmall', needs: 'standard', size: 'motorcycle' },
      },
    ])
    expect(res.body.needs).toBe('standard')
    const [v] = await app.db.select().from(t.vehicles).where(eq(t.vehicles.id, id))
    expect(v).toMatchObject({ spaceId: null, version: 1 })
    expect(await events(id)).toBe(before)
  })

  it('a heavy vehicle fits only the heavy-duty space; a motorcycle fits the bay', async () => {
    const made = await towIn('heavy')
    expect(made.status, JSON.stringify(made.body)).toBe(201)
    const heavy = made.body.id
    expect((await put(heavy, 1, space.car)).status).toBe(422)
    expect((await put(heavy, 1, space.wide)).status).toBe(200)
    const bike = (await towIn('motorcycle').expect(201)).body.id
    expect((await put(bike, 1, space.bay)).status).toBe(200)
  })

  it('the tow-in form refuses a space the vehicle does not fit, and logs nothing', async () => {
    const before = await app.db.$count(t.vehicles, eq(t.vehicles.yardId, staff.yard.id))
    const res = await towIn('standard', space.bay)
    expect(res.status).toBe(422)
    expect(res.body.issues[0].path).toBe('spaceId')
    expect(await app.db.$count(t.vehicles, eq(t.vehicles.yardId, staff.yard.id))).toBe(before)
  })

  it('a retired space takes no vehicle and the list says it is retired', async () => {
    const id = (await towIn('standard').expect(201)).body.id
    const res = await put(id, 1, space.retired)
    expect(res.status).toBe(409)
    expect(res.body.issues).toEqual([{ path: 'spaceId', message: 'Space C-2 is retired. Choose another space.', code: 'spaces.retired', params: { label: 'C-2' } }])
    const list = (await d.get('/api/spaces').expect(200)).body.spaces as { label: string; size: string; retired: boolean }[]
    expect(list.find((s) => s.label === 'C-2')).toMatchObject({ retired: true })
    expect(list.find((s) => s.label === 'M-1')).toMatchObject({ size: 'motorcycle', retired: false })
  })
})
