import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { historyOf } from '@db/history'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { DAY, sampleVersion, setHold, vehicleRow } from '../helpers/board'
import { makeStaff } from '../helpers/factories'
import { CLAIMANT, completeRelease, idPhoto, signaturePng, vehicleInRelease } from '../helpers/release'

let app: TestApp
let staff: Awaited<ReturnType<typeof makeStaff>>
beforeAll(async () => {
  app = await makeTestApp({ publicUrl: 'https://yard.test.example' })
})
afterAll(() => app.close())
beforeEach(async () => {
  staff = await makeStaff(app.db)
})

const base = (id: string) => `/api/vehicles/${id}/release`
const close = (id: string, version: number) => ({ to: 'closed', version, disposition: 'returned_to_owner' })
const releaseRow = async (vehicleId: string) => (await app.db.select().from(t.releases).where(eq(t.releases.vehicleId, vehicleId)))[0]
const kinds = async (vehicleId: string) => (await historyOf(app.db, vehicleId)).map((e) => e.kind)

describe('the release checklist, enforced through the lifecycle', () => {
  it('refuses to close the vehicle for each unmet guard with its reason, one fewer as each is met', async () => {
    // The California sample charges storage from arrival three days ago: a balance that is owed.
    const { vehicle, items } = await vehicleInRelease(app.db, staff.yard.id, { ruleSetVersionId: await sampleVersion(app.db, 'california-sample'), arrivedAt: new Date(Date.now() - 3 * DAY) })
    const hold = await setHold(app.db, vehicle.id, 'dispute', { note: 'Owner disputes the tow' })
    const s = await signedIn(app.app, staff.office)
    const codes = async () => {
      const v = await vehicleRow(app.db, vehicle.id)
      const res = await s.post(`/api/vehicles/${vehicle.id}/moves`, close(vehicle.id, v.version))
      expect(res.status).toBe(422)
      return (res.body.reasons as { code: string }[]).map((r) => r.code)
    }
    expect(await codes()).toEqual(['hold', 'balance', 'claimant-id', 'release-signed'])
    await app.db.update(t.holds).set({ liftedAt: new Date(), liftReason: 'settled' }).where(eq(t.holds.id, hold.id))
    expect(await codes()).toEqual(['balance', 'claimant-id', 'release-signed'])
    await completeRelease(s, vehicle.id, items.map((i) => i.id))
    // The balance is still owed: nothing else stands in the way, and the gate pass is refused for it too.
    expect(await codes()).toEqual(['balance'])
    const pass = await s.post(`${base(vehicle.id)}/gate-pass`)
    expect(pass.status).toBe(422)
    expect(pass.body.reasons).toMatchObject([{ code: 'balance', message: expect.stringMatching(/^Balance unpaid: \$[\d,.]+ due\./) }])
    expect(await app.db.select().from(t.gatePasses).where(eq(t.gatePasses.vehicleId, vehicle.id))).toEqual([])
  })

  it('records each step as a history event, makes the claimant-ID and signed facts true, and the board card says so', async () => {
    const { vehicle, items } = await vehicleInRelease(app.db, staff.yard.id)
    const s = await signedIn(app.app, staff.office)
    const page = await completeRelease(s, vehicle.id, items.map((i) => i.id))
    expect(page.steps.map((x: { code: string; done: boolean }) => [x.code, x.done])).toEqual([
      ['hold', true], ['balance', true], ['claimant', true], ['id-photo', true], ['handover', true], ['signature', true],
    ])
    expect(page.gateReasons).toEqual([])
    expect(page.disposition).toBe('returned_to_owner')
    expect(page.property.map((p: { item: string; returned: boolean }) => [p.item, p.returned])).toEqual([['Child car seat', true], ['Toolbox', false]])
    expect(await kinds(vehicle.id)).toEqual([
      'release_claimant_recorded', 'file_added', 'release_id_photo_added', 'release_handover_recorded', 'file_added', 'release_signed',
    ])
    const claimantEvent = (await historyOf(app.db, vehicle.id))[0]!
    // The history keeps the ID's last four characters, not the whole number.
    expect(claimantEvent.after).toMatchObject({ idNumberEnds: '1902', idExpiry: '2030-05-31', name: 'Dana Okafor' })
    expect(JSON.stringify(claimantEvent.after)).not.toContain('D4471902')
    const board = await s.get('/api/board')
    const card = board.body.columns.find((c: { column: string }) => c.column === 'release').cards.find((c: { id: string }) => c.id === vehicle.id)
    expect(card.handover).toMatchObject({ claimantIdRecorded: true, releaseSigned: true })
    const files = await app.db.select().from(t.files).where(eq(t.files.vehicleId, vehicle.id))
    expect(files.map((f) => [f.kind, f.label, f.mime]).sort()).toEqual([['document', 'Signature', 'image/jpeg'], ['id', 'ID', 'image/jpeg']])
  })

  it('closes by the board move once every guard passes (balance settled: this rule set charges nothing)', async () => {
    const { vehicle, items } = await vehicleInRelease(app.db, staff.yard.id)
    const s = await signedIn(app.app, staff.office)
    await completeRelease(s, vehicle.id, items.map((i) => i.id))
    const v = await vehicleRow(app.db, vehicle.id)
    const res = await s.post(`/api/vehicles/${vehicle.id}/moves`, close(vehicle.id, v.version))
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ state: 'closed', disposition: 'returned_to_owner' })
  })
})

