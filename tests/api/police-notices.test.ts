import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { historyOf } from '@db/history'
import * as t from '@db/schema'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { historyCount, sampleVersion, vehicleRow } from '../helpers/board'
import type { Database } from '@db/client'
import { makeStaff, makeVehicle } from '../helpers/factories'
import { towInBody } from '../helpers/tow-in'

let t_: TestApp
beforeAll(async () => {
  t_ = await makeTestApp()
})
afterAll(() => t_.close())

const MIN = 60_000
const noticeOf = (id: string) => `/api/vehicles/${id}/police-notice`

/** A vehicle towed under a sample rule set, called in `calledAgoMin` minutes ago and at the yard 10 minutes later. */
async function towed(reason: 'private_property' | 'breakdown' = 'private_property', slug = 'california-sample', calledAgoMin = 30) {
  const staff = await makeStaff(t_.db)
  const calledAt = new Date(Date.now() - calledAgoMin * MIN)
  const arrivedAt = new Date(calledAt.getTime() + 10 * MIN)
  const v = await makeVehicle(t_.db, staff.yard.id, { state: 'arrival', ruleSetVersionId: await sampleVersion(t_.db, slug), arrivedAt })
  await t_.db.insert(t.tows).values({ vehicleId: v.id, reason, calledAt, arrivedAt, requesterName: 'Lot attendant' })
  return { staff, v, calledAt, arrivedAt }
}

const page = async (s: Awaited<ReturnType<typeof signedIn>>, id: string) => (await s.get(`/api/vehicles/${id}`).expect(200)).body

describe('the police-notification clock on the vehicle page', () => {
  // Cal. Veh. Code § 22658 [M, from memory]: one hour after the tow is authorized — here, the call.
  it('policeClock_californiaPrivatePropertyTow_isDueOneHourAfterTheCall', async () => {
    const { staff, v, calledAt } = await towed()
    const s = await signedIn(t_.app, staff.dispatcher)
    const clock = (await page(s, v.id)).summary.policeNotice
    expect(clock).toMatchObject({ status: 'open', hours: 1, start: 'called', startAt: calledAt.toISOString(), dueAt: new Date(calledAt.getTime() + 60 * MIN).toISOString(), notification: null })
    expect(clock.minutesLeft).toBeGreaterThan(25)
    expect(clock.minutesLeft).toBeLessThanOrEqual(30)
    expect(clock.source.citation).toContain('22658')
  })

  // Fla. Stat. § 715.07(2)(a) [M, from memory]: 30 minutes after the tow is completed (the arrival).
  it('policeClock_floridaPrivatePropertyTowPastHalfAnHour_isOverdue', async () => {
    const { staff, v, arrivedAt } = await towed('private_property', 'florida-sample', 60)
    const s = await signedIn(t_.app, staff.dispatcher)
    const clock = (await page(s, v.id)).summary.policeNotice
    expect(clock).toMatchObject({ status: 'overdue', hours: 0.5, start: 'arrived', dueAt: new Date(arrivedAt.getTime() + 30 * MIN).toISOString() })
    expect(clock.minutesLeft).toBeLessThan(0)
  })

  it('policeClock_breakdownTow_hasNoPoliceClock', async () => {
    const { staff, v } = await towed('breakdown')
    const s = await signedIn(t_.app, staff.dispatcher)
    expect((await page(s, v.id)).summary.policeNotice).toBeNull()
  })

  it('policeClock_onTheBoardCard_showsAtOnce', async () => {
    const { staff, v } = await towed()
    const s = await signedIn(t_.app, staff.dispatcher)
    const board = (await s.get('/api/board').expect(200)).body
    const card = board.columns.flatMap((c: { cards: { id: string }[] }) => c.cards).find((c: { id: string }) => c.id === v.id)
    expect(card.summary.policeNotice).toMatchObject({ status: 'open', hours: 1 })
  })
})

