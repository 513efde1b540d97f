import { randomUUID } from 'node:crypto'
import { tmpdir } from 'node:os'
import path from 'node:path'
import pg from 'pg'
import { pino } from 'pino'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { openDatabase, type DatabaseHandle } from '@db/client'
import { createApp } from '../../server/app'
import { localFileStore } from '../../server/files/index'
import { postgresBus, type LiveBus } from '../../server/live/index'
import { TEST_HISTORY_KEY } from '../helpers/app'
import { historyCount, vehicleRow } from '../helpers/board'
import { makeStaff, makeVehicle } from '../helpers/factories'
import { fetchSession, listening, openStream } from '../helpers/live'

// Two app servers on one real PostgreSQL database, as DESIGN.md's "Scale" runs them, each hearing
// the other through LISTEN/NOTIFY. The server is the throwaway one the API tests share (global
// setup); the database goes with it at the end of the run.
const database = `t_moves_${randomUUID().replaceAll('-', '').slice(0, 12)}`
let handle: DatabaseHandle
const buses: LiveBus[] = []
const servers: Awaited<ReturnType<typeof listening>>[] = []

beforeAll(async () => {
  const admin = new pg.Client({ connectionString: inject('postgresUrl') })
  await admin.connect()
  await admin.query(`create database ${database}`)
  await admin.end()
  const url = inject('postgresUrl').replace(/\/[^/]*$/, `/${database}`)
  handle = await openDatabase({ kind: 'postgres', url })
  await handle.migrate()
  const log = pino({ level: 'silent' })
  for (let i = 0; i < 2; i++) {
    const live = await postgresBus(url, log)
    buses.push(live)
    const app = createApp({
      historyKey: TEST_HISTORY_KEY,
      db: handle.db, log, live, files: localFileStore(path.join(tmpdir(), `holdfast-files-${database}`)),
      sessionSecret: 'test-secret-that-is-long-enough-for-signing', version: 'test',
      signInLimits: { perAccount: 1000, perIp: 1000, windowMs: 60_000 },
    })
    servers.push(await listening(app))
  }
})

afterAll(async () => {
  for (const s of servers) await s.close()
  for (const b of buses) await b.close()
  await handle?.close()
})

describe('moves on PostgreSQL', () => {
  it('move_twoServersMoveOneCardAtOnce_exactlyOneWinsEveryTime', async () => {
    const staff = await makeStaff(handle.db)
    const [a, b] = await Promise.all([fetchSession(servers[0]!.url, staff.dispatcher), fetchSession(servers[1]!.url, staff.technician)])
    const vehicles = await Promise.all(Array.from({ length: 12 }, () => makeVehicle(handle.db, staff.yard.id)))
    for (const v of vehicles) {
      const body = { to: 'teardown', version: 1 }
      const answers = await Promise.all([a.post(`/api/vehicles/${v.id}/moves`, body), b.post(`/api/vehicles/${v.id}/moves`, body)])
      expect(answers.map((r) => r.status).sort()).toEqual([200, 409])
      const loser = answers.find((r) => r.status === 409)!
      expect(((await loser.json()) as { current: { version: number } }).current.version).toBe(2)
      expect(await historyCount(handle.db, v.id)).toBe(1)
      expect((await vehicleRow(handle.db, v.id)).version).toBe(2)
    }
  })

  it('events_aMoveOnOneServer_reachesABoardOnTheOther', async () => {
    const staff = await makeStaff(handle.db)
    const v = await makeVehicle(handle.db, staff.yard.id)
    const mover = await fetchSession(servers[0]!.url, staff.manager)
    const watcher = await fetchSession(servers[1]!.url, staff.office)
    await watcher.get('/api/board')
    const stream = await openStream(servers[1]!.url, watcher.cookie)
    await stream.first()
    expect((await mover.post(`/api/vehicles/${v.id}/moves`, { to: 'teardown', version: 1 })).status).toBe(200)
    const got = await stream.next((m) => m.type === 'card')
    expect(got.body.card).toMatchObject({ id: v.id, state: 'teardown', version: 2 })
    // The other server's cached board was patched as well.
    const board = (await (await watcher.get('/api/board')).json()) as { columns: { column: string; cards: { id: string }[] }[] }
    expect(board.columns.find((c) => c.column === 'teardown')!.cards.map((c) => c.id)).toContain(v.id)
    stream.close()
  })

  it('events_signOutOnOneServer_endsTheStreamOnTheOther', async () => {
    const staff = await makeStaff(handle.db)
    const v = await makeVehicle(handle.db, staff.yard.id)
    const mover = await fetchSession(servers[0]!.url, staff.manager)
    const watcher = await fetchSession(servers[1]!.url, staff.office)
    const stream = await openStream(servers[1]!.url, watcher.cookie)
    await stream.first()
    // The session lives in the shared database: the other server signs it out.
    expect((await watcher.signOut(servers[0]!.url)).status).toBe(204)
    expect((await mover.post(`/api/vehicles/${v.id}/moves`, { to: 'teardown', version: 1 })).status).toBe(200)
    expect(await stream.first()).toBeNull()
  })

  it('events_deactivatedOnOneServer_endsTheStreamOnTheOther', async () => {
    const staff = await makeStaff(handle.db)
    const v = await makeVehicle(handle.db, staff.yard.id)
    const manager = await fetchSession(servers[0]!.url, staff.manager)
    const watcher = await fetchSession(servers[1]!.url, staff.office)
    const stream = await openStream(servers[1]!.url, watcher.cookie)
    await stream.first()
    expect((await manager.patch(`/api/users/${staff.office.id}`, { active: false })).status).toBe(200)
    expect((await manager.post(`/api/vehicles/${v.id}/moves`, { to: 'teardown', version: 1 })).status).toBe(200)
    expect(await stream.first()).toBeNull()
  })
})