describe('bad input at the counter: refused with the field named, nothing written', () => {
  it('refuses an expired ID', async () => {
    const { vehicle } = await vehicleInRelease(app.db, staff.yard.id)
    const s = await signedIn(app.app, staff.office)
    const res = await s.put(`${base(vehicle.id)}/claimant`, { ...CLAIMANT, idExpiry: '2024-01-31' })
    expect(res.status).toBe(400)
    expect(res.body.issues).toEqual([
      { path: 'idExpiry', message: 'This ID expired on 2024-01-31: an expired ID cannot be accepted. Ask for a current one.', code: 'releases.idExpired', params: { date: '2024-01-31' } },
    ])
    expect(await releaseRow(vehicle.id)).toBeUndefined()
    expect(await kinds(vehicle.id)).toEqual([])
  })

  it.each([
    ['a missing ID number', { idNumber: '' }, 'idNumber'],
    ['an agent without whom they act for', { kind: 'owner_agent', authorityKind: 'written_authorisation' }, 'actingFor'],
    ["an agent without the owner's written authorisation", { kind: 'owner_agent', actingFor: 'Dana Okafor' }, 'authorityKind'],
    ['an expiry that is not a date', { idExpiry: 'next year' }, 'idExpiry'],
  ])('refuses %s', async (_what, change, path) => {
    const { vehicle } = await vehicleInRelease(app.db, staff.yard.id)
    const s = await signedIn(app.app, staff.office)
    const res = await s.put(`${base(vehicle.id)}/claimant`, { ...CLAIMANT, ...change })
    expect(res.status).toBe(400)
    expect(res.body.issues.map((i: { path: string }) => i.path)).toEqual([path])
    expect(await releaseRow(vehicle.id)).toBeUndefined()
  })

  it.each([
    ['a PDF', Buffer.from('%PDF-1.4\n1 0 obj<<>>endobj\ntrailer<<>>\n%%EOF'), 'id.pdf'],
    ['a text file named .jpg', Buffer.from('not a photo at all'), 'id.jpg'],
  ])('refuses an ID photo that is %s', async (_what, data, name) => {
    const { vehicle } = await vehicleInRelease(app.db, staff.yard.id)
    const s = await signedIn(app.app, staff.office)
    await s.put(`${base(vehicle.id)}/claimant`, CLAIMANT).expect(200)
    const res = await s.agent.post(`${base(vehicle.id)}/id-photo`).set('x-csrf-token', s.csrf).attach('files', data, name)
    expect(res.status).toBe(400)
    expect(res.body.issues).toEqual([{ path: 'files.0', message: expect.stringContaining('Use JPEG, PNG, WebP or HEIC photos.'), code: expect.stringMatching(/^files\./), params: expect.objectContaining({ name, what: 'photoTypes' }) }])
    expect((await releaseRow(vehicle.id))!.idPhotoFileId).toBeNull()
    expect(await app.db.select().from(t.files).where(eq(t.files.vehicleId, vehicle.id))).toEqual([])
  })

  it('refuses an empty signature', async () => {
    const { vehicle, items } = await vehicleInRelease(app.db, staff.yard.id)
    const s = await signedIn(app.app, staff.office)
    await s.put(`${base(vehicle.id)}/claimant`, CLAIMANT).expect(200)
    await s.agent.post(`${base(vehicle.id)}/id-photo`).set('x-csrf-token', s.csrf).attach('files', await idPhoto(), 'licence.jpg').expect(201)
    await s.put(`${base(vehicle.id)}/handover`, { odometer: 88_100, property: items.map((i) => ({ itemId: i.id, returned: true })) }).expect(200)
    for (const image of [await signaturePng(false), '']) {
      const res = await s.post(`${base(vehicle.id)}/signature`, { signerName: 'Dana Okafor', image })
      expect(res.status).toBe(400)
      expect(res.body.issues.map((i: { path: string }) => i.path)).toEqual(['image'])
    }
    expect((await releaseRow(vehicle.id))!.signedAt).toBeNull()
    expect(await kinds(vehicle.id)).not.toContain('release_signed')
  })

  it('refuses a handover that leaves an item unchecked or reads less than the intake odometer', async () => {
    const { vehicle, items } = await vehicleInRelease(app.db, staff.yard.id)
    const s = await signedIn(app.app, staff.office)
    await s.put(`${base(vehicle.id)}/claimant`, CLAIMANT).expect(200)
    const res = await s.put(`${base(vehicle.id)}/handover`, { odometer: 1_200, property: [{ itemId: items[0]!.id, returned: true }] })
    expect(res.status).toBe(400)
    expect(res.body.issues).toEqual([
      { path: 'property', message: 'Check off every item of the intake inventory: Toolbox still to do.', code: 'releases.checkOffEvery', params: { items: 'Toolbox' } },
      { path: 'odometer', message: 'The odometer reads less than at intake (88,000). Read it again.', code: 'releases.odometerBelowIntake', params: { intake: '88,000' } },
    ])
    expect((await releaseRow(vehicle.id))!.handoverRecordedAt).toBeNull()
    expect(await app.db.select().from(t.releaseProperty)).not.toContainEqual(expect.objectContaining({ itemId: items[0]!.id }))
  })

  it('refuses to sign before the ID photo and the handover are recorded', async () => {
    const { vehicle } = await vehicleInRelease(app.db, staff.yard.id)
    const s = await signedIn(app.app, staff.office)
    await s.put(`${base(vehicle.id)}/claimant`, CLAIMANT).expect(200)
    const res = await s.post(`${base(vehicle.id)}/signature`, { signerName: 'Dana Okafor', image: await signaturePng() })
    expect(res.status).toBe(422)
    expect(res.body.error).toBe('Record a photo of the ID, the odometer and the property handed back before the release is signed.')
    expect(await app.db.select().from(t.files).where(eq(t.files.vehicleId, vehicle.id))).toEqual([])
  })
})

