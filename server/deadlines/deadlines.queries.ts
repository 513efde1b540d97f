import { and, eq, inArray } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { tows, vehicles } from '@db/schema'
import { BOARD_COLUMNS } from '@shared/domain/lifecycle'

/** What the Deadlines page needs of every vehicle on the yard's board: who it is and what its clocks read. */
export function activeVehicles(db: Executor, yardId: string) {
  return db
    .select({
      id: vehicles.id,
      stockNumber: vehicles.stockNumber,
      year: vehicles.year,
      make: vehicles.make,
      model: vehicles.model,
      plate: vehicles.plate,
      arrivedAt: vehicles.arrivedAt,
      closedAt: vehicles.closedAt,
      vehicleClass: vehicles.vehicleClass,
      estimatedValueCents: vehicles.estimatedValueCents,
      ruleSetVersionId: vehicles.ruleSetVersionId,
      ownerChoice: vehicles.ownerChoice,
      towReason: tows.reason,
    })
    .from(vehicles)
    .leftJoin(tows, eq(tows.vehicleId, vehicles.id))
    // The columns by name, as the board reads them: the (yard, state) index skips the closed thousands.
    .where(and(eq(vehicles.yardId, yardId), inArray(vehicles.state, [...BOARD_COLUMNS])))
}
export type ActiveVehicle = Awaited<ReturnType<typeof activeVehicles>>[number]
