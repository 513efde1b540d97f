import { and, asc, eq, inArray } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { files, users, vehicles, yards } from '@db/schema'
import type { FileRecord } from '@shared/schemas/files'
import { yardOfStaff } from '../yards/index'

function toRecord(r: { file: typeof files.$inferSelect; uploadedBy: string | null }): FileRecord {
  const f = r.file
  return {
    id: f.id,
    kind: f.kind,
    mime: f.mime,
    bytes: f.bytes,
    width: f.width,
    height: f.height,
    label: f.label,
    sha256: f.sha256,
    url: `/api/files/${f.id}`,
    thumbUrl: f.thumbKey ? `/api/files/${f.id}/thumb` : null,
    uploadedBy: r.uploadedBy,
    createdAt: f.createdAt.toISOString(),
  }
}

export async function filesOf(db: Executor, vehicleId: string, only?: string[]): Promise<FileRecord[]> {
  const rows = await db
    .select({ file: files, uploadedBy: users.name })
    .from(files)
    .leftJoin(users, eq(users.id, files.uploadedById))
    .where(only ? and(eq(files.vehicleId, vehicleId), inArray(files.id, only)) : eq(files.vehicleId, vehicleId))
    .orderBy(asc(files.createdAt), asc(files.id))
  return rows.map(toRecord)
}

/** A file with the stock number it belongs to, if the vehicle is in one of the staff member's yards. */
export async function fileForUser(db: Executor, userId: string, fileId: string) {
  const [row] = await db
    .select({ file: files, stockNumber: vehicles.stockNumber })
    .from(files)
    .innerJoin(vehicles, eq(vehicles.id, files.vehicleId))
    .innerJoin(yards, eq(yards.id, vehicles.yardId))
    .where(and(eq(files.id, fileId), yardOfStaff(userId)))
  return row
}

export type FoundFile = NonNullable<Awaited<ReturnType<typeof fileForUser>>>

/** A file with its stock number, if it belongs to this vehicle. */
export async function fileOfVehicle(db: Executor, vehicleId: string, fileId: string): Promise<FoundFile | undefined> {
  const [row] = await db
    .select({ file: files, stockNumber: vehicles.stockNumber })
    .from(files)
    .innerJoin(vehicles, eq(vehicles.id, files.vehicleId))
    .where(and(eq(files.id, fileId), eq(files.vehicleId, vehicleId)))
  return row
}
