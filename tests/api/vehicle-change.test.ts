import { randomUUID } from 'node:crypto'
import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Tx } from '@db/client'
import { historyOf } from '@db/history'
import * as t from '@db/schema'
import type { BoardCard } from '@shared/schemas/board'
import { AppError } from '../../server/errors'
import type { VehicleChange } from '../../server/live/index'
import { changeVehicle, createVehicle, type VehicleChanges } from '../../server/vehicles/index'
import { makeTestApp, type TestApp, TEST_HISTORY_KEY } from '../helpers/app'
import { historyCount, vehicleRow } from '../helpers/board'
import { makeStaff, makeVehicle } from '../helpers/factories'

let app: TestApp
beforeAll(async () => {
  app = await makeTestApp()
})
afterAll(() => app.close())

/** The unit of work on the test database, with boards that only remember what they were told. */
function changesHeard() {
  const heard: VehicleChange[] = []
  const changes: VehicleChanges = { db: app.db, historyKey: TEST_HISTORY_KEY, boards: { changed: async (c) => void heard.push(c), sessionsEnded: async () => {} } }
  return { changes, heard }
}

const holdsOf = (vehicleId: string) => app.db.select().from(t.holds).where(eq(t.holds.vehicleId, vehicleId))

describe('changeVehicle: the one way to change a vehicle', () => {
  it('change_workDone_setsTheColumnsBumpsTheVersionAppendsHistoryAndTellsTheBoardsItsYard', async () => {
    const staff = await makeStaff(app.db)
    const v = await makeVehicle(app.db, staff.yard.id, { colour: 'Red' })
    const { changes, heard } = changesHeard()
    const done = await changeVehicle(changes, staff.dispatcher, v.id, async ({ set, record, vehicle }) => {
      set({ colour: 'Grey' })
      record({ kind: 'corrected', reason: 'Misread at the gate', before: { colour: vehicle.colour }, after: { colour: 'Grey' } })
      return 'answer'
    }, { expectedVersion: 1 })
    expect(done).toEqual({ result: 'answer', version: 2, changed: true, card: undefined })
    expect(await vehicleRow(app.db, v.id)).toMatchObject({ colour: 'Grey', version: 2 })
    const [event] = await historyOf(app.db, v.id)
    expect(event).toMatchObject({ seq: 1, kind: 'corrected', actorId: staff.dispatcher.id, actorLabel: staff.dispatcher.name, before: { colour: 'Red' }, after: { colour: 'Grey' } })
    expect(heard).toEqual([{ yardId: staff.yard.id, vehicleId: v.id, cause: 'corrected', card: undefined }])
  })

  it('change_workThrowsAfterWriting_rollsBackTheChangeAndTheHistoryAndTellsNoBoard', async () => {
    const staff = await makeStaff(app.db)
    const v = await makeVehicle(app.db, staff.yard.id)
    const before = await vehicleRow(app.db, v.id)
    const { changes, heard } = changesHeard()
    const failing = changeVehicle(changes, staff.dispatcher, v.id, async ({ tx, set, record }) => {
      await tx.insert(t.holds).values({ vehicleId: v.id, kind: 'dispute', note: 'Owner disputes the tow', setById: staff.dispatcher.id })
      set({ colour: 'Grey' })
      record({ kind: 'hold_set', after: { kind: 'dispute' } })
      throw new Error('the printer caught fire')
    })
    await expect(failing).rejects.toThrow('the printer caught fire')
    expect(await vehicleRow(app.db, v.id)).toEqual(before)
    expect(await holdsOf(v.id)).toEqual([])
    expect(await historyCount(app.db, v.id)).toBe(0)
    expect(heard).toEqual([])
  })

  it('change_staleExpectedVersion_is409WithTheCurrentVersionAndTheWorkNeverRuns', async () => {
    const staff = await makeStaff(app.db)
    const v = await makeVehicle(app.db, staff.yard.id, { version: 4 })
    const { changes, heard } = changesHeard()
    let ran = false
    const stale = changeVehicle(changes, staff.dispatcher, v.id, async ({ record }) => {
      ran = true
      record({ kind: 'corrected' })
    }, { expectedVersion: 3 })
    await expect(stale).rejects.toSatisfy((e) => e instanceof AppError && e.status === 409 && e.extra.version === 4)
    expect(ran).toBe(false)
    expect((await vehicleRow(app.db, v.id)).version).toBe(4)
    expect(await historyCount(app.db, v.id)).toBe(0)
    expect(heard).toEqual([])
  })

  it('change_workRecordsNothing_changesNothingAndTellsNoBoard', async () => {
    const staff = await makeStaff(app.db)
    const v = await makeVehicle(app.db, staff.yard.id)
    const { changes, heard } = changesHeard()
    expect(await changeVehicle(changes, staff.technician, v.id, async () => 'already so')).toEqual({ result: 'already so', version: 1, changed: false })
    expect((await vehicleRow(app.db, v.id)).version).toBe(1)
    expect(heard).toEqual([])
  })

  it('change_columnsSetWithoutAHistoryEvent_isRefusedAndWritesNothing', async () => {
    const staff = await makeStaff(app.db)
    const v = await makeVehicle(app.db, staff.yard.id, { colour: 'Red' })
    const { changes, heard } = changesHeard()
    await expect(changeVehicle(changes, staff.dispatcher, v.id, async ({ set }) => set({ colour: 'Grey' }))).rejects.toThrow(/history/)
    expect(await vehicleRow(app.db, v.id)).toMatchObject({ colour: 'Red', version: 1 })
    expect(heard).toEqual([])
  })

  it('change_vehicleOfAnotherCompany_isNotFoundAndTheWorkNeverRuns', async () => {
    const ours = await makeStaff(app.db)
    const theirs = await makeStaff(app.db)
    const v = await makeVehicle(app.db, theirs.yard.id)
    const { changes } = changesHeard()
    let ran = false
    const refused = changeVehicle(changes, ours.manager, v.id, async () => void (ran = true))
    await expect(refused).rejects.toSatisfy((e) => e instanceof AppError && e.status === 404)
    expect(ran).toBe(false)
  })

  it('change_cardAsked_isBuiltAfterTheCommitAndHandedToTheBoards', async () => {
    const staff = await makeStaff(app.db)
    const v = await makeVehicle(app.db, staff.yard.id)
    const { changes, heard } = changesHeard()
    const done = await changeVehicle(changes, staff.dispatcher, v.id, async ({ set, record }) => {
      set({ state: 'teardown' })
      record({ kind: 'moved', fromState: 'arrival', toState: 'teardown' })
    }, {
      // Read outside the transaction: it sees the committed row.
      card: async (db) => ({ version: (await vehicleRow(db, v.id)).version }) as unknown as BoardCard,
    })
    expect(done.card).toEqual({ version: 2 })
    expect(heard[0]!.card).toBe(done.card)
  })
})

