import { and, eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { historyOf } from '@db/history'
import { isoDate, dayFromIsoDate } from '@shared/domain/time'
import type { ClockEventKind } from '@shared/schemas/rule-sets'
import { saleDatePage, setSaleDate } from '../../server/publications/sale-date.service'
import type { VehicleChanges } from '../../server/vehicles/index'
import { makeTestApp, signedIn, TEST_HISTORY_KEY, type TestApp } from '../helpers/app'
import { DAY, sampleVersion } from '../helpers/board'
import { makeStaff, makeVehicle } from '../helpers/factories'

let t_: TestApp
let changes: VehicleChanges
beforeAll(async () => {
  t_ = await makeTestApp()
  changes = { db: t_.db, historyKey: TEST_HISTORY_KEY, boards: { changed: async () => {}, sessionsEnded: async () => {} } }
})
afterAll(() => t_.close())

const base = (id: string) => `/api/vehicles/${id}/sale-date`
// Monday 1 June 2026, noon in Los Angeles: "today" for the hand-worked cases.
const NOW = new Date('2026-06-01T19:00:00Z')
const mailed = (vehicleId: string, kind: ClockEventKind, day: string) =>
  t_.db.insert(t.clockEvents).values({ vehicleId, kind, at: new Date(`${day}T17:00:00Z`), source: 'notice-sending', sourceId: null })
const saleEvents = (vehicleId: string) => t_.db.select().from(t.clockEvents).where(and(eq(t.clockEvents.vehicleId, vehicleId), eq(t.clockEvents.kind, 'sale-scheduled')))

/** California's sample, valued over $4,000: Cal. Civ. Code § 3071 (the sample cites it for every step used here). */
async function californian(valueCents: number | null = 650_000, arrivedAt = new Date('2026-04-20T17:00:00Z')) {
  const staff = await makeStaff(t_.db)
  const ruleSetVersionId = await sampleVersion(t_.db, 'california-sample')
  const v = await makeVehicle(t_.db, staff.yard.id, { state: 'storage', ruleSetVersionId, estimatedValueCents: valueCents, estimatedValueSource: valueCents === null ? null : 'test', arrivedAt })
  return { staff, v }
}

describe('the lien sale date (Cal. Civ. Code § 3071, valued over $4,000)', () => {
  it('saleDate_noticeMailed_earliestIsTheTwentiethDayAfterTheMailing', async () => {
    const { staff, v } = await californian()
    // § 3071 as the sample cites it: the DMV's notice gives the owners 10 days to oppose; the yard's notice
    // of the sale goes at least 20 days before the sale. Mailed Wed 27 May 2026 → not before Tue 16 June 2026
    // (27 May + 20 calendar days; hand-counted). Opposition: 20 May + 10 = 30 May, earlier, so it does not decide.
    await mailed(v.id, 'state-notice-mailed', '2026-05-20')
    await mailed(v.id, 'lien-notice-mailed', '2026-05-27')
    expect(await saleDatePage(t_.db, staff.office, v.id, NOW)).toMatchObject({ applies: true, scheduled: null, earliest: '2026-06-16' })

    const before = (await historyOf(t_.db, v.id)).length
    const early = setSaleDate(changes, staff.office, v.id, { day: '2026-06-15' }, NOW)
    await expect(early).rejects.toMatchObject({ status: 400, extra: { earliest: '2026-06-16', issues: [{ path: 'day', message: expect.stringContaining('2026-06-16') }] } })
    expect(await saleEvents(v.id)).toEqual([])
    expect((await historyOf(t_.db, v.id)).length).toBe(before)

    await setSaleDate(changes, staff.office, v.id, { day: '2026-06-16' }, NOW)
    expect(await saleDatePage(t_.db, staff.office, v.id, NOW)).toMatchObject({ scheduled: '2026-06-16' })
    const history = await historyOf(t_.db, v.id)
    expect(history.at(-1)).toMatchObject({ kind: 'sale_date_set', after: { day: '2026-06-16' } })
  })

  it('saleDate_noticeNotYetMailed_leavesTheTwentyDaysFromToday; a mailing day on a closed post office counts earlier', async () => {
    const { staff, v } = await californian()
    // Nothing mailed yet: the notice can still go today (Mon 1 June), so the sale is not before 21 June
    // (1 June + 20 days, § 3071). For 20 June the notice would be due Sun 31 May, which the sample's closed
    // post offices move to Fri 29 May — already past.
    expect((await saleDatePage(t_.db, staff.office, v.id, NOW)).earliest).toBe('2026-06-21')
    await expect(setSaleDate(changes, staff.office, v.id, { day: '2026-06-20' }, NOW)).rejects.toMatchObject({ status: 400 })
    await setSaleDate(changes, staff.office, v.id, { day: '2026-06-30' }, NOW)
    // Moved earlier: the new day replaces the one on record (clocks start from the latest event of a kind).
    await setSaleDate(changes, staff.office, v.id, { day: '2026-06-21' }, NOW)
    expect((await saleEvents(v.id)).map((e) => e.at.toISOString())).toEqual(['2026-06-21T07:00:00.000Z'])
    expect((await historyOf(t_.db, v.id)).at(-1)).toMatchObject({ kind: 'sale_date_set', before: { day: '2026-06-30' }, after: { day: '2026-06-21' } })
  })

  it('saleDate_overHttp_earlyRefusedNamingTheField_validSaved_dispatcherForbidden', async () => {
    const { staff, v } = await californian(650_000, new Date(Date.now() - 40 * DAY))
    const s = await signedIn(t_.app, staff.office)
    const page = await s.get(base(v.id))
    expect(page.status).toBe(200)
    const earliest: string = page.body.earliest
    const dayBefore = isoDate(dayFromIsoDate(earliest) - 1)
    const res = await s.put(base(v.id), { day: dayBefore })
    expect(res.status).toBe(400)
    expect(res.body).toMatchObject({ code: 'saleTooEarly', params: { date: earliest } })
    expect(res.body.issues).toEqual([{ path: 'day', message: expect.stringContaining(earliest) }])
    expect(await saleEvents(v.id)).toEqual([])
    expect((await s.put(base(v.id), { day: 'soon' })).body.issues).toContainEqual({ path: 'day', message: 'Enter the sale date.', code: 'publications.enterSaleDate' })
    const ok = await s.put(base(v.id), { day: earliest })
    expect(ok.status).toBe(200)
    expect(ok.body.scheduled).toBe(earliest)
    const dispatcher = await signedIn(t_.app, staff.dispatcher)
    expect((await dispatcher.put(base(v.id), { day: earliest })).status).toBe(403)
  })

  it('saleDate_noValue_isRefusedUntilTheValueIsEntered', async () => {
    const { staff, v } = await californian(null)
    const s = await signedIn(t_.app, staff.office)
    expect((await s.get(base(v.id))).body).toMatchObject({ applies: false, blocked: 'needs-value', earliest: null })
    expect((await s.put(base(v.id), { day: '2027-01-04' })).status).toBe(422)
    expect(await saleEvents(v.id)).toEqual([])
  })
})
