import { randomUUID } from 'node:crypto'
import { count, eq } from 'drizzle-orm'
import { files } from '@db/schema'
import { MAX_FILES_PER_VEHICLE, type FileKind } from '@shared/schemas/files'
import type { User } from '@shared/schemas/users'
import { fieldIssue, unprocessable, said } from '../errors'
import { changeVehicle, vehicleForUser, type ChangeScope, type VehicleChanges } from '../vehicles/index'
import type { FileStore } from './file-store'
import { prepareUploads, type Incoming, type PreparedFile } from './prepare'

export interface StoredFile extends PreparedFile {
  id: string
  storageKey: string
  thumbKey: string | null
}

/**
 * Writes prepared files to the store under server-made keys. The caller records them in a
 * transaction and calls `discard` if that transaction fails, so no file outlives a refused request.
 */
export async function putFiles(store: FileStore, vehicleId: string, prepared: PreparedFile[]) {
  const stored: StoredFile[] = []
  const keys: string[] = []
  const discard = () => Promise.all(keys.map((k) => store.delete(k).catch(() => undefined))).then(() => undefined)
  try {
    for (const p of prepared) {
      const id = randomUUID()
      const storageKey = `vehicles/${vehicleId}/${id}.${p.ext}`
      const thumbKey = p.thumb ? `vehicles/${vehicleId}/${id}-thumb.jpg` : null
      keys.push(storageKey)
      await store.put(storageKey, p.data)
      if (thumbKey) {
        keys.push(thumbKey)
        await store.put(thumbKey, p.thumb!)
      }
      stored.push({ ...p, id, storageKey, thumbKey })
    }
  } catch (err) {
    await discard()
    throw err
  }
  return { stored, discard }
}

/** Rows and one history event for files already in the store, as part of the caller's change to the vehicle. */
export async function recordFiles({ tx, vehicleId, actor, now, record }: Omit<ChangeScope, 'actor'> & { actor: { id: string | null } }, stored: StoredFile[]) {
  if (stored.length === 0) return
  await tx.insert(files).values(
    stored.map((f) => ({
      id: f.id,
      vehicleId,
      kind: f.kind,
      storageKey: f.storageKey,
      thumbKey: f.thumbKey,
      mime: f.mime,
      bytes: f.data.length,
      sha256: f.sha256,
      width: f.width,
      height: f.height,
      label: f.label,
      uploadedById: actor.id,
      createdAt: now,
    })),
  )
  record({ kind: 'file_added', after: { files: stored.map((f) => ({ id: f.id, kind: f.kind, label: f.label, sha256: f.sha256 })) } })
}

/** Adds photos or papers to a vehicle's record: all of them, or none with the reason. */
export async function addFiles(changes: VehicleChanges, store: FileStore, actor: User, vehicleId: string, incoming: Incoming[], kind: FileKind, label: string | null) {
  if (incoming.length === 0) throw unprocessable('Choose at least one file to add.', said('chooseFile', undefined, { issues: [fieldIssue('files', 'files.chooseAtLeastOne', 'Choose at least one file to add.')] }))
  const { db } = changes
  await vehicleForUser(db, actor.id, vehicleId)
  const [have] = await db.select({ n: count() }).from(files).where(eq(files.vehicleId, vehicleId))
  if ((have?.n ?? 0) + incoming.length > MAX_FILES_PER_VEHICLE) {
    throw unprocessable(`A vehicle keeps at most ${MAX_FILES_PER_VEHICLE} files; this one has ${have?.n ?? 0}.`, said('tooManyFiles', { max: MAX_FILES_PER_VEHICLE, have: have?.n ?? 0 }))
  }
  const prepared = await prepareUploads(incoming, kind, 'files', label)
  const { stored, discard } = await putFiles(store, vehicleId, prepared)
  try {
    await changeVehicle(changes, actor, vehicleId, (scope) => recordFiles(scope, stored))
  } catch (err) {
    await discard()
    throw err
  }
  return stored.map((f) => f.id)
}
