import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { historyOf } from '@db/history'
import { browserSession, makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { makeStaff } from '../helpers/factories'
import { CLAIMANT, idPhoto, signaturePng, vehicleInRelease } from '../helpers/release'

// Issue 11, "Release": the owner signs the release from their page where the counter's rules allow it —
// they collect it themselves, and the counter has recorded their ID with its photo and the handover.

let app: TestApp
beforeAll(async () => {
  app = await makeTestApp()
})
afterAll(() => app.close())

async function atCounter() {
  const staff = await makeStaff(app.db)
  const { vehicle, items } = await vehicleInRelease(app.db, staff.yard.id)
  const office = await signedIn(app.app, staff.office)
  const link = (await office.post(`/api/vehicles/${vehicle.id}/owner-links`).expect(201)).body as { token: string }
  const owner = await browserSession(app.app)
  const base = `/api/vehicles/${vehicle.id}/release`
  return {
    staff,
    vehicle,
    office,
    owner,
    token: link.token,
    claimant: (kind = CLAIMANT.kind) => office.put(`${base}/claimant`, { ...CLAIMANT, kind, ...(kind === 'registered_owner' ? {} : { name: 'Lee Marsh', actingFor: 'Dana Okafor', authorityKind: 'written_authorisation', authorityReference: 'Signed letter from the owner' }) }).expect(200),
    idPhoto: async () => office.agent.post(`${base}/id-photo`).set('x-csrf-token', office.csrf).attach('files', await idPhoto(), 'licence.jpg').expect(201),
    handover: () => office.put(`${base}/handover`, { odometer: 88_140, odometerUnreadable: false, property: items.map((i) => ({ itemId: i.id, returned: true, note: null })) }).expect(200),
  }
}

const releaseRow = async (vehicleId: string) => (await app.db.select().from(t.releases).where(eq(t.releases.vehicleId, vehicleId)))[0]

describe("signing the release from the owner's page", () => {
  it('ownerSignature_onceTheCounterRecordedTheOwnersIdAndHandover_isTheReleaseSignatureWithNameTimeAndAddress', async () => {
    const c = await atCounter()
    expect((await c.owner.get(`/api/owner/${c.token}`).expect(200)).body.release).toEqual({ status: 'at-counter', missing: ['claimant', 'id-photo', 'handover'], signerName: null, signedAt: null })
    await c.claimant()
    await c.idPhoto()
    await c.handover()
    expect((await c.owner.get(`/api/owner/${c.token}`)).body.release.status).toBe('ready')

    const res = await c.owner.post(`/api/owner/${c.token}/release-signature`, { signerName: 'Dana Okafor', image: await signaturePng() })
    expect(res.status).toBe(201)
    expect(res.body.release).toMatchObject({ status: 'signed', signerName: 'Dana Okafor', signedAt: expect.any(String) })
    const row = await releaseRow(c.vehicle.id)
    expect(row).toMatchObject({ signerName: 'Dana Okafor', signatureFileId: expect.any(String) })
    const signed = (await historyOf(app.db, c.vehicle.id)).find((e) => e.kind === 'release_signed')!
    expect(signed).toMatchObject({ actorId: null, actorLabel: 'Dana Okafor (owner, by link)' })
    expect(signed.after).toMatchObject({ signerName: 'Dana Okafor', remote: true, ip: expect.stringMatching(/\d/) })
    // The counter sees the same signed release.
    const page = (await c.office.get(`/api/vehicles/${c.vehicle.id}/release`).expect(200)).body
    expect(page.steps.find((s: { code: string }) => s.code === 'signature').done).toBe(true)
    // Once signed, it is not signed again.
    expect((await c.owner.post(`/api/owner/${c.token}/release-signature`, { signerName: 'Dana Okafor', image: await signaturePng() })).status).toBe(409)
  })

  it('ownerSignature_beforeTheCounterRecordedTheHandover_isRefusedAndWritesNothing', async () => {
    const c = await atCounter()
    await c.claimant()
    await c.idPhoto()
    const before = (await historyOf(app.db, c.vehicle.id)).length
    const res = await c.owner.post(`/api/owner/${c.token}/release-signature`, { signerName: 'Dana Okafor', image: await signaturePng() })
    expect(res.status).toBe(422)
    expect(res.body.missing).toEqual(['handover'])
    expect((await releaseRow(c.vehicle.id))!.signedAt).toBeNull()
    expect((await historyOf(app.db, c.vehicle.id)).length).toBe(before)
  })

  it('ownerSignature_whenSomeoneElseCollects_isLeftToTheCounter', async () => {
    const c = await atCounter()
    await c.claimant('owner_agent')
    await c.idPhoto()
    await c.handover()
    expect((await c.owner.get(`/api/owner/${c.token}`)).body.release).toMatchObject({ status: 'at-counter', missing: ['claimant'] })
    expect((await c.owner.post(`/api/owner/${c.token}/release-signature`, { signerName: 'Dana Okafor', image: await signaturePng() })).status).toBe(422)
  })

  it('ownerSignature_emptyOrMissing_isRefusedNamingTheField', async () => {
    const c = await atCounter()
    await c.claimant()
    await c.idPhoto()
    await c.handover()
    const empty = await c.owner.post(`/api/owner/${c.token}/release-signature`, { signerName: 'Dana Okafor', image: await signaturePng(false) })
    expect(empty.status).toBe(400)
    expect(JSON.stringify(empty.body)).toMatch(/image|sign/i)
    const noName = await c.owner.post(`/api/owner/${c.token}/release-signature`, { signerName: ' ', image: await signaturePng() })
    expect(noName.status).toBe(400)
    expect(noName.body.issues.map((i: { path: string }) => i.path)).toContain('signerName')
    expect((await releaseRow(c.vehicle.id))!.signedAt).toBeNull()
  })
})
