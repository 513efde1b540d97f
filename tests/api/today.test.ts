import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { todaySchema, type TodayItem } from '@shared/schemas/today'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { billedVehicle } from '../helpers/billing'
import { DAY, setHold } from '../helpers/board'
import { makeStaff, makeVehicle } from '../helpers/factories'

// Issue 12, "Today": one route, what it lists follows the role.

let app: TestApp
beforeAll(async () => {
  app = await makeTestApp()
})
afterAll(() => app.close())

async function yard() {
  const staff = await makeStaff(app.db)
  const y = staff.yard.id
  const v = {
    teardown: await makeVehicle(app.db, y, { state: 'teardown' }),
    decision: await makeVehicle(app.db, y, { state: 'decision' }),
    release: await makeVehicle(app.db, y, { state: 'release' }),
    held: await makeVehicle(app.db, y, { state: 'storage' }),
    heldLong: await makeVehicle(app.db, y, { state: 'storage' }),
    // California sample: owner records are to be requested within 15 days of the lien arising (Cal. Civ. Code § 3072).
    records: await billedVehicle(app.db, y, { days: 11, state: 'storage' }),
  }
  await setHold(app.db, v.held.id, 'law_enforcement', { until: new Date(Date.now() + 2 * DAY) })
  await setHold(app.db, v.heldLong.id, 'dispute', { until: new Date(Date.now() + 30 * DAY) })
  return { staff, v }
}

const todayFor = async (user: { email: string; password: string }) => todaySchema.parse((await (await signedIn(app.app, user)).get('/api/today').expect(200)).body)
const kindsOf = (items: TodayItem[], vehicleId: string) => items.filter((i) => i.vehicleId === vehicleId).map((i) => i.kind)

describe('today', () => {
  it('today_office_listsDecisionsReleasesHoldsEndingAndRecordsRequests_notTheTechniciansWork', async () => {
    const { staff, v } = await yard()
    const t = await todayFor(staff.office)
    expect(t.role).toBe('office')
    expect(kindsOf(t.items, v.decision.id)).toContain('decision')
    expect(kindsOf(t.items, v.release.id)).toContain('release')
    expect(t.items.find((i) => i.vehicleId === v.held.id && i.kind === 'hold-ending')).toMatchObject({ when: 'week', detail: 'law_enforcement' })
    expect(kindsOf(t.items, v.heldLong.id)).not.toContain('hold-ending')
    expect(t.items.find((i) => i.vehicleId === v.records.id && i.kind === 'records-request')).toMatchObject({ when: 'week' })
    expect(t.items.some((i) => i.kind === 'inspection' || i.kind === 'no-space' || i.kind === 'no-photos')).toBe(false)
    // Overdue first, then today, this week, then work with no day of its own.
    const order = t.items.map((i) => ['overdue', 'today', 'week', 'now'].indexOf(i.when))
    expect(order).toEqual([...order].sort((a, b) => a - b))
  })

  it('today_technician_listsOnlyWhatWaitsInTeardown', async () => {
    const { staff, v } = await yard()
    const t = await todayFor(staff.technician)
    expect(t.items.map((i) => [i.kind, i.vehicleId])).toEqual([['inspection', v.teardown.id]])
  })

  it('today_dispatcher_listsWhatArrivedWithoutASpaceOrPhotos', async () => {
    const { staff, v } = await yard()
    const t = await todayFor(staff.dispatcher)
    expect(kindsOf(t.items, v.teardown.id).sort()).toEqual(['no-photos', 'no-space'])
    expect(t.items.some((i) => ['decision', 'release', 'notice', 'records-request'].includes(i.kind))).toBe(false)
  })

  it('today_signedOut_is401_andAnotherCompanysVehiclesNeverShow', async () => {
    const mine = await yard()
    const theirs = await yard()
    const t = await todayFor(mine.staff.manager)
    const theirIds = new Set(Object.values(theirs.v).map((x) => x.id))
    expect(t.items.length).toBeGreaterThan(0)
    expect(t.items.some((i) => theirIds.has(i.vehicleId))).toBe(false)
    const { default: request } = await import('supertest')
    await request(app.app).get('/api/today').expect(401)
  })
})
