import { and, asc, eq, inArray, isNull, ne, sql, type SQL } from 'drizzle-orm'
import type { Executor } from '../../db/client'
import { files, holds, tows, vehicles, yardSpaces } from '../../db/schema/index'

const photoCount = sql<number>`(select count(*)::int from ${files} where ${files.vehicleId} = ${vehicles.id} and ${files.kind} = 'photo')`

/** The columns behind shared/schemas/board.ts vehicleIdentityShape. */
export const identityColumns = {
  id: vehicles.id,
  stockNumber: vehicles.stockNumber,
  year: vehicles.year,
  make: vehicles.make,
  model: vehicles.model,
  colour: vehicles.colour,
  plate: vehicles.plate,
  plateState: vehicles.plateState,
}

/** Everything a board card shows of the vehicles matching `where`, oldest arrival first. */
export function cardRows(db: Executor, where: SQL | undefined) {
  return db
    .select({
      ...identityColumns,
      state: vehicles.state,
      disposition: vehicles.disposition,
      version: vehicles.version,
      arrivedAt: vehicles.arrivedAt,
      closedAt: vehicles.closedAt,
      vehicleClass: vehicles.vehicleClass,
      estimatedValueCents: vehicles.estimatedValueCents,
      ruleSetVersionId: vehicles.ruleSetVersionId,
      rolls: vehicles.rolls,
      steers: vehicles.steers,
      brakes: vehicles.brakes,
      keys: vehicles.keys,
      inspectedAt: vehicles.inspectedAt,
      towReason: tows.reason,
      spaceRow: yardSpaces.row,
      spaceNumber: yardSpaces.number,
      photoCount,
    })
    .from(vehicles)
    .leftJoin(tows, eq(tows.vehicleId, vehicles.id))
    .leftJoin(yardSpaces, eq(yardSpaces.id, vehicles.spaceId))
    .where(where)
    .orderBy(asc(vehicles.arrivedAt), asc(vehicles.stockNumber))
}
export type CardRow = Awaited<ReturnType<typeof cardRows>>[number]

export const activeInYard = (yardId: string) => and(eq(vehicles.yardId, yardId), ne(vehicles.state, 'closed'))
export const oneInYard = (yardId: string, vehicleId: string) => and(eq(vehicles.yardId, yardId), eq(vehicles.id, vehicleId))

/** Holds not yet lifted, on the given vehicles or (without ids) on every active vehicle of the yard. */
export function activeHolds(db: Executor, yardId: string, vehicleIds?: string[]) {
  return db
    .select({ vehicleId: holds.vehicleId, kind: holds.kind, agency: holds.agency, caseNumber: holds.caseNumber, until: holds.until })
    .from(holds)
    .innerJoin(vehicles, eq(vehicles.id, holds.vehicleId))
    .where(
      and(
        eq(vehicles.yardId, yardId),
        vehicleIds ? inArray(holds.vehicleId, vehicleIds) : ne(vehicles.state, 'closed'),
        isNull(holds.liftedAt),
      ),
    )
    .orderBy(asc(holds.setAt))
}

export async function yardOfVehicle(db: Executor, vehicleId: string): Promise<string | undefined> {
  const [row] = await db.select({ yardId: vehicles.yardId }).from(vehicles).where(eq(vehicles.id, vehicleId))
  return row?.yardId
}
