import { and, asc, eq, isNull, ne, sql } from 'drizzle-orm'
import type { Executor } from '../../db/client'
import { files, holds, vehicles, yardSpaces } from '../../db/schema/index'

export function activeVehicles(db: Executor, yardId: string) {
  const photoCount = db
    .select({ vehicleId: files.vehicleId, n: sql<number>`count(*)::int`.as('n') })
    .from(files)
    .where(eq(files.kind, 'photo'))
    .groupBy(files.vehicleId)
    .as('photo_count')
  return db
    .select({
      id: vehicles.id,
      stockNumber: vehicles.stockNumber,
      year: vehicles.year,
      make: vehicles.make,
      model: vehicles.model,
      colour: vehicles.colour,
      plate: vehicles.plate,
      plateState: vehicles.plateState,
      state: vehicles.state,
      version: vehicles.version,
      arrivedAt: vehicles.arrivedAt,
      closedAt: vehicles.closedAt,
      vehicleClass: vehicles.vehicleClass,
      estimatedValueCents: vehicles.estimatedValueCents,
      ruleSetVersionId: vehicles.ruleSetVersionId,
      rolls: vehicles.rolls,
      spaceRow: yardSpaces.row,
      spaceNumber: yardSpaces.number,
      photoCount: sql<number>`coalesce(${photoCount.n}, 0)`,
    })
    .from(vehicles)
    .leftJoin(yardSpaces, eq(yardSpaces.id, vehicles.spaceId))
    .leftJoin(photoCount, eq(photoCount.vehicleId, vehicles.id))
    .where(and(eq(vehicles.yardId, yardId), ne(vehicles.state, 'closed')))
    .orderBy(asc(vehicles.arrivedAt))
}

export function activeHolds(db: Executor, yardId: string) {
  return db
    .select({ vehicleId: holds.vehicleId, kind: holds.kind, until: holds.until })
    .from(holds)
    .innerJoin(vehicles, eq(vehicles.id, holds.vehicleId))
    .where(and(eq(vehicles.yardId, yardId), ne(vehicles.state, 'closed'), isNull(holds.liftedAt)))
}
