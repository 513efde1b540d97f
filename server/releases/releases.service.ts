import { and, eq } from 'drizzle-orm'
import { releasePhotos, releaseProperty, releases } from '@db/schema'
import { balanceSettled, noActiveHold, type Reason } from '@shared/domain/lifecycle'
import { dayIn, dispositionFor, type Claimant, type ReleasePage, type SignatureInput } from '@shared/schemas/releases'
import type { User } from '@shared/schemas/users'
import type { z } from 'zod'
import type { handoverInputSchema } from '@shared/schemas/releases'
import type { Executor } from '@db/client'
import { judgeMove, moveFacts } from '../board/index'
import { badRequest, conflict, fieldIssue, type Issue, unprocessable, said } from '../errors'
import { prepareUploads, putFiles, recordFiles, type FileStore, type Incoming } from '../files/index'
import { changeVehicle, vehicleForUser, type VehicleChanges, type VehicleWork } from '../vehicles/index'
import { currentPass, inventoryOf, propertyAtRelease, releaseOf, releaseRecord, type ReleaseRow } from './releases.queries'
import { signatureImage } from './signature'

type Handover = z.output<typeof handoverInputSchema>

/** Release work happens at the counter, in Release, until the claimant signs. */
function mustBeOpen(w: VehicleWork, release: ReleaseRow | undefined, action: string) {
  if (w.vehicle.state !== 'release') throw conflict(`Move ${w.vehicle.stockNumber} to Release first, then ${action}.`, said('releaseFirst', { stock: w.vehicle.stockNumber }))
  if (release?.signedAt) throw conflict('The release is signed: what it records can no longer change.', said('releaseSigned'))
}

function needClaimant(release: ReleaseRow | undefined): asserts release is ReleaseRow {
  if (!release?.claimantKind) throw conflict('Record who is collecting and their ID first.', said('claimantFirst'))
}

/**
 * Who is collecting, their ID and the proof they may take the vehicle. An expired ID is refused;
 * a different person or ID number drops the ID photo taken for the one before. The history keeps the
 * ID's kind, issuer, expiry and last four characters, not the whole number.
 */
export async function recordClaimant(changes: VehicleChanges, actor: User, vehicleId: string, input: Claimant, now = new Date()) {
  await changeVehicle(changes, actor, vehicleId, async (w) => {
    const release = await releaseOf(w.tx, vehicleId)
    mustBeOpen(w, release, 'record who is collecting')
    const today = dayIn(w.yard.timeZone, now)
    if (input.idExpiry < today) {
      const message = `This ID expired on ${input.idExpiry}: an expired ID cannot be accepted. Ask for a current one.`
      throw badRequest(message, [fieldIssue('idExpiry', 'releases.idExpired', message, { date: input.idExpiry })])
    }
    const samePerson = release && release.claimantName === input.name && release.idNumber === input.idNumber
    const values = { claimantKind: input.kind, claimantName: input.name, actingFor: input.actingFor, idType: input.idType, idNumber: input.idNumber, idIssuer: input.idIssuer, idExpiry: input.idExpiry, authorityKind: input.authorityKind, authorityReference: input.authorityReference }
    if (release) await w.tx.update(releases).set({ ...values, idPhotoFileId: samePerson ? release.idPhotoFileId : null }).where(eq(releases.id, release.id))
    else await w.tx.insert(releases).values({ vehicleId, createdById: actor.id, ...values })
    w.record({
      kind: 'release_claimant_recorded',
      after: {
        claimantKind: input.kind,
        name: input.name,
        actingFor: input.actingFor,
        idType: input.idType,
        idIssuer: input.idIssuer,
        idExpiry: input.idExpiry,
        idNumberEnds: input.idNumber.slice(-4),
        authorityKind: input.authorityKind,
        authorityReference: input.authorityReference,
      },
    })
  })
}

/** One photo of the claimant's ID: an image only (a PDF or anything else is refused), kept as kind "id". */
export async function addIdPhoto(changes: VehicleChanges, store: FileStore, actor: User, vehicleId: string, incoming: Incoming[]) {
  if (incoming.length !== 1) {
    throw badRequest('Add one photo of the ID.', [fieldIssue('files', 'releases.addOneIdPhoto', 'Add one photo of the ID.')])
  }
  await vehicleForUser(changes.db, actor.id, vehicleId)
  const prepared = (await prepareUploads(incoming, 'photo', 'files', 'ID')).map((p) => ({ ...p, kind: 'id' as const }))
  const { stored, discard } = await putFiles(store, vehicleId, prepared)
  try {
    await changeVehicle(changes, actor, vehicleId, async (w) => {
      const release = await releaseOf(w.tx, vehicleId)
      mustBeOpen(w, release, 'add the ID photo')
      needClaimant(release)
      await recordFiles(w, stored)
      await w.tx.update(releases).set({ idPhotoFileId: stored[0]!.id }).where(eq(releases.id, release.id))
      w.record({ kind: 'release_id_photo_added', after: { fileId: stored[0]!.id, sha256: stored[0]!.sha256 } })
    })
  } catch (err) {
    await discard()
    throw err
  }
}

