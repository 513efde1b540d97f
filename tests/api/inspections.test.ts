import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { historyOf, verifyChain } from '@db/history'
import * as t from '@db/schema'
import { makeTestApp, signedIn, type TestApp, TEST_HISTORY_KEY } from '../helpers/app'
import { makeStaff } from '../helpers/factories'
import { acknowledged, historyKinds, inspectionCounts, line, put, teardownFixture } from '../helpers/inspection'
import { photo } from '../helpers/tow-in'

let app: TestApp
beforeAll(async () => {
  app = await makeTestApp()
})
afterAll(() => app.close())

const vehicleRow = async (id: string) => (await app.db.select().from(t.vehicles).where(eq(t.vehicles.id, id)))[0]!

describe('inspection lifecycle', () => {
  it('start_onAnArrivalCard_isRefusedUntilTheBoardsMoveApiPutsItInTeardown', async () => {
    const f = await teardownFixture(app, { state: 'arrival' })
    const before = await inspectionCounts(app.db, f.vehicle.id)
    const refused = await f.tech.post(f.base)
    expect(refused.status).toBe(409)
    expect(refused.body.error).toContain('Move')
    expect(await inspectionCounts(app.db, f.vehicle.id)).toEqual(before)

    await f.tech.post(`/api/vehicles/${f.vehicle.id}/moves`, { to: 'teardown', version: f.vehicle.version }).expect(200)
    const started = await f.tech.post(f.base).expect(201)
    expect(started.body.inspection.started.by).toBe(f.staff.technician.name)
    expect(await historyKinds(app.db, f.vehicle.id)).toEqual(['moved', 'inspection_started'])
  })

  it('inspectionPage_holdsInForce_areShownAndALiftedOneIsNot', async () => {
    // Issue 16 item 16: an evidence hold usually means "do not touch"; the teardown screen must show it.
    const f = await teardownFixture(app)
    await f.dispatcher.post(`/api/vehicles/${f.vehicle.id}/holds`, { kind: 'law_enforcement', agency: 'Orrin Flats Police Department', caseNumber: 'OF-26-20417' }).expect(201)
    const lien = (await f.dispatcher.post(`/api/vehicles/${f.vehicle.id}/holds`, { kind: 'lien', note: 'Mechanic lien claimed' }).expect(201)).body.holds
    const lienId = lien.find((h: { kind: string }) => h.kind === 'lien').id
    await f.dispatcher.post(`/api/vehicles/${f.vehicle.id}/holds/${lienId}/lift`, { reason: 'Paid off' }).expect(200)
    const page = (await f.tech.get(f.base).expect(200)).body
    expect(page.holds).toHaveLength(1)
    expect(page.holds[0]).toMatchObject({ kind: 'law_enforcement', agency: 'Orrin Flats Police Department', caseNumber: 'OF-26-20417', liftedAt: null })
  })

  it('start_twice_answersTheInspectionUnderWayAndWritesNothingMore', async () => {
    const f = await teardownFixture(app)
    const first = await f.tech.post(f.base).expect(201)
    const again = await f.manager.post(f.base).expect(200)
    expect(again.body.inspection.id).toBe(first.body.inspection.id)
    expect(await historyKinds(app.db, f.vehicle.id)).toEqual(['inspection_started'])
  })

  it('aWholeTeardown_findingsPhotoLinesPickupFinish_recordsEachStepAndLetsTheCardMoveOn', async () => {
    const f = await teardownFixture(app)
    await acknowledged(f)
    await put(f.tech, `${f.base}/items/ball-joints`, { status: 'broken', note: 'Lower joint separated, left front' }).expect(200)
    await put(f.tech, `${f.base}/items/drive-shafts`, { status: 'broken', note: null }).expect(200)
    await put(f.tech, `${f.base}/items/tyres`, { status: 'ok' }).expect(200)
    const withPhoto = await f.tech.agent
      .post(`${f.base}/items/ball-joints/photos`)
      .set('x-csrf-token', f.tech.csrf)
      .attach('files', await photo(), { filename: 'joint.jpg', contentType: 'image/jpeg' })
      .expect(201)
    const joint = withPhoto.body.inspection.items.find((i: { code: string }) => i.code === 'ball-joints')
    expect(joint).toMatchObject({ status: 'broken', photos: [{ kind: 'photo', label: 'Ball joints (Suspension and steering)' }] })
    await f.tech.post(`${f.base}/lines`, line({ itemCode: 'ball-joints' })).expect(201)
    await f.tech.post(`${f.base}/lines`, line({ itemCode: 'drive-shafts', part: 'Drive shaft', unitPriceCents: 21_450, labourHours: 2 })).expect(201)

    // Before the finish, the board's guard still refuses Owner decision.
    const early = await f.tech.post(`/api/vehicles/${f.vehicle.id}/moves`, { to: 'decision', version: (await vehicleRow(f.vehicle.id)).version })
    expect(early.status).toBe(422)
    expect(early.body.reasons[0].code).toBe('inspection')

    const marked = await f.tech.patch(`${f.base}/roll-ability`, { rolls: false, steers: true, brakes: true, keys: true }).expect(200)
    expect(marked.body.pickup.label).toBe('Flatbed or dollies')
    const finished = await f.tech.post(`${f.base}/finish`).expect(200)
    expect(finished.body.inspection.finished.by).toBe(f.staff.technician.name)

    const v = await vehicleRow(f.vehicle.id)
    expect(v.inspectedById).toBe(f.staff.technician.id)
    expect(v.inspectedAt?.toISOString()).toBe(finished.body.inspection.finished.at)
    expect([v.rolls, v.steers, v.brakes, v.keys]).toEqual([false, true, true, 'yes'])
    expect(await historyKinds(app.db, f.vehicle.id)).toEqual([
      'inspection_started',
      'safety_acknowledged',
      'inspection_item_marked',
      'inspection_item_marked',
      'inspection_item_marked',
      'file_added',
      'estimate_line_added',
      'estimate_line_added',
      'roll_ability_marked',
      'inspection_finished',
    ])
    const events = await historyOf(app.db, f.vehicle.id)
    expect(verifyChain(TEST_HISTORY_KEY, events).ok).toBe(true)
    expect(events.at(-1)!.after).toMatchObject({ broken: ['ball-joints', 'drive-shafts'], pickupNeeds: 'Flatbed or dollies' })
    expect(events.find((e) => e.kind === 'roll_ability_marked')!.before).toEqual({ rolls: null, steers: null, brakes: null })

    await f.tech.post(`/api/vehicles/${f.vehicle.id}/moves`, { to: 'decision', version: v.version }).expect(200)
  })

  it('aFinishedInspection_refusesNewFindingsAndLines_butTakesValuesLater', async () => {
    const f = await teardownFixture(app)
    await acknowledged(f)
    await put(f.tech, `${f.base}/items/wheels`, { status: 'worn' }).expect(200)
    await f.tech.patch(`${f.base}/roll-ability`, { rolls: true, steers: true, brakes: true }).expect(200)
    await f.tech.post(`${f.base}/finish`).expect(200)
    const before = await inspectionCounts(app.db, f.vehicle.id)
    const lineRefused = await f.tech.post(`${f.base}/lines`, line())
    expect(lineRefused.status).toBe(409)
    expect(lineRefused.body.error).toContain('re-inspection')
    expect((await put(f.tech, `${f.base}/items/wheels`, { status: 'broken' })).status).toBe(409)
    expect(await inspectionCounts(app.db, f.vehicle.id)).toEqual(before)
    // The office has the figures from the insurer a day later.
    const values = { actualCashValueCents: 310_000, actualCashValueSource: 'Insurer’s valuation', salvageValueCents: 45_000, salvageValueSource: 'Yard buyer’s offer' }
    const res = await put(f.office, `${f.base}/values`, values).expect(200)
    expect(res.body.inspection.values).toMatchObject({ ...values, entered: { by: f.staff.office.name } })
  })

  it('aReinspection_startsAfreshAndClearsTheInspectedMarkUntilItIsFinished', async () => {
    const f = await teardownFixture(app)
    await acknowledged(f)
    await put(f.tech, `${f.base}/items/engine`, { status: 'ok' }).expect(200)
    await f.tech.patch(`${f.base}/roll-ability`, { rolls: true, steers: true, brakes: true }).expect(200)
    const first = await f.tech.post(`${f.base}/finish`).expect(200)
    await f.tech.post(`/api/vehicles/${f.vehicle.id}/moves`, { to: 'decision', version: (await vehicleRow(f.vehicle.id)).version }).expect(200)
    await f.tech.post(`/api/vehicles/${f.vehicle.id}/moves`, { to: 'teardown', version: (await vehicleRow(f.vehicle.id)).version, reason: 'Owner reports a noise we missed' }).expect(200)

    const second = await f.tech.post(f.base).expect(201)
    expect(second.body.inspection.id).not.toBe(first.body.inspection.id)
    expect(second.body.inspection).toMatchObject({ items: [], lines: [], safetyAcknowledged: null, finished: null })
    expect((await vehicleRow(f.vehicle.id)).inspectedAt).toBeNull()
    const started = (await historyOf(app.db, f.vehicle.id)).at(-1)!
    expect(started.after).toMatchObject({ reinspection: true })
    expect(started.before).toMatchObject({ previousInspectionId: first.body.inspection.id })
  })

  it('safety_acknowledgedTwice_isOneHistoryEntryNamingTheCautions', async () => {
    const f = await teardownFixture(app)
    await acknowledged(f)
    await f.tech.post(`${f.base}/safety`).expect(200)
    const events = (await historyOf(app.db, f.vehicle.id)).filter((e) => e.kind === 'safety_acknowledged')
    expect(events).toHaveLength(1)
    expect(JSON.stringify(events[0]!.after)).toContain('Never get under a vehicle that is held up only by a jack.')
  })

  it('values_alsoSetTheVehiclesEstimatedValue_withBeforeAndAfterInTheHistory', async () => {
    const f = await teardownFixture(app, { estimatedValueCents: 250_000 })
    await f.tech.post(f.base).expect(201)
    const body = { actualCashValueCents: 180_000, actualCashValueSource: 'Price guide, fair condition', salvageValueCents: 40_000, salvageValueSource: 'Scrap weight at today’s price' }
    await put(f.tech, `${f.base}/values`, body).expect(200)
    expect((await vehicleRow(f.vehicle.id)).estimatedValueCents).toBe(180_000)
    const entry = (await historyOf(app.db, f.vehicle.id)).at(-1)!
    expect(entry.kind).toBe('vehicle_values_entered')
    expect(entry.before).toMatchObject({ estimatedValueCents: 250_000, actualCashValueCents: null })
    expect(entry.after).toMatchObject({ estimatedValueCents: 180_000, actualCashValueSource: 'Price guide, fair condition' })
  })
})