describe('POST /api/vehicles/:vehicleId/police-notice', () => {
  it.each(['dispatcher', 'manager'] as const)('recordPoliceNotice_%s_meetsTheClockWithItsHistoryEvent', async (role) => {
    const { staff, v } = await towed()
    const s = await signedIn(t_.app, staff[role])
    const notifiedAt = new Date(Date.now() - 5 * MIN).toISOString()
    const res = await s.post(noticeOf(v.id), { agency: 'Riverton Police Department', person: 'Sgt. Ada Quill', notifiedAt, reportNumber: 'PP-2026-0412' })
    expect(res.status).toBe(201)
    expect(res.body.version).toBe(2)
    expect(res.body.clock).toMatchObject({ status: 'met', notification: { agency: 'Riverton Police Department', person: 'Sgt. Ada Quill', notifiedAt, reportNumber: 'PP-2026-0412' } })
    const [event] = await historyOf(t_.db, v.id)
    expect(event).toMatchObject({ kind: 'police_notified', actorId: staff[role].id, after: { agency: 'Riverton Police Department', reportNumber: 'PP-2026-0412', notifiedAt } })
    expect((await page(s, v.id)).summary.policeNotice.status).toBe('met')
    expect((await vehicleRow(t_.db, v.id)).version).toBe(2)
  })

  it('recordPoliceNotice_toldAfterTheHour_isRecordedAsLate', async () => {
    const { staff, v, calledAt } = await towed('private_property', 'california-sample', 120)
    const s = await signedIn(t_.app, staff.dispatcher)
    const notifiedAt = new Date(calledAt.getTime() + 90 * MIN).toISOString()
    const res = await s.post(noticeOf(v.id), { agency: 'Riverton PD', notifiedAt }).expect(201)
    expect(res.body.clock.status).toBe('late')
  })

  const refusals = [
    { what: 'a blank agency', body: (at: string) => ({ agency: '   ', notifiedAt: at }), path: 'agency' },
    { what: 'no time', body: () => ({ agency: 'Riverton PD' }), path: 'notifiedAt' },
    { what: 'a time in the future', body: () => ({ agency: 'Riverton PD', notifiedAt: new Date(Date.now() + 60 * MIN).toISOString() }), path: 'notifiedAt' },
    { what: 'a time before the tow', body: () => ({ agency: 'Riverton PD', notifiedAt: new Date(Date.now() - 5 * 60 * MIN).toISOString() }), path: 'notifiedAt' },
    { what: 'a time without its offset', body: () => ({ agency: 'Riverton PD', notifiedAt: '2026-12-02T10:00:00' }), path: 'notifiedAt' },
  ]
  it.each(refusals)('recordPoliceNotice_badInput_isRefusedNamingTheFieldAndWritesNothing ($what)', async ({ body, path }) => {
    const { staff, v } = await towed()
    const s = await signedIn(t_.app, staff.dispatcher)
    const res = await s.post(noticeOf(v.id), body(new Date(Date.now() - 5 * MIN).toISOString()))
    expect(res.status).toBe(400)
    expect(res.body.issues.map((i: { path: string }) => i.path)).toContain(path)
    expect(await historyCount(t_.db, v.id)).toBe(0)
    expect(await t_.db.select().from(t.policeNotices).where(eq(t.policeNotices.vehicleId, v.id))).toEqual([])
  })

  it('recordPoliceNotice_twice_isAConflictAndKeepsTheFirst', async () => {
    const { staff, v } = await towed()
    const s = await signedIn(t_.app, staff.dispatcher)
    const first = new Date(Date.now() - 5 * MIN).toISOString()
    await s.post(noticeOf(v.id), { agency: 'Riverton PD', notifiedAt: first }).expect(201)
    expect((await s.post(noticeOf(v.id), { agency: 'Other PD', notifiedAt: new Date().toISOString() })).status).toBe(409)
    expect(await historyCount(t_.db, v.id)).toBe(1)
  })

  it('recordPoliceNotice_towTheRuleSetAsksNothingOf_isRefused', async () => {
    const { staff, v } = await towed('breakdown')
    const s = await signedIn(t_.app, staff.dispatcher)
    expect((await s.post(noticeOf(v.id), { agency: 'Riverton PD', notifiedAt: new Date().toISOString() })).status).toBe(422)
    expect(await historyCount(t_.db, v.id)).toBe(0)
  })

  it.each(['technician', 'office'] as const)('recordPoliceNotice_%s_isForbiddenAndWritesNothing', async (role) => {
    const { staff, v } = await towed()
    const s = await signedIn(t_.app, staff[role])
    expect((await s.post(noticeOf(v.id), { agency: 'Riverton PD', notifiedAt: new Date().toISOString() })).status).toBe(403)
    expect(await historyCount(t_.db, v.id)).toBe(0)
  })

  it('recordPoliceNotice_anotherCompanysVehicle_isNotFound', async () => {
    const { v } = await towed()
    const other = await makeStaff(t_.db)
    const s = await signedIn(t_.app, other.dispatcher)
    expect((await s.post(noticeOf(v.id), { agency: 'Riverton PD', notifiedAt: new Date().toISOString() })).status).toBe(404)
    expect(await historyCount(t_.db, v.id)).toBe(0)
  })
})

/** The California sample as the yard's current rule set, as a new yard's manager would choose it. */
async function californiaYard(db: Database, yardId: string) {
  const [version] = await db.select().from(t.ruleSetVersions).where(eq(t.ruleSetVersions.id, await sampleVersion(db, 'california-sample')))
  await db.update(t.yards).set({ ruleSetId: version!.ruleSetId }).where(eq(t.yards.id, yardId))
}

describe('the police clock at the tow-in', () => {
  it('towIn_privatePropertyTow_answersThePoliceClockAtOnceAndTheFormIsOfferedTheRule', async () => {
    const staff = await makeStaff(t_.db)
    await californiaYard(t_.db, staff.yard.id)
    const d = await signedIn(t_.app, staff.dispatcher)
    expect((await d.get('/api/vehicles/intake-options').expect(200)).body.policeNotice).toMatchObject({ hours: 1, towReasons: ['private_property'] })
    const calledAt = new Date(Date.now() - 20 * MIN).toISOString()
    const res = await d.post(
      '/api/vehicles',
      towInBody(staff.dispatcher.id, (b) => Object.assign(b.tow, { reason: 'private_property', requesterName: 'Lot manager', calledAt, hookedAt: null, arrivedAt: new Date().toISOString() })),
    )
    expect(res.status).toBe(201)
    expect(res.body.policeNotice).toMatchObject({ status: 'open', start: 'called', dueAt: new Date(Date.parse(calledAt) + 60 * MIN).toISOString() })
  })

  it('towIn_breakdown_answersNoPoliceClock', async () => {
    const staff = await makeStaff(t_.db)
    await californiaYard(t_.db, staff.yard.id)
    const d = await signedIn(t_.app, staff.dispatcher)
    const res = await d.post('/api/vehicles', towInBody(staff.dispatcher.id)).expect(201)
    expect(res.body.policeNotice).toBeNull()
  })
})