/** Photos taken as the vehicle is handed over: images only. */
export async function addReleasePhotos(changes: VehicleChanges, store: FileStore, actor: User, vehicleId: string, incoming: Incoming[]) {
  if (incoming.length === 0) {
    throw badRequest('Choose at least one photo to add.', [fieldIssue('files', 'releases.choosePhoto', 'Choose at least one photo to add.')])
  }
  await vehicleForUser(changes.db, actor.id, vehicleId)
  const prepared = await prepareUploads(incoming, 'photo', 'files', 'At release')
  const { stored, discard } = await putFiles(store, vehicleId, prepared)
  try {
    await changeVehicle(changes, actor, vehicleId, async (w) => {
      const release = await releaseOf(w.tx, vehicleId)
      mustBeOpen(w, release, 'add photos at release')
      needClaimant(release)
      await recordFiles(w, stored)
      await w.tx.insert(releasePhotos).values(stored.map((f) => ({ releaseId: release.id, fileId: f.id })))
      w.record({ kind: 'release_photos_added', after: { photos: stored.length } })
    })
  } catch (err) {
    await discard()
    throw err
  }
}

/**
 * The odometer at release and each item of the intake inventory checked off: every item answered
 * once, none from another vehicle, and a reading no lower than the one taken at intake.
 */
export async function recordHandover(changes: VehicleChanges, actor: User, vehicleId: string, input: Handover, now = new Date()) {
  await changeVehicle(changes, actor, vehicleId, async (w) => {
    const release = await releaseOf(w.tx, vehicleId)
    mustBeOpen(w, release, 'record the handover')
    needClaimant(release)
    const inventory = await inventoryOf(w.tx, vehicleId)
    const known = new Set(inventory.map((i) => i.id))
    const issues: Issue[] = []
    const seen = new Set<string>()
    input.property.forEach((p, i) => {
      if (!known.has(p.itemId)) issues.push(fieldIssue(`property.${i}.itemId`, 'releases.notInInventory', 'This item is not in this vehicle’s intake inventory.'))
      else if (seen.has(p.itemId)) issues.push(fieldIssue(`property.${i}.itemId`, 'releases.checkedTwice', 'This item is checked off twice.'))
      seen.add(p.itemId)
    })
    const missing = inventory.filter((i) => !seen.has(i.id))
    if (missing.length > 0) {
      const items = missing.map((m) => m.item).join(', ')
      issues.push(fieldIssue('property', 'releases.checkOffEvery', `Check off every item of the intake inventory: ${items} still to do.`, { items }))
    }
    if (input.odometer !== null && w.vehicle.odometer !== null && input.odometer < w.vehicle.odometer) {
      const intake = w.vehicle.odometer.toLocaleString('en-US')
      issues.push(fieldIssue('odometer', 'releases.odometerBelowIntake', `The odometer reads less than at intake (${intake}). Read it again.`, { intake }))
    }
    if (issues.length > 0) throw badRequest(issues.length === 1 ? issues[0]!.message : `${issues.length} things to fix. First: ${issues[0]!.message}`, issues)
    await w.tx.delete(releaseProperty).where(eq(releaseProperty.releaseId, release.id))
    if (input.property.length > 0) await w.tx.insert(releaseProperty).values(input.property.map((p) => ({ releaseId: release.id, ...p })))
    const odometer = input.odometerUnreadable ? null : input.odometer
    await w.tx.update(releases).set({ odometer, odometerUnreadable: input.odometerUnreadable, handoverRecordedAt: now }).where(eq(releases.id, release.id))
    w.record({
      kind: 'release_handover_recorded',
      after: {
        odometer,
        odometerUnreadable: input.odometerUnreadable,
        returned: input.property.filter((p) => p.returned).map((p) => inventory.find((i) => i.id === p.itemId)!.item),
        notReturned: input.property.filter((p) => !p.returned).map((p) => inventory.find((i) => i.id === p.itemId)!.item),
      },
    })
  })
}

/** What signing needs first: the claimant with their ID and its photo, and the handover (by the release page's step codes). */
function unsignable(release: ReleaseRow | undefined): { step: string; words: string }[] {
  const missing: { step: string; words: string }[] = []
  if (!release?.claimantKind) missing.push({ step: 'claimant', words: 'who is collecting and their ID' })
  if (!release?.idPhotoFileId) missing.push({ step: 'id-photo', words: 'a photo of the ID' })
  if (!release?.handoverRecordedAt) missing.push({ step: 'handover', words: 'the odometer and the property handed back' })
  return missing
}