describe('who may inspect', () => {
  it.each(['dispatcher', 'office'] as const)('aFinding_by%s_isRefused403AndWritesNothing', async (role) => {
    const f = await teardownFixture(app)
    await f.tech.post(f.base).expect(201)
    const before = await inspectionCounts(app.db, f.vehicle.id)
    const s = f[role]
    expect((await put(s, `${f.base}/items/tyres`, { status: 'broken' })).status).toBe(403)
    expect((await s.post(`${f.base}/lines`, line())).status).toBe(403)
    expect((await s.post(`${f.base}/finish`)).status).toBe(403)
    expect(await inspectionCounts(app.db, f.vehicle.id)).toEqual(before)
    expect((await s.get(f.base)).status).toBe(200)
  })

  it('values_byADispatcher_areRefused403', async () => {
    const f = await teardownFixture(app)
    await f.tech.post(f.base).expect(201)
    const res = await put(f.dispatcher, `${f.base}/values`, { actualCashValueCents: 1, actualCashValueSource: 'x', salvageValueCents: 0, salvageValueSource: 'x' })
    expect(res.status).toBe(403)
  })

  it('anotherCompanysTechnician_seesNoSuchVehicle', async () => {
    const f = await teardownFixture(app)
    const other = await makeStaff(app.db)
    const s = await signedIn(app.app, other.technician)
    expect((await s.get(f.base)).status).toBe(404)
    expect((await s.post(f.base)).status).toBe(404)
    expect(await inspectionCounts(app.db, f.vehicle.id)).toMatchObject({ inspections: 0, history: 0 })
  })
})
