import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { makeTestApp, signedIn, type BrowserSession, type TestApp } from '../helpers/app'
import { makeStaff, makeUser, makeVehicle } from '../helpers/factories'
import { fetchSession, listening, openStream } from '../helpers/live'

// Issue 12, "Staff belong to one or more yards": the manager chooses a person's yards on the Staff page
// (PUT /api/users/:id/yards), in one transaction with its settings-audit row, and the person's access
// follows at once — the board of a yard they lost is no longer theirs, nor its vehicles.

let app: TestApp
let staff: Awaited<ReturnType<typeof makeStaff>>
let yardB: typeof t.yards.$inferSelect
let otherCompanyYard: typeof t.yards.$inferSelect
let manager: BrowserSession
let office: BrowserSession
let vehicleA: string
let vehicleB: string

beforeAll(async () => {
  app = await makeTestApp()
  staff = await makeStaff(app.db)
  yardB = (
    await app.db
      .insert(t.yards)
      .values({ companyId: staff.company.id, name: 'North lot', code: `N${staff.yard.code.slice(1)}`, address: '2 North Road', lat: 36.5, lng: -119.3, timeZone: 'America/Denver' })
      .returning()
  )[0]!
  otherCompanyYard = (await makeStaff(app.db)).yard
  vehicleA = (await makeVehicle(app.db, staff.yard.id)).id
  vehicleB = (await makeVehicle(app.db, yardB.id)).id
  manager = await signedIn(app.app, staff.manager)
  office = await signedIn(app.app, staff.office)
}, 120_000)
afterAll(() => app.close())

const setYards = (body: object, id = staff.office.id) => manager.put(`/api/users/${id}/yards`, body)
const officeRow = async () => ((await manager.get('/api/users').expect(200)).body.users as { id: string; allYards: boolean; yardIds: string[] }[]).find((u) => u.id === staff.office.id)!
const auditRows = () => app.db.select().from(t.settingsChanges).where(eq(t.settingsChanges.subjectId, staff.office.id))

describe('PUT /api/users/:id/yards', () => {
  it('setStaffYards_toYardBOnly_boardAndVehiclesFollow_andTheAuditSaysBeforeAndAfter', async () => {
    // Before: all yards (the default), so both vehicles are theirs.
    expect((await officeRow()).allYards).toBe(true)
    await office.get(`/api/vehicles/${vehicleA}`).expect(200)
    await office.get(`/api/vehicles/${vehicleB}`).expect(200)

    const res = await setYards({ allYards: false, yardIds: [yardB.id] }).expect(200)
    expect(res.body.user).toMatchObject({ id: staff.office.id, allYards: false, yardIds: [yardB.id] })
    expect(await officeRow()).toMatchObject({ allYards: false, yardIds: [yardB.id] })

    // Their board is yard B's now (their chosen yard, A, is no longer theirs); A's vehicle is "not found".
    const board = await office.get('/api/board').expect(200)
    expect(board.body.yard.name).toBe('North lot')
    await office.get(`/api/vehicles/${vehicleA}`).expect(404)
    await office.get(`/api/vehicles/${vehicleB}`).expect(200)
    const mine = await office.get('/api/yards/mine').expect(200)
    expect(mine.body.yards.map((y: { id: string }) => y.id)).toEqual([yardB.id])

    const [audit] = await auditRows()
    expect(audit).toMatchObject({
      area: 'staff',
      action: 'staff-yards',
      actorId: staff.manager.id,
      subjectLabel: staff.office.name,
      before: { allYards: true, yards: [] },
      after: { allYards: false, yards: ['North lot'] },
    })

    // Back to all yards: A's vehicle is theirs again, and the change is a second audit row.
    await setYards({ allYards: true }).expect(200)
    await office.get(`/api/vehicles/${vehicleA}`).expect(200)
    expect(await officeRow()).toMatchObject({ allYards: true, yardIds: [] })
    expect(await app.db.$count(t.userYards, eq(t.userYards.userId, staff.office.id))).toBe(0)
    expect(await auditRows()).toHaveLength(2)
  })

  it('setStaffYards_emptyListWithoutAllYards_is400NamingYardIds_andWritesNothing', async () => {
    const before = await auditRows()
    const res = await setYards({ allYards: false, yardIds: [] }).expect(400)
    expect(res.body.issues).toEqual([expect.objectContaining({ path: 'yardIds', message: 'Choose at least one yard, or all yards.' })])
    expect(await auditRows()).toHaveLength(before.length)
    expect((await officeRow()).allYards).toBe(true)
  })

  it('setStaffYards_aYardOfAnotherCompany_is404_andWritesNothing', async () => {
    const before = await auditRows()
    const res = await setYards({ allYards: false, yardIds: [yardB.id, otherCompanyYard.id] }).expect(404)
    expect(res.body.error).toBe('That yard was not found.')
    expect(await auditRows()).toHaveLength(before.length)
    expect(await app.db.$count(t.userYards, eq(t.userYards.userId, staff.office.id))).toBe(0)
    expect((await officeRow()).allYards).toBe(true)
  })

  it('setStaffYards_endsThePersonsOpenBoardStream_soNoCardOfALostYardReachesIt', async () => {
    const server = await listening(app.app)
    try {
      const clerk = await makeUser(app.db, staff.company.id, 'office')
      const watcher = await fetchSession(server.url, clerk)
      const stream = await openStream(server.url, watcher.cookie)
      expect(stream.status).toBe(200)
      await manager.put(`/api/users/${clerk.id}/yards`, { allYards: false, yardIds: [yardB.id] }).expect(200)
      // The stream of yard A ends (heartbeats are far apart, so only the change can end it this soon).
      await expect(stream.next(() => false)).rejects.toThrow('the event stream ended')
    } finally {
      await server.close()
    }
  })

  it('setStaffYards_aPersonOfAnotherCompany_is404', async () => {
    const other = await makeStaff(app.db)
    await setYards({ allYards: true }, other.office.id).expect(404)
  })

  it('setStaffYards_byANonManager_is403', async () => {
    await office.put(`/api/users/${staff.dispatcher.id}/yards`, { allYards: true }).expect(403)
  })
})