/** The steps still to do before signing; `steps` are their codes, which the client words as the release page does. */
const recordFirst = (missing: { step: string; words: string }[]) =>
  unprocessable(`Record ${missing.map((m) => m.words).join(', ')} before the release is signed.`, said('recordBeforeSigning', { steps: missing.map((m) => m.step).join(',') }))

/**
 * The claimant's signature from the pad: an empty one is refused; the image is stored as a file (the
 * upload rules apply) and the signed release is what the lifecycle's "release signed" guard reads.
 */
export async function signRelease(changes: VehicleChanges, store: FileStore, actor: User, vehicleId: string, input: SignatureInput, now = new Date()) {
  const png = await signatureImage(input.image)
  const { vehicle } = await vehicleForUser(changes.db, actor.id, vehicleId)
  const before = await releaseOf(changes.db, vehicleId)
  const missing = unsignable(before)
  if (vehicle.state === 'release' && !before?.signedAt && missing.length > 0) throw recordFirst(missing)
  const prepared = await prepareUploads([{ buffer: png, originalname: 'signature.png' }], 'document', 'image', 'Signature')
  const { stored, discard } = await putFiles(store, vehicleId, prepared)
  try {
    await changeVehicle(changes, actor, vehicleId, async (w) => {
      const release = await releaseOf(w.tx, vehicleId)
      mustBeOpen(w, release, 'sign the release')
      const still = unsignable(release)
      if (still.length > 0) throw recordFirst(still)
      await recordFiles(w, stored)
      await w.tx
        .update(releases)
        .set({ signatureFileId: stored[0]!.id, signerName: input.signerName, signedAt: now })
        .where(and(eq(releases.id, release!.id)))
      w.record({ kind: 'release_signed', after: { signerName: input.signerName, fileId: stored[0]!.id, sha256: stored[0]!.sha256 } })
    })
  } catch (err) {
    await discard()
    throw err
  }
}

const STEP_ORDER = ['hold', 'balance', 'claimant', 'id-photo', 'handover', 'signature'] as const

/** The release section's page: the record, the inventory, what is left to do and whether a gate pass can be issued. */
export async function releasePage(db: Executor, user: User, vehicleId: string, now = new Date()): Promise<ReleasePage> {
  const { vehicle, yard } = await vehicleForUser(db, user.id, vehicleId)
  const release = await releaseOf(db, vehicleId)
  const facts = await moveFacts(db, vehicle, yard, true, now)
  const ctx = { to: 'closed' as const, now }
  const said = (reasons: Reason[]) => (reasons.length ? reasons.map((r) => r.message).join(' ') : null)
  const holds = noActiveHold(facts, ctx)
  const balance = balanceSettled(facts, ctx)
  const done: Record<(typeof STEP_ORDER)[number], [boolean, Reason[]]> = {
    hold: [holds.length === 0, holds],
    balance: [balance.length === 0, balance],
    claimant: [Boolean(release?.claimantKind), []],
    'id-photo': [Boolean(release?.idPhotoFileId), []],
    handover: [Boolean(release?.handoverRecordedAt), []],
    signature: [Boolean(release?.signedAt), []],
  }
  const disposition = release?.claimantKind ? dispositionFor(release.claimantKind) : null
  const verdict = disposition && vehicle.state === 'release' ? await judgeMove(db, vehicle, yard, user, { to: 'closed', disposition, reason: null }, now) : null
  const pass = await currentPass(db, vehicleId)
  return {
    vehicleId,
    state: vehicle.state,
    version: vehicle.version,
    today: dayIn(yard.timeZone, now),
    release: release ? await releaseRecord(db, release) : null,
    property: await propertyAtRelease(db, vehicleId, release?.id ?? null),
    steps: STEP_ORDER.map((code) => ({ code, done: done[code][0], message: said(done[code][1]), reasons: done[code][1].map((r) => ({ message: r.message, key: r.key, params: r.params })) })),
    disposition,
    gateReasons:
      vehicle.state !== 'release'
        ? [{ code: 'not-a-move', message: `Move ${vehicle.stockNumber} to Release first.`, key: 'releaseFirst', params: { stock: vehicle.stockNumber } }]
        : verdict
          ? verdict.reasons.map((r) => ({ code: r.code, message: r.message, key: r.key, params: r.params }))
          : [{ code: 'claimant-id', message: "The claimant's ID is not recorded.", key: 'claimantId' }],
    gatePass: pass && !pass.withdrawnAt ? { id: pass.id, issuedAt: pass.issuedAt.toISOString(), expiresAt: pass.expiresAt.toISOString(), usedAt: pass.usedAt?.toISOString() ?? null } : null,
  }
}
