import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { localDay, startOfLocalDay, weekday } from '@shared/domain/time'
import { glanceSchema } from '@shared/schemas/glance'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { DAY, sampleVersion, setHold } from '../helpers/board'
import { makeStaff, makeVehicle } from '../helpers/factories'

// Issue 12, "The yard at a glance": hand-built yards, each figure worked out by hand beside it.
// Storage: the California sample's placeholders ($65.00 a day for a car, a $95.00 impound fee once per
// stay, no tax: server/rule-sets/samples/california.json), by calendar day or part of one (Cal. Civ.
// Code § 3068.1(a)(1)). The yard's clock is America/Los_Angeles.

let app: TestApp
beforeAll(async () => {
  app = await makeTestApp()
})
afterAll(() => app.close())

const ZONE = 'America/Los_Angeles'
const HOUR = 3_600_000
const todayNum = () => localDay(ZONE, Date.now())
/** Noon on the yard's clock, `days` calendar days before today. */
const noonDaysAgo = (days: number) => new Date(startOfLocalDay(ZONE, todayNum() - days) + 12 * HOUR)

async function yard() {
  const staff = await makeStaff(app.db)
  return { staff, manager: await signedIn(app.app, staff.manager) }
}

describe('yard at a glance', () => {
  it('glance_planAndLot_eachSpaceSaysFreeOccupiedOrHeld_andTheLotIsCountedByColumnAndAge', async () => {
    const { staff, manager } = await yard()
    const [a1, a2] = await app.db
      .insert(t.yardSpaces)
      .values([
        { yardId: staff.yard.id, row: 'A', number: 1 },
        { yardId: staff.yard.id, row: 'A', number: 2 },
        { yardId: staff.yard.id, row: 'B', number: 1, size: 'wide' },
      ])
      .returning()
    const stored = await makeVehicle(app.db, staff.yard.id, { state: 'storage', spaceId: a1!.id, arrivedAt: noonDaysAgo(40) })
    const held = await makeVehicle(app.db, staff.yard.id, { state: 'arrival', spaceId: a2!.id, arrivedAt: noonDaysAgo(2) })
    await setHold(app.db, held.id, 'law_enforcement')
    await makeVehicle(app.db, staff.yard.id, { state: 'teardown', arrivedAt: noonDaysAgo(95) })
    await makeVehicle(app.db, staff.yard.id, { state: 'closed', disposition: 'returned_to_owner', arrivedAt: noonDaysAgo(5), closedAt: noonDaysAgo(1) })
    const other = await makeStaff(app.db)
    await makeVehicle(app.db, other.yard.id, { state: 'storage', arrivedAt: noonDaysAgo(3) })

    const g = glanceSchema.parse((await manager.get('/api/glance').expect(200)).body)
    expect(g.spaces.map((s) => [s.label, s.state, s.column, s.stockNumber, s.days])).toEqual([
      ['A-1', 'occupied', 'storage', stored.stockNumber, 40],
      ['A-2', 'held', 'arrival', held.stockNumber, 2],
      ['B-1', 'free', null, null, null],
    ])
    expect(g.unplaced).toBe(1)
    expect(g.columns).toEqual([
      { column: 'arrival', count: 1 },
      { column: 'teardown', count: 1 },
      { column: 'decision', count: 0 },
      { column: 'storage', count: 1 },
      { column: 'release', count: 0 },
    ])
    // 2 days → 0–7; 40 → 31–60; 95 → over 90. The closed one and the other company's are not on this lot.
    expect(g.ages).toEqual([
      { band: '0-7', count: 1 },
      { band: '8-30', count: 0 },
      { band: '31-60', count: 1 },
      { band: '61-90', count: 0 },
      { band: 'over-90', count: 1 },
    ])
  })

  it('glance_closed_threeReleasesOf2_4And9Days_averageFive_andOneLienSaleOfThreeIsAThird', async () => {
    const { staff, manager } = await yard()
    const closedAt = new Date(Date.now() - HOUR)
    for (const [days, disposition] of [[2, 'returned_to_owner'], [4, 'lien_sale'], [9, 'released_to_third_party']] as const) {
      await makeVehicle(app.db, staff.yard.id, { state: 'closed', disposition, arrivedAt: new Date(closedAt.getTime() - days * DAY), closedAt })
    }
    // Closed 20 weeks ago: before the 12 weeks the page covers.
    await makeVehicle(app.db, staff.yard.id, { state: 'closed', disposition: 'lien_sale', arrivedAt: new Date(Date.now() - 160 * DAY), closedAt: new Date(Date.now() - 140 * DAY) })
    const g = glanceSchema.parse((await manager.get('/api/glance').expect(200)).body)
    expect(g.closed).toMatchObject({ count: 3, averageDays: 5, lienSales: 1 })
    expect(g.closed.lienSaleShare).toBeCloseTo(1 / 3, 10)

    const empty = glanceSchema.parse((await (await signedIn(app.app, (await makeStaff(app.db)).manager)).get('/api/glance').expect(200)).body)
    expect(empty.closed).toMatchObject({ count: 0, averageDays: null, lienSales: 0, lienSaleShare: null })
  })

  it('glance_weeks_eachWeekIsWhatTheBillsGrewByFromMondayToSunday', async () => {
    const { staff, manager } = await yard()
    const ruleSetVersionId = await sampleVersion(app.db, 'california-sample')
    const today = todayNum()
    const thisMonday = today - ((weekday(today) + 6) % 7)
    // On the lot since 01:00 on last week's Monday, still there.
    await makeVehicle(app.db, staff.yard.id, { state: 'storage', ruleSetVersionId, arrivedAt: new Date(startOfLocalDay(ZONE, thisMonday - 7) + HOUR) })
    const g = glanceSchema.parse((await manager.get('/api/glance?weeks=4').expect(200)).body)
    expect(g.weeks).toHaveLength(4)
    expect(g.weeks.map((w) => w.storageCents)).toEqual([
      0,
      0,
      // Last week: its seven calendar days at $65.00 and the $95.00 impound fee.
      7 * 6_500 + 9_500,
      // This week: Monday to today, each calendar day or part of one at $65.00.
      (today - thisMonday + 1) * 6_500,
    ])
  })

  it('glance_onlyManagers_andABadWeekCountIsRefusedNamingTheField', async () => {
    const { staff, manager } = await yard()
    for (const role of ['office', 'dispatcher', 'technician'] as const) await (await signedIn(app.app, staff[role])).get('/api/glance').expect(403)
    for (const w of ['3', '53', 'x', '4.5']) {
      const res = await manager.get(`/api/glance?weeks=${w}`)
      expect(res.status, w).toBe(400)
      expect(res.body.issues[0].path, w).toBe('weeks')
    }
  })
})
