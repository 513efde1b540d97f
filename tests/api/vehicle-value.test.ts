import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { historyOf } from '@db/history'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { DAY, historyCount, sampleVersion, vehicleRow } from '../helpers/board'
import { makeStaff, makeVehicle } from '../helpers/factories'

let t_: TestApp
beforeAll(async () => {
  t_ = await makeTestApp()
})
afterAll(() => t_.close())

const valueOf = (id: string) => `/api/vehicles/${id}/value`

/** A California vehicle stored 3 days ago with no value on record. */
async function unvalued() {
  const staff = await makeStaff(t_.db)
  const ruleSetVersionId = await sampleVersion(t_.db, 'california-sample')
  const v = await makeVehicle(t_.db, staff.yard.id, { state: 'storage', ruleSetVersionId, arrivedAt: new Date(Date.now() - 3 * DAY) })
  return { staff, v }
}

describe('PUT /api/vehicles/:vehicleId/value', () => {
  it.each(['office', 'manager'] as const)('recordValue_%s_storesTheValueAndSourceWithItsHistoryEvent', async (role) => {
    const { staff, v } = await unvalued()
    const s = await signedIn(t_.app, staff[role])
    const res = await s.put(valueOf(v.id), { version: 1, valueCents: 42_000, source: 'Price guide' })
    expect(res.status).toBe(200)
    expect(res.body).toEqual({ version: 2, valueCents: 42_000, source: 'Price guide' })
    expect(await vehicleRow(t_.db, v.id)).toMatchObject({ estimatedValueCents: 42_000, estimatedValueSource: 'Price guide', version: 2 })
    const [event] = await historyOf(t_.db, v.id)
    expect(event).toMatchObject({
      kind: 'vehicle_value_recorded',
      actorId: staff[role].id,
      before: { estimatedValueCents: null, estimatedValueSource: null },
      after: { estimatedValueCents: 42_000, estimatedValueSource: 'Price guide' },
    })
  })

  // Cal. Civ. Code § 3072 and Veh. Code § 22851.8: the records request runs whatever the value; the
  // value-dependent branches wait for it, shown as "needs-value" until it is recorded.
  it('recordValue_needsTheValueOnThePageBeforeAndTheLowValueBranchAfter', async () => {
    const { staff, v } = await unvalued()
    const s = await signedIn(t_.app, staff.office)
    const before = (await s.get(`/api/vehicles/${v.id}`).expect(200)).body
    expect(before.summary.clockAlerts.map((a: { code: string }) => a.code)).toEqual(['needs-value'])
    expect(before.summary.nextDeadline.code).toBe('records-request')
    expect(before.summary.lienSale.code).toBe('needs-value')
    await s.put(valueOf(v.id), { version: 1, valueCents: 30_000, source: 'Appraisal' }).expect(200)
    const after = (await s.get(`/api/vehicles/${v.id}`).expect(200)).body
    expect(after.vehicle).toMatchObject({ estimatedValueCents: 30_000, estimatedValueSource: 'Appraisal' })
    expect(after.summary.clockAlerts).toEqual([])
    expect(after.summary.lienSale).toMatchObject({ open: false, code: 'waiting' })
    expect(after.summary.lienSale.why).toMatch(/notice of intent to dispose/)
  })

  it.each(['dispatcher', 'technician'] as const)('recordValue_%s_isForbiddenAndWritesNothing', async (role) => {
    const { staff, v } = await unvalued()
    const s = await signedIn(t_.app, staff[role])
    expect((await s.put(valueOf(v.id), { version: 1, valueCents: 42_000, source: 'Price guide' })).status).toBe(403)
    expect(await vehicleRow(t_.db, v.id)).toMatchObject({ estimatedValueCents: null, version: 1 })
  })

  it.each([
    { body: { version: 1, valueCents: -1, source: 'Price guide' }, path: 'valueCents' },
    { body: { version: 1, valueCents: 12.5, source: 'Price guide' }, path: 'valueCents' },
    { body: { version: 1, valueCents: '4000', source: 'Price guide' }, path: 'valueCents' },
    { body: { version: 1, valueCents: 1_000_000_001, source: 'Price guide' }, path: 'valueCents' },
    { body: { version: 1, valueCents: 42_000, source: '   ' }, path: 'source' },
    { body: { version: 1, valueCents: 42_000 }, path: 'source' },
    { body: { version: 1, valueCents: 42_000, source: 'x'.repeat(201) }, path: 'source' },
    { body: { valueCents: 42_000, source: 'Price guide' }, path: 'version' },
  ])('recordValue_badInput_answers400NamingThe$pathFieldAndWritesNothing', async ({ body, path }) => {
    const { staff, v } = await unvalued()
    const s = await signedIn(t_.app, staff.office)
    const res = await s.put(valueOf(v.id), body)
    expect(res.status).toBe(400)
    expect(res.body.issues.map((i: { path: string }) => i.path)).toEqual([path])
    expect(await vehicleRow(t_.db, v.id)).toMatchObject({ estimatedValueCents: null, estimatedValueSource: null, version: 1 })
    expect(await historyCount(t_.db, v.id)).toBe(0)
  })

  it('recordValue_staleVersion_answers409AndWritesNothing', async () => {
    const { staff, v } = await unvalued()
    const s = await signedIn(t_.app, staff.office)
    await s.put(valueOf(v.id), { version: 1, valueCents: 42_000, source: 'Price guide' }).expect(200)
    const res = await s.put(valueOf(v.id), { version: 1, valueCents: 99_000, source: 'Appraisal' })
    expect(res.status).toBe(409)
    expect(res.body.version).toBe(2)
    expect(await vehicleRow(t_.db, v.id)).toMatchObject({ estimatedValueCents: 42_000, version: 2 })
    expect(await historyCount(t_.db, v.id)).toBe(1)
  })

  it('recordValue_anotherCompanysVehicle_isNotFound', async () => {
    const { v } = await unvalued()
    const other = await makeStaff(t_.db)
    const s = await signedIn(t_.app, other.office)
    expect((await s.put(valueOf(v.id), { version: 1, valueCents: 42_000, source: 'Price guide' })).status).toBe(404)
    expect(await vehicleRow(t_.db, v.id)).toMatchObject({ estimatedValueCents: null, version: 1 })
  })

  it('recordValue_sameValueAndSource_changesNothing', async () => {
    const { staff, v } = await unvalued()
    const s = await signedIn(t_.app, staff.office)
    await s.put(valueOf(v.id), { version: 1, valueCents: 42_000, source: 'Price guide' }).expect(200)
    expect((await s.put(valueOf(v.id), { version: 2, valueCents: 42_000, source: 'Price guide' })).status).toBe(422)
    expect(await historyCount(t_.db, v.id)).toBe(1)
  })
})
