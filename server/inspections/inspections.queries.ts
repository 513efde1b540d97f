import { asc, desc, eq, inArray } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { inspectionItems, inspectionLines, inspectionPhotos, inspections, users } from '@db/schema'
import { hundredthsToHours, lineCents } from '@shared/domain/inspection'
import type { LineView } from '@shared/schemas/inspections'
import { filesOf } from '../files/index'

export type InspectionRow = typeof inspections.$inferSelect
export type LineRow = typeof inspectionLines.$inferSelect

/** The vehicle's latest inspection, under way or finished. */
export async function latestInspection(db: Executor, vehicleId: string): Promise<InspectionRow | undefined> {
  const [row] = await db.select().from(inspections).where(eq(inspections.vehicleId, vehicleId)).orderBy(desc(inspections.startedAt)).limit(1)
  return row
}

export const itemsOf = (db: Executor, inspectionId: string) =>
  db.select().from(inspectionItems).where(eq(inspectionItems.inspectionId, inspectionId))

export const linesOf = (db: Executor, inspectionId: string) =>
  db.select().from(inspectionLines).where(eq(inspectionLines.inspectionId, inspectionId)).orderBy(asc(inspectionLines.createdAt), asc(inspectionLines.id))

export function lineView(l: LineRow): LineView {
  return {
    id: l.id,
    itemCode: l.itemCode,
    part: l.part,
    quantity: l.quantity,
    unitPriceCents: l.unitPriceCents,
    labourHours: hundredthsToHours(l.labourHundredths),
    labourRateCents: l.labourRateCents,
    ...lineCents(l),
  }
}

/** Each item's photos, in the order they were taken. */
export async function photosByItem(db: Executor, vehicleId: string, inspectionId: string) {
  const links = await db.select().from(inspectionPhotos).where(eq(inspectionPhotos.inspectionId, inspectionId))
  const byItem = new Map<string, Awaited<ReturnType<typeof filesOf>>>()
  if (links.length === 0) return byItem
  const itemOf = new Map(links.map((l) => [l.fileId, l.itemCode]))
  for (const file of await filesOf(db, vehicleId, [...itemOf.keys()])) {
    const code = itemOf.get(file.id)!
    byItem.set(code, [...(byItem.get(code) ?? []), file])
  }
  return byItem
}

/** Names of the given staff, for "started by …, finished by …". */
export async function namesOf(db: Executor, ids: (string | null)[]): Promise<Map<string, string>> {
  const wanted = [...new Set(ids.filter((id): id is string => id !== null))]
  if (wanted.length === 0) return new Map()
  const rows = await db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, wanted))
  return new Map(rows.map((r) => [r.id, r.name]))
}
