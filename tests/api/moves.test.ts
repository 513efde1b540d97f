import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { historyOf } from '@db/history'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { DAY, historyCount, sampleVersion, setHold, vehicleRow } from '../helpers/board'
import { makeStaff, makeVehicle } from '../helpers/factories'
import { signaturePng } from '../helpers/release'

let t_: TestApp
beforeAll(async () => {
  t_ = await makeTestApp()
})
afterAll(() => t_.close())

const move = (id: string) => `/api/vehicles/${id}/moves`

describe('POST /api/vehicles/:vehicleId/moves', () => {
  it('move_dispatcherArrivalToTeardown_movesItBumpsTheVersionAndRecordsWhoAndWhen', async () => {
    const staff = await makeStaff(t_.db)
    const v = await makeVehicle(t_.db, staff.yard.id)
    const s = await signedIn(t_.app, staff.dispatcher)
    const res = await s.post(move(v.id), { to: 'teardown', version: 1 })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ id: v.id, state: 'teardown', version: 2 })
    expect(await vehicleRow(t_.db, v.id)).toMatchObject({ state: 'teardown', version: 2 })
    const [event] = await historyOf(t_.db, v.id)
    expect(event).toMatchObject({ kind: 'moved', fromState: 'arrival', toState: 'teardown', actorId: staff.dispatcher.id, actorLabel: staff.dispatcher.name })
    const board = await s.get('/api/board')
    expect(board.body.columns.find((c: { column: string }) => c.column === 'teardown').cards.map((c: { id: string }) => c.id)).toEqual([v.id])
  })

  it('move_blockedByAPoliceHold_answers422WithTheReasonAndWritesNothing', async () => {
    const staff = await makeStaff(t_.db)
    const v = await makeVehicle(t_.db, staff.yard.id, { state: 'storage' })
    await setHold(t_.db, v.id, 'law_enforcement', { agency: 'Orrin Flats PD', caseNumber: 'OF-26-11602' })
    const before = await vehicleRow(t_.db, v.id)
    const s = await signedIn(t_.app, staff.office)
    const res = await s.post(move(v.id), { to: 'release', version: 1 })
    expect(res.status).toBe(422)
    expect(res.body.reasons).toEqual([{ code: 'hold', message: 'Law-enforcement hold (Orrin Flats PD, case OF-26-11602) — it cannot go to Release.', key: 'hold', params: { hold: 'law_enforcement', who: ' (Orrin Flats PD, OF-26-11602)', column: 'release' } }])
    expect(res.body.error).toBe(res.body.reasons[0].message)
    expect(await vehicleRow(t_.db, v.id)).toEqual(before)
    expect(await historyCount(t_.db, v.id)).toBe(0)
  })

  // Issue 16: an evidence hold usually means "do not touch". A move into Teardown under a law-enforcement
  // hold is refused until the sender says it was asked (a technician's phone or an API client, not only the board).
  it('move_intoTeardownUnderALawEnforcementHold_answers409NamingTheHoldUntilConfirmed', async () => {
    const staff = await makeStaff(t_.db)
    const v = await makeVehicle(t_.db, staff.yard.id)
    await setHold(t_.db, v.id, 'law_enforcement', { agency: 'Orrin Flats PD', caseNumber: 'OF-26-20533' })
    const before = await vehicleRow(t_.db, v.id)
    const s = await signedIn(t_.app, staff.technician)
    for (const unasked of [{}, { confirmHold: false }]) {
      const res = await s.post(move(v.id), { to: 'teardown', version: 1, ...unasked })
      expect(res.status).toBe(409)
      expect(res.body).toMatchObject({
        code: 'teardownUnderHold',
        params: { stock: v.stockNumber, agency: 'Orrin Flats PD', caseNumber: 'OF-26-20533' },
        hold: { kind: 'law_enforcement', agency: 'Orrin Flats PD', caseNumber: 'OF-26-20533' },
      })
      expect(res.body.error).toContain('Orrin Flats PD, case OF-26-20533')
      expect(await vehicleRow(t_.db, v.id)).toEqual(before)
      expect(await historyCount(t_.db, v.id)).toBe(0)
    }
    const res = await s.post(move(v.id), { to: 'teardown', version: 1, confirmHold: true })
    expect(res.status).toBe(200)
    expect(await vehicleRow(t_.db, v.id)).toMatchObject({ state: 'teardown', version: 2 })
    expect(await historyCount(t_.db, v.id)).toBe(1)
  })

  it('move_intoTeardownUnderALienHold_needsNoConfirmation', async () => {
    const staff = await makeStaff(t_.db)
    const v = await makeVehicle(t_.db, staff.yard.id)
    await setHold(t_.db, v.id, 'lien')
    const s = await signedIn(t_.app, staff.technician)
    expect((await s.post(move(v.id), { to: 'teardown', version: 1 })).status).toBe(200)
  })

  it('move_roleTheLifecycleRefuses_answers403WithTheReasonAndWritesNothing', async () => {
    const staff = await makeStaff(t_.db)
    const v = await makeVehicle(t_.db, staff.yard.id, { state: 'storage' })
    const s = await signedIn(t_.app, staff.technician)
    const res = await s.post(move(v.id), { to: 'release', version: 1 })
    expect(res.status).toBe(403)
    expect(res.body.reasons).toMatchObject([{ code: 'role', message: 'Only managers and office staff can move a vehicle from Storage to Release.' }])
    expect(await vehicleRow(t_.db, v.id)).toMatchObject({ state: 'storage', version: 1 })
    expect(await historyCount(t_.db, v.id)).toBe(0)
  })

  it('move_inspectionNotFinished_keepsItInTeardown', async () => {
    const staff = await makeStaff(t_.db)
    const v = await makeVehicle(t_.db, staff.yard.id, { state: 'teardown' })
    const s = await signedIn(t_.app, staff.technician)
    const refused = await s.post(move(v.id), { to: 'decision', version: 1 })
    expect(refused.status).toBe(422)
    expect(refused.body.reasons.map((r: { code: string }) => r.code)).toEqual(['inspection'])
    await t_.db.update(t.vehicles).set({ inspectedAt: new Date(), inspectedById: staff.technician.id }).where(eq(t.vehicles.id, v.id))
    expect((await s.post(move(v.id), { to: 'decision', version: 1 })).status).toBe(200)
  })

  it('move_staleVersion_answers409WithWhereTheCardIsNowAndWritesNothing', async () => {
    const staff = await makeStaff(t_.db)
    const v = await makeVehicle(t_.db, staff.yard.id)
    const s = await signedIn(t_.app, staff.dispatcher)
    expect((await s.post(move(v.id), { to: 'teardown', version: 1 })).status).toBe(200)
    const stale = await s.post(move(v.id), { to: 'teardown', version: 1 })
    expect(stale.status).toBe(409)
    expect(stale.body.error).toContain('Someone else changed')
    expect(stale.body.current).toMatchObject({ id: v.id, state: 'teardown', version: 2 })
    expect(await historyCount(t_.db, v.id)).toBe(1)
  })

  it('move_twoPeopleAtOnceFromOneVersion_exactlyOneWinsTheOtherGets409', async () => {
    const staff = await makeStaff(t_.db)
    const v = await makeVehicle(t_.db, staff.yard.id)
    const [a, b] = await Promise.all([signedIn(t_.app, staff.dispatcher), signedIn(t_.app, staff.technician)])
    const answers = await Promise.all([a.post(move(v.id), { to: 'teardown', version: 1 }), b.post(move(v.id), { to: 'teardown', version: 1 })])
    expect(answers.map((r) => r.status).sort()).toEqual([200, 409].sort())
    expect(await historyCount(t_.db, v.id)).toBe(1)
    expect((await vehicleRow(t_.db, v.id)).version).toBe(2)
  })

  it('move_backWithoutAReason_isRefusedAndWithOneKeepsItInTheHistory', async () => {
    const staff = await makeStaff(t_.db)
    const v = await makeVehicle(t_.db, staff.yard.id, { state: 'storage' })
    const s = await signedIn(t_.app, staff.office)
    const refused = await s.post(move(v.id), { to: 'decision', version: 1, reason: '  ' })
    expect(refused.status).toBe(422)
    expect(refused.body.reasons).toMatchObject([{ code: 'reason', message: 'Say why it goes back to Owner decision.' }])
    expect(await historyCount(t_.db, v.id)).toBe(0)
    const ok = await s.post(move(v.id), { to: 'decision', version: 1, reason: 'Owner called: wants the repair estimate after all' })
    expect(ok.status).toBe(200)
    expect((await historyOf(t_.db, v.id))[0]).toMatchObject({ fromState: 'storage', toState: 'decision', reason: 'Owner called: wants the repair estimate after all' })
  })

  it('move_handOverToOwner_isRefusedUntilPaymentIdAndSignatureAreRecorded', async () => {
    const staff = await makeStaff(t_.db)
    const ruleSetVersionId = await sampleVersion(t_.db, 'california-sample')
    const v = await makeVehicle(t_.db, staff.yard.id, { state: 'release', ruleSetVersionId, arrivedAt: new Date(Date.now() - 3 * DAY) })
    const s = await signedIn(t_.app, staff.office)
    const res = await s.post(move(v.id), { to: 'closed', version: 1, disposition: 'returned_to_owner' })
    expect(res.status).toBe(422)
    expect(res.body.reasons.map((r: { code: string }) => r.code)).toEqual(['balance', 'claimant-id', 'release-signed'])
    expect(res.body.reasons[0].message).toMatch(/^Balance unpaid: \$[\d,]+\.\d\d due\./)
    expect(await vehicleRow(t_.db, v.id)).toMatchObject({ state: 'release', disposition: null, closedAt: null })
  })

  it('move_lienSaleOnceTheLawAllows_closesItGivesTheSpaceBackAndLeavesTheBoard', async () => {
    const staff = await makeStaff(t_.db)
    const ruleSetVersionId = await sampleVersion(t_.db, 'florida-sample')
    const [space] = await t_.db.insert(t.yardSpaces).values({ yardId: staff.yard.id, row: 'Q', number: 7 }).returning()
    // Florida's sample: a sale no sooner than 35 days after storage for a vehicle over 3 years old.
    const v = await makeVehicle(t_.db, staff.yard.id, { state: 'storage', ruleSetVersionId, year: 2009, spaceId: space!.id, arrivedAt: new Date(Date.now() - 60 * DAY) })
    const s = await signedIn(t_.app, staff.manager)
    // The sale itself is recorded and its bill of sale signed first (server/transfers), two changes.
    const sale = { kind: 'lien_sale', sellerName: 'The yard, lienholder', buyerKind: 'other', buyerName: 'Rosalind Vey', buyerAddress: '22 Kestrel Lane', buyerIdType: 'drivers_license', buyerIdNumber: 'V5521098', priceCents: 90_000, odometer: null, odometerUnreadable: true, date: new Intl.DateTimeFormat('en-CA', { timeZone: 'America/Los_Angeles' }).format(new Date()) }
    expect((await s.put(`/api/vehicles/${v.id}/transfer`, sale)).status).toBe(200)
    expect((await s.post(`/api/vehicles/${v.id}/transfer/signature`, { signerName: 'Pat Lindqvist', image: await signaturePng() })).status).toBe(201)
    const res = await s.post(move(v.id), { to: 'closed', version: 3, disposition: 'lien_sale', reason: 'Sold at the yard auction, lot 14' })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ state: 'closed', disposition: 'lien_sale', space: null })
    const row = await vehicleRow(t_.db, v.id)
    expect(row).toMatchObject({ state: 'closed', disposition: 'lien_sale', spaceId: null })
    expect(row.closedAt).toBeInstanceOf(Date)
    expect((await historyOf(t_.db, v.id)).at(-1)).toMatchObject({ toState: 'closed', after: { disposition: 'lien_sale', spaceGivenBack: 'Q-7' } })
    const board = await s.get('/api/board')
    expect(JSON.stringify(board.body)).not.toContain(v.id)
    const archive = await s.get('/api/vehicles/closed')
    expect(archive.body.rows).toEqual([expect.objectContaining({ id: v.id, disposition: 'lien_sale' })])
  })

  it('move_lienSaleBeforeTheLawAllows_isRefusedWithTheDate', async () => {
    const staff = await makeStaff(t_.db)
    const ruleSetVersionId = await sampleVersion(t_.db, 'florida-sample')
    const v = await makeVehicle(t_.db, staff.yard.id, { state: 'storage', ruleSetVersionId, year: 2009, arrivedAt: new Date(Date.now() - 10 * DAY) })
    const s = await signedIn(t_.app, staff.office)
    const res = await s.post(move(v.id), { to: 'closed', version: 1, disposition: 'scrapped' })
    expect(res.status).toBe(422)
    expect(res.body.reasons).toMatchObject([{ code: 'lien-sale', message: expect.stringMatching(/^The law does not allow a lien sale or disposal before \d{1,2} \w{3}( \d{4})?\.$/) }])
  })

  // The gate reads every "not before" step of the vehicle's branch, and a missing value or model year is
  // said, never taken for "no clocks": Civ. Code §§ 3071–3072 and Veh. Code § 22851.10 pick the branch by
  // value; Fla. Stat. 713.78 by age [M].
  it.each([
    { why: 'a California vehicle without a value', sample: 'california-sample', over: { estimatedValueCents: null }, message: /Enter the value to see this deadline/ },
    { why: 'a California vehicle valued $400 with no notice of intent mailed', sample: 'california-sample', over: { estimatedValueCents: 40_000 }, message: /Earliest disposal to a dismantler.*Starts once the record shows the notice of intent to dispose was mailed/ },
    { why: 'a California vehicle valued $3,000 with no notice of pending lien sale', sample: 'california-sample', over: { estimatedValueCents: 300_000 }, message: /Starts once the record shows/ },
    { why: 'a Florida vehicle without a model year', sample: 'florida-sample', over: { year: null }, message: /Enter the model year to see this deadline/ },
  ])('move_closeAsScrapped_$why_isRefusedSayingWhy', async ({ sample, over, message }) => {
    const staff = await makeStaff(t_.db)
    const ruleSetVersionId = await sampleVersion(t_.db, sample)
    const v = await makeVehicle(t_.db, staff.yard.id, { state: 'storage', ruleSetVersionId, year: 2009, arrivedAt: new Date(Date.now() - 90 * DAY), ...over })
    const s = await signedIn(t_.app, staff.office)
    const res = await s.post(move(v.id), { to: 'closed', version: 1, disposition: 'scrapped' })
    expect(res.status).toBe(422)
    expect(res.body.reasons).toMatchObject([{ code: 'lien-sale', message: expect.stringMatching(message) }])
    expect(await vehicleRow(t_.db, v.id)).toMatchObject({ state: 'storage', version: 1 })
    expect(await historyCount(t_.db, v.id)).toBe(0)
  })

  it.each([
    { body: { to: 'nowhere', version: 1 }, path: 'to' },
    { body: { to: 'teardown' }, path: 'version' },
    { body: { to: 'teardown', version: 0 }, path: 'version' },
    { body: { to: 'closed', version: 1, disposition: 'sold' }, path: 'disposition' },
    { body: { to: 'decision', version: 1, reason: 'x'.repeat(501) }, path: 'reason' },
    { body: { to: 'teardown', version: 1, confirmHold: 'yes' }, path: 'confirmHold' },
  ])('move_badInput_answers400NamingThe$pathField', async ({ body, path }) => {
    const staff = await makeStaff(t_.db)
    const v = await makeVehicle(t_.db, staff.yard.id)
    const s = await signedIn(t_.app, staff.manager)
    const res = await s.post(move(v.id), body)
    expect(res.status).toBe(400)
    expect(res.body.issues.map((i: { path: string }) => i.path)).toContain(path)
    expect(await vehicleRow(t_.db, v.id)).toMatchObject({ state: 'arrival', version: 1 })
  })

  it('move_notAVehicleId_answers400', async () => {
    const staff = await makeStaff(t_.db)
    const s = await signedIn(t_.app, staff.manager)
    const res = await s.post(move('not-a-uuid'), { to: 'teardown', version: 1 })
    expect(res.status).toBe(400)
    expect(res.body.issues).toEqual([{ path: 'vehicleId', message: 'That is not a vehicle id.', code: 'common.thatNotVehicleId' }])
  })

  it('move_anotherCompanysVehicle_answers404AndLeavesItAlone', async () => {
    const ours = await makeStaff(t_.db)
    const theirs = await makeStaff(t_.db)
    const v = await makeVehicle(t_.db, theirs.yard.id)
    const s = await signedIn(t_.app, ours.manager)
    expect((await s.post(move(v.id), { to: 'teardown', version: 1 })).status).toBe(404)
    expect(await vehicleRow(t_.db, v.id)).toMatchObject({ state: 'arrival', version: 1 })
  })
})