describe('createVehicle: a vehicle and the start of its history, or neither', () => {
  const insert = (tx: Tx, id: string, yardId: string) =>
    tx.insert(t.vehicles).values({ id, yardId, stockNumber: `TST-${id.slice(0, 8)}`, arrivedAt: new Date() })

  it('create_workInsertsAndRecords_appendsTheFirstEventsAndTellsTheBoards', async () => {
    const staff = await makeStaff(app.db)
    const { changes, heard } = changesHeard()
    const id = randomUUID()
    await createVehicle(changes, staff.dispatcher, staff.yard, id, async ({ tx, record }) => {
      await insert(tx, id, staff.yard.id)
      record({ kind: 'towed_in', toState: 'arrival' })
      record({ kind: 'hold_set', after: { kind: 'lien' } })
    })
    expect((await historyOf(app.db, id)).map((e) => [e.seq, e.kind])).toEqual([[1, 'towed_in'], [2, 'hold_set']])
    expect(heard).toEqual([{ yardId: staff.yard.id, vehicleId: id, cause: 'towed_in', card: undefined }])
  })

  it('create_workThrows_leavesNoVehicleAndNoHistory', async () => {
    const staff = await makeStaff(app.db)
    const { changes, heard } = changesHeard()
    const id = randomUUID()
    const failing = createVehicle(changes, staff.dispatcher, staff.yard, id, async ({ tx, record }) => {
      await insert(tx, id, staff.yard.id)
      record({ kind: 'towed_in', toState: 'arrival' })
      throw new Error('the space was taken')
    })
    await expect(failing).rejects.toThrow('the space was taken')
    expect(await app.db.$count(t.vehicles, eq(t.vehicles.id, id))).toBe(0)
    expect(await app.db.$count(t.historyEvents, eq(t.historyEvents.vehicleId, id))).toBe(0)
    expect(heard).toEqual([])
  })
})