describe('access: release and gate are for the office and managers', () => {
  it.each(['dispatcher', 'technician'] as const)('refuses the %s every release and gate route', async (role) => {
    const { vehicle } = await vehicleInRelease(app.db, staff.yard.id)
    const s = await signedIn(app.app, staff[role])
    const calls = [
      s.get(base(vehicle.id)),
      s.put(`${base(vehicle.id)}/claimant`, CLAIMANT),
      s.put(`${base(vehicle.id)}/handover`, { odometer: 1, property: [] }),
      s.post(`${base(vehicle.id)}/signature`, { signerName: 'x', image: await signaturePng() }),
      s.get(`${base(vehicle.id)}/form`),
      s.post(`${base(vehicle.id)}/gate-pass`),
      s.get(`/api/vehicles/${vehicle.id}/documents/pickup-ticket`),
      s.post('/api/gate/check', { pass: 'ABCDE-FGHJK' }),
      s.post('/api/gate/record-out', { pass: 'ABCDE-FGHJK' }),
    ]
    for (const res of await Promise.all(calls)) expect(res.status).toBe(403)
    expect(await releaseRow(vehicle.id)).toBeUndefined()
  })

  it("answers not found for another company's vehicle", async () => {
    const other = await makeStaff(app.db)
    const { vehicle } = await vehicleInRelease(app.db, other.yard.id)
    const s = await signedIn(app.app, staff.office)
    expect((await s.get(base(vehicle.id))).status).toBe(404)
    expect((await s.put(`${base(vehicle.id)}/claimant`, CLAIMANT)).status).toBe(404)
  })
})
