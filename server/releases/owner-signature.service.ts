import { eq } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { releases } from '@db/schema'
import type { SignatureInput } from '@shared/schemas/releases'
import type { OwnerRelease } from '@shared/schemas/owner'
import { conflict, unprocessable } from '../errors'
import { prepareUploads, putFiles, recordFiles, type FileStore } from '../files/index'
import { changeVehicleAsOwner, type VehicleChanges } from '../vehicles/index'
import { releaseOf, type ReleaseRow } from './releases.queries'
import { signatureImage } from './signature'

/**
 * What the owner's page may do about the release. The rules of the counter stand: the owner signs from
 * their page only when they are the one collecting (the registered owner), the counter has already recorded
 * their ID with its photo and the handover (odometer, property), and nothing is signed yet. Anything else is
 * done at the counter, and the page says what.
 */
export function ownerReleaseOf(state: string, release: ReleaseRow | undefined): OwnerRelease {
  if (state !== 'release') return { status: 'not-ready', missing: [], signerName: null, signedAt: null }
  if (release?.signedAt) return { status: 'signed', missing: [], signerName: release.signerName, signedAt: release.signedAt.toISOString() }
  const missing: OwnerRelease['missing'] = []
  if (release?.claimantKind !== 'registered_owner') missing.push('claimant')
  if (!release?.idPhotoFileId) missing.push('id-photo')
  if (!release?.handoverRecordedAt) missing.push('handover')
  return { status: missing.length ? 'at-counter' : 'ready', missing, signerName: null, signedAt: null }
}

export async function ownerRelease(db: Executor, vehicleId: string, state: string): Promise<OwnerRelease> {
  return ownerReleaseOf(state, await releaseOf(db, vehicleId))
}

/**
 * The owner's signature from their page: the same checks and storage as at the counter (an empty one
 * refused, the image a file under the upload rules), recorded as the release's signature with the name,
 * the time and the address it came from, in the history as the owner by their link.
 */
export async function signReleaseAsOwner(
  changes: VehicleChanges,
  store: FileStore,
  link: { id: string; vehicleId: string },
  input: SignatureInput,
  from: { ip: string },
  now = new Date(),
) {
  const png = await signatureImage(input.image)
  const prepared = await prepareUploads([{ buffer: png, originalname: 'signature.png' }], 'document', 'image', 'Signature')
  const { stored, discard } = await putFiles(store, link.vehicleId, prepared)
  try {
    await changeVehicleAsOwner(changes, `${input.signerName} (owner, by link)`, link.vehicleId, async (w) => {
      const release = await releaseOf(w.tx, link.vehicleId)
      const may = ownerReleaseOf(w.vehicle.state, release)
      if (may.status === 'signed') throw conflict('The release is already signed.')
      if (may.status !== 'ready') throw unprocessable('The release cannot be signed from this page yet: the counter records who collects, their ID and the handover first.', { missing: may.missing })
      // The owner has no staff account: the file names no uploader, the history names the owner.
      await recordFiles({ ...w, actor: { id: null } }, stored)
      await w.tx.update(releases).set({ signatureFileId: stored[0]!.id, signerName: input.signerName, signedAt: now }).where(eq(releases.id, release!.id))
      w.record({ kind: 'release_signed', after: { signerName: input.signerName, fileId: stored[0]!.id, sha256: stored[0]!.sha256, remote: true, ip: from.ip, linkId: link.id, at: now.toISOString() } })
    })
  } catch (err) {
    await discard()
    throw err
  }
}
