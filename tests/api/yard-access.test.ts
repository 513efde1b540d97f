import { eq } from 'drizzle-orm'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { ACCESS } from '../../server/access'
import { makeTestApp, signedIn, type BrowserSession, type TestApp } from '../helpers/app'
import { makeStaff, makeUser, makeVehicle } from '../helpers/factories'
import { fetchSession, listening, openStream } from '../helpers/live'
import { photo, sampleRuleSet, towInBody } from '../helpers/tow-in'

// Issue 12, "Staff belong to one or more yards": a person reaches only the vehicles, files and lists of
// the yards they belong to. Another yard of the same company answers exactly as another company does.

let app: TestApp
let staff: Awaited<ReturnType<typeof makeStaff>>
let yardB: typeof t.yards.$inferSelect
let vehicleId: string
let stockNumber: string
let fileId: string
const callers = {} as Record<'otherYardManager' | 'otherYardOffice' | 'otherCompanyManager', BrowserSession>
let ours: BrowserSession

async function secondYard(companyId: string, code: string) {
  const [y] = await app.db
    .insert(t.yards)
    .values({ companyId, name: 'North lot', code, address: '2 North Road', lat: 36.5, lng: -119.3, timeZone: 'America/Denver' })
    .returning()
  return y!
}

/** A person of this company who belongs to yard B only. */
async function ofYardB(role: 'manager' | 'office') {
  const user = await makeUser(app.db, staff.company.id, role, { allYards: false })
  await app.db.insert(t.userYards).values({ userId: user.id, yardId: yardB.id })
  return user
}

beforeAll(async () => {
  app = await makeTestApp()
  staff = await makeStaff(app.db)
  yardB = await secondYard(staff.company.id, `N${staff.yard.code.slice(1)}`)
  // Both yards bill and count deadlines under the California sample, so yard A's vehicle is in every list.
  const ruleSetId = await sampleRuleSet(app.db)
  await app.db.update(t.yards).set({ ruleSetId }).where(eq(t.yards.companyId, staff.company.id))
  ours = await signedIn(app.app, staff.dispatcher)
  const created = await ours.agent
    .post('/api/vehicles')
    .set('x-csrf-token', ours.csrf)
    .field('data', JSON.stringify(towInBody(staff.dispatcher.id)))
    .attach('photos', await photo(), { filename: 'front.jpg', contentType: 'image/jpeg' })
    .expect(201)
  vehicleId = created.body.id
  // On the lot for 45 days, so that it is in the receivables, the aged inventory and the deadlines of yard A.
  await app.db.update(t.vehicles).set({ arrivedAt: new Date(Date.now() - 45 * 86_400_000) }).where(eq(t.vehicles.id, vehicleId))
  const [v] = await app.db.select().from(t.vehicles).where(eq(t.vehicles.id, vehicleId))
  expect(v!.yardId).toBe(staff.yard.id)
  stockNumber = v!.stockNumber
  const [f] = await app.db.select().from(t.files).where(eq(t.files.vehicleId, vehicleId))
  fileId = f!.id
  callers.otherYardManager = await signedIn(app.app, await ofYardB('manager'))
  callers.otherYardOffice = await signedIn(app.app, await ofYardB('office'))
  callers.otherCompanyManager = await signedIn(app.app, (await makeStaff(app.db)).manager)
}, 120_000)
afterAll(() => app.close())

const NOBODY = '00000000-0000-4000-8000-000000000000'
const url = (path: string, vehicle: string) => path.replace(':vehicleId', vehicle).replace(/:(\w+)/g, NOBODY).replace('{*splat}', 'x')

function call(s: BrowserSession, method: string, path: string) {
  const m = method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete'
  if (m === 'get') return s.get(path)
  return s.agent[m](path).set('x-csrf-token', s.csrf).send({})
}

async function vehicleNow() {
  const [v] = await app.db.select({ version: t.vehicles.version, state: t.vehicles.state, spaceId: t.vehicles.spaceId }).from(t.vehicles).where(eq(t.vehicles.id, vehicleId))
  return { ...v, events: await app.db.$count(t.historyEvents, eq(t.historyEvents.vehicleId, vehicleId)) }
}

const CALLERS = ['otherYardManager', 'otherYardOffice', 'otherCompanyManager'] as const

describe.each(CALLERS)('%s and a vehicle of yard A', (who) => {
  it('every vehicle route answers what a vehicle that does not exist answers, and nothing changes', async () => {
    const before = await vehicleNow()
    const leaks: string[] = []
    for (const key of Object.keys(ACCESS)) {
      const [method, path] = key.split(' ') as [string, string]
      if (!path.includes(':vehicleId') || ACCESS[key] === 'public') continue
      const theirs = (await call(callers[who], method, url(path, vehicleId))).status
      const none = (await call(callers[who], method, url(path, NOBODY))).status
      if (theirs < 400 || theirs !== none) leaks.push(`${key}: ${theirs} (a vehicle that does not exist: ${none})`)
    }
    expect(leaks).toEqual([])
    expect(await vehicleNow()).toEqual(before)
  })

  it.each(['/api/files/:id', '/api/files/:id/thumb'])('%s of a yard-A photo is 404, as a file that does not exist', async (path) => {
    expect((await callers[who].get(path.replace(':id', fileId))).status).toBe(404)
    expect((await callers[who].get(path.replace(':id', NOBODY))).status).toBe(404)
    expect((await ours.get(path.replace(':id', fileId))).status).toBe(200)
  })
})

