import { and, count, eq } from 'drizzle-orm'
import { files, inspectionItems, inspectionPhotos } from '@db/schema'
import { itemName } from '@shared/domain/inspection'
import { MAX_FILES_PER_VEHICLE } from '@shared/schemas/files'
import type { itemFindingSchema } from '@shared/schemas/inspections'
import type { User } from '@shared/schemas/users'
import type { z } from 'zod'
import { fieldIssue, unprocessable, said } from '../errors'
import { type FileStore, type Incoming, prepareUploads, putFiles, recordFiles } from '../files/index'
import { vehicleForUser, type VehicleChanges } from '../vehicles/index'
import { changeInspection, inspectionFor } from './inspection-change'

type Finding = z.output<typeof itemFindingSchema>

/** Marks one checklist item; a mark that changes nothing writes nothing. */
export async function setFinding(changes: VehicleChanges, actor: User, vehicleId: string, itemCode: string, finding: Finding): Promise<void> {
  await changeInspection(changes, actor, vehicleId, 'open', async ({ tx, inspection, now, record }) => {
    const [before] = await tx
      .select()
      .from(inspectionItems)
      .where(and(eq(inspectionItems.inspectionId, inspection.id), eq(inspectionItems.itemCode, itemCode)))
    if (before && before.status === finding.status && before.note === finding.note) return
    if (!before && finding.status === 'not_checked' && finding.note === null) return
    const values = { status: finding.status, note: finding.note, updatedById: actor.id, updatedAt: now }
    await tx
      .insert(inspectionItems)
      .values({ inspectionId: inspection.id, itemCode, ...values })
      .onConflictDoUpdate({ target: [inspectionItems.inspectionId, inspectionItems.itemCode], set: values })
    record({
      kind: 'inspection_item_marked',
      before: before ? { item: itemCode, status: before.status, note: before.note } : null,
      after: { inspectionId: inspection.id, item: itemCode, name: itemName(itemCode), status: finding.status, note: finding.note },
    })
  })
}

/**
 * Photos of one finding, through the tow-in's upload pipeline (sniffed, re-encoded, stripped of
 * metadata, hashed into the history); the link row says which item they show. All or none.
 */
export async function addItemPhotos(changes: VehicleChanges, store: FileStore, actor: User, vehicleId: string, itemCode: string, incoming: Incoming[]) {
  if (incoming.length === 0) throw unprocessable('Take or choose a photo first.', said('takePhoto', undefined, { issues: [fieldIssue('files', 'inspections.takePhotoFirst', 'Take or choose a photo first.')] }))
  const { db } = changes
  // Refuse before decoding a dozen photos for an inspection that cannot take them (checked again under the lock).
  await inspectionFor(db, (await vehicleForUser(db, actor.id, vehicleId)).vehicle, 'open')
  const [have] = await db.select({ n: count() }).from(files).where(eq(files.vehicleId, vehicleId))
  if ((have?.n ?? 0) + incoming.length > MAX_FILES_PER_VEHICLE) {
    throw unprocessable(`A vehicle keeps at most ${MAX_FILES_PER_VEHICLE} files; this one has ${have?.n ?? 0}.`, said('tooManyFiles', { max: MAX_FILES_PER_VEHICLE, have: have?.n ?? 0 }))
  }
  const prepared = await prepareUploads(incoming, 'photo', 'files', itemName(itemCode))
  const { stored, discard } = await putFiles(store, vehicleId, prepared)
  try {
    await changeInspection(changes, actor, vehicleId, 'open', async (w) => {
      await recordFiles(w, stored)
      await w.tx.insert(inspectionPhotos).values(stored.map((f) => ({ fileId: f.id, inspectionId: w.inspection.id, itemCode })))
    })
  } catch (err) {
    await discard()
    throw err
  }
}
