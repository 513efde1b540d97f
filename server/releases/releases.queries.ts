import { and, asc, desc, eq, inArray } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { files, gatePasses, propertyItems, releasePhotos, releaseProperty, releases } from '@db/schema'
import type { ReleaseRecord } from '@shared/schemas/releases'

export type ReleaseRow = typeof releases.$inferSelect

export async function releaseOf(db: Executor, vehicleId: string): Promise<ReleaseRow | undefined> {
  const [row] = await db.select().from(releases).where(eq(releases.vehicleId, vehicleId))
  return row
}

export async function inventoryOf(db: Executor, vehicleId: string) {
  return db
    .select({ id: propertyItems.id, item: propertyItems.item, location: propertyItems.location, count: propertyItems.count })
    .from(propertyItems)
    .where(eq(propertyItems.vehicleId, vehicleId))
    .orderBy(asc(propertyItems.createdAt), asc(propertyItems.item))
}

/** The intake inventory with what the release says of each item (null: not yet checked off). */
export async function propertyAtRelease(db: Executor, vehicleId: string, releaseId: string | null) {
  const items = await inventoryOf(db, vehicleId)
  const checked = releaseId ? await db.select().from(releaseProperty).where(eq(releaseProperty.releaseId, releaseId)) : []
  const byItem = new Map(checked.map((c) => [c.itemId, c]))
  return items.map((i) => ({ ...i, returned: byItem.get(i.id)?.returned ?? null, note: byItem.get(i.id)?.note ?? null }))
}

export async function releasePhotoIds(db: Executor, releaseId: string): Promise<string[]> {
  const rows = await db
    .select({ id: releasePhotos.fileId })
    .from(releasePhotos)
    .innerJoin(files, eq(files.id, releasePhotos.fileId))
    .where(eq(releasePhotos.releaseId, releaseId))
    .orderBy(asc(files.createdAt))
  return rows.map((r) => r.id)
}

const fileLink = async (db: Executor, id: string) => {
  const [f] = await db.select({ thumbKey: files.thumbKey }).from(files).where(eq(files.id, id))
  return { id, url: `/api/files/${id}`, thumbUrl: f?.thumbKey ? `/api/files/${id}/thumb` : null }
}

export async function releaseRecord(db: Executor, row: ReleaseRow): Promise<ReleaseRecord> {
  const photos = await releasePhotoIds(db, row.id)
  return {
    id: row.id,
    claimant:
      row.claimantKind && row.claimantName && row.idType && row.idNumber && row.idIssuer && row.idExpiry && row.authorityKind && row.authorityReference
        ? {
            kind: row.claimantKind,
            name: row.claimantName,
            actingFor: row.actingFor,
            idType: row.idType,
            idNumber: row.idNumber,
            idIssuer: row.idIssuer,
            idExpiry: row.idExpiry,
            authorityKind: row.authorityKind,
            authorityReference: row.authorityReference,
          }
        : null,
    idPhoto: row.idPhotoFileId ? await fileLink(db, row.idPhotoFileId) : null,
    odometer: row.odometer,
    odometerUnreadable: row.odometerUnreadable,
    handoverRecordedAt: row.handoverRecordedAt?.toISOString() ?? null,
    photos: await Promise.all(photos.map((id) => fileLink(db, id))),
    signature:
      row.signedAt && row.signatureFileId && row.signerName
        ? { signerName: row.signerName, signedAt: row.signedAt.toISOString(), url: `/api/files/${row.signatureFileId}` }
        : null,
  }
}

/** The vehicle's latest gate pass that was not withdrawn. */
export async function currentPass(db: Executor, vehicleId: string) {
  const [row] = await db
    .select()
    .from(gatePasses)
    .where(and(eq(gatePasses.vehicleId, vehicleId)))
    .orderBy(desc(gatePasses.issuedAt))
    .limit(1)
  return row
}

export async function photoOf(db: Executor, vehicleId: string): Promise<string | null> {
  const [row] = await db
    .select({ id: files.id, thumbKey: files.thumbKey })
    .from(files)
    .where(and(eq(files.vehicleId, vehicleId), inArray(files.kind, ['photo'])))
    .orderBy(asc(files.createdAt))
    .limit(1)
  return row ? `/api/files/${row.id}${row.thumbKey ? '/thumb' : ''}` : null
}