// The lists a person reads: none of them names yard A's vehicle to someone of yard B.
const LISTS = [
  ['board', '/api/board', 'otherYardOffice'],
  ['search by stock number', `/api/vehicles/search?q=:stock`, 'otherYardOffice'],
  ['today', '/api/today', 'otherYardOffice'],
  ['receivables', '/api/reports/receivables', 'otherYardManager'],
  ['aged inventory', '/api/reports/aged', 'otherYardManager'],
  ['daily report', '/api/reports/daily', 'otherYardManager'],
  ['deadlines', '/api/deadlines', 'otherYardManager'],
  ['outbox', '/api/outbox', 'otherYardManager'],
  ['spaces', '/api/spaces', 'otherYardOffice'],
] as const

describe('lists are of the person’s yard', () => {
  it.each(LISTS)('%s: yard A’s vehicle is listed for yard A and not for yard B', async (_name, path, who) => {
    const p = path.replace(':stock', encodeURIComponent(stockNumber))
    const seenByA = await (await signedIn(app.app, staff.manager)).get(p)
    const seenByB = await callers[who].get(p)
    expect(seenByB.status, JSON.stringify(seenByB.body)).toBe(200)
    if (path !== '/api/spaces' && path !== '/api/outbox' && path !== '/api/reports/daily') expect(JSON.stringify(seenByA.body)).toContain(stockNumber)
    expect(JSON.stringify(seenByB.body)).not.toContain(stockNumber)
    expect(JSON.stringify(seenByB.body)).not.toContain(vehicleId)
  })
})

describe('the yard chooser', () => {
  it('a person of both yards lists both, chooses B and then reads B’s board; the choice is remembered', async () => {
    const both = await makeUser(app.db, staff.company.id, 'office')
    const s = await signedIn(app.app, both)
    const mine = await s.get('/api/yards/mine').expect(200)
    expect(mine.body.yards.map((y: { id: string }) => y.id)).toEqual([staff.yard.id, yardB.id])
    expect(mine.body.currentId).toBe(staff.yard.id)
    expect(JSON.stringify((await s.get('/api/board').expect(200)).body)).toContain(stockNumber)
    await s.agent.put('/api/yards/current').set('x-csrf-token', s.csrf).send({ yardId: yardB.id }).expect(200)
    const board = await s.get('/api/board').expect(200)
    expect(board.body.yard.name).toBe('North lot')
    expect(JSON.stringify(board.body)).not.toContain(stockNumber)
    // Signing in again keeps the choice.
    const again = await signedIn(app.app, both)
    expect((await again.get('/api/yards/mine').expect(200)).body.currentId).toBe(yardB.id)
    expect((await again.get('/api/yards/current').expect(200)).body.yard.id).toBe(yardB.id)
  })

  it.each([
    ['a yard the person does not belong to', (): string => staff.yard.id, 'otherYardOffice'],
    ['another company’s yard', (): string => staff.yard.id, 'otherCompanyManager'],
    ['a yard that does not exist', (): string => NOBODY, 'otherYardOffice'],
  ] as const)('choosing %s is 404 and changes nothing', async (_name, yardId, who) => {
    const before = (await callers[who].get('/api/yards/mine').expect(200)).body
    const res = await callers[who].agent.put('/api/yards/current').set('x-csrf-token', callers[who].csrf).send({ yardId: yardId() })
    expect(res.status).toBe(404)
    expect((await callers[who].get('/api/yards/mine').expect(200)).body).toEqual(before)
  })

  it('a person of one yard has one in the list (the chooser stays hidden)', async () => {
    const mine = await callers.otherYardOffice.get('/api/yards/mine').expect(200)
    expect(mine.body).toEqual({ yards: [{ id: yardB.id, name: 'North lot', code: yardB.code, timeZone: 'America/Denver' }], currentId: yardB.id })
  })

  it('a bad yard id is a 400 naming the field', async () => {
    const s = callers.otherYardOffice
    const res = await s.agent.put('/api/yards/current').set('x-csrf-token', s.csrf).send({ yardId: 'B' }).expect(400)
    expect(res.body.issues[0].path).toBe('yardId')
  })

  it('signed out, the chooser is refused', async () => {
    expect((await request(app.app).get('/api/yards/mine')).status).toBe(401)
  })
})

describe('the board stream of yard B', () => {
  it('never carries a yard-A event: the first card it hears is yard B’s own', async () => {
    const server = await listening(app.app)
    try {
      const onlyB = await ofYardB('office')
      const inB = await makeVehicle(app.db, yardB.id)
      const inA = await makeVehicle(app.db, staff.yard.id)
      const watcher = await fetchSession(server.url, onlyB)
      const stream = await openStream(server.url, watcher.cookie)
      const a = await fetchSession(server.url, staff.manager)
      await a.get('/api/board')
      expect((await a.post(`/api/vehicles/${inA.id}/moves`, { to: 'teardown', version: 1 })).status).toBe(200)
      const b = await fetchSession(server.url, await ofYardB('manager'))
      expect((await b.post(`/api/vehicles/${inB.id}/moves`, { to: 'teardown', version: 1 })).status).toBe(200)
      const first = await stream.next((m) => m.type === 'card')
      expect((first.body.card as { id: string }).id).toBe(inB.id)
      stream.close()
    } finally {
      await server.close()
    }
  })
})
