import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { historyEvents } from '@db/schema'
import { appendHistory } from '@db/history'
import { makePostgresTestApp, signedIn, TEST_HISTORY_KEY } from '../helpers/app'
import { makeStaff, makeVehicle } from '../helpers/factories'

let t: Awaited<ReturnType<typeof makePostgresTestApp>>
beforeAll(async () => {
  t = await makePostgresTestApp()
})
afterAll(() => t.close())

/** The database's own message, which Drizzle wraps in a "Failed query" error. */
async function refusal(query: PromiseLike<unknown>): Promise<string> {
  try {
    await query
    return 'not refused'
  } catch (err) {
    return String((err as { cause?: Error }).cause?.message ?? (err as Error).message)
  }
}

describe('on real PostgreSQL 15', () => {
  it('the committed migrations apply and a signed-in user gets the board', async () => {
    const staff = await makeStaff(t.db)
    const s = await signedIn(t.app, staff.office)
    const board = await s.get('/api/board').expect(200)
    expect(board.body.columns).toHaveLength(5)
  })

  it('history stays append-only: the trigger refuses UPDATE and DELETE', async () => {
    const { yard, manager } = await makeStaff(t.db)
    const v = await makeVehicle(t.db, yard.id)
    await t.db.transaction((tx) => appendHistory(tx, TEST_HISTORY_KEY, { vehicleId: v.id, actorId: manager.id, actorLabel: manager.name, kind: 'towed_in' }))
    expect(await refusal(t.db.update(historyEvents).set({ reason: 'rewritten' }))).toMatch(/append-only: UPDATE refused/)
    expect(await refusal(t.db.delete(historyEvents))).toMatch(/append-only: DELETE refused/)
  })

  it('twenty concurrent appends to one vehicle get twenty distinct, chained sequence numbers', async () => {
    const { yard, manager } = await makeStaff(t.db)
    const v = await makeVehicle(t.db, yard.id)
    await Promise.all(
      Array.from({ length: 20 }, (_, i) =>
        t.db.transaction((tx) => appendHistory(tx, TEST_HISTORY_KEY, { vehicleId: v.id, actorId: manager.id, actorLabel: manager.name, kind: 'corrected', reason: `note ${i}` })),
      ),
    )
    const rows = await t.db.select().from(historyEvents)
    const mine = rows.filter((r) => r.vehicleId === v.id).sort((a, b) => a.seq - b.seq)
    expect(mine.map((r) => r.seq)).toEqual(Array.from({ length: 20 }, (_, i) => i + 1))
    for (let i = 1; i < mine.length; i++) expect(mine[i]!.prevHash).toBe(mine[i - 1]!.hash)
  })
})
