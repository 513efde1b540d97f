import { and, asc, eq, inArray, isNull, sql, type SQL } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { chargeAdjustments, files, holds, payments, releases, titleTransfers, tows, vehicles, yardSpaces } from '@db/schema'
import { BOARD_COLUMNS } from '@shared/domain/lifecycle'
import { handoverColumns } from './handover.queries'


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

/**
 * Everything a board card shows of the vehicles matching `where`, in no particular order (the
 * board sorts each column). Photos are counted in one grouped pass rather than once per vehicle;
 * the money paid and credited and the release's and transfer's facts come in the same statement,
 * so a card after a change costs one round trip for all of them (the embedded database answers one
 * query at a time).
 */
export function cardRows(db: Executor, where: SQL | undefined) {
  const photos = db
    .select({ vehicleId: files.vehicleId, n: sql<number>`count(*)::int`.as('n') })
    .from(files)
    .where(eq(files.kind, 'photo'))
    .groupBy(files.vehicleId)
    .as('photos')
  return db
    .select({
      ...identityColumns,
      state: vehicles.state,
      disposition: vehicles.disposition,
      vin: vehicles.vin,
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
      ownerChoice: vehicles.ownerChoice,
      ownerChoiceAt: vehicles.ownerChoiceAt,
      towReason: tows.reason,
      towCents: sql<number>`coalesce(${tows.chargeCents}, 0)`,
      spaceRow: yardSpaces.row,
      spaceNumber: yardSpaces.number,
      photoCount: sql<number>`coalesce(${photos.n}, 0)`,
      // Payments less refunds, and approved waivers and discounts (as moneyTotals counts them).
      paidCents: sql<number>`(select coalesce(sum(case when ${payments.kind} = 'payment' then ${payments.amountCents} else -${payments.amountCents} end), 0)::int from ${payments} where ${payments.vehicleId} = ${vehicles.id})`,
      creditedCents: sql<number>`(select coalesce(sum(${chargeAdjustments.amountCents}), 0)::int from ${chargeAdjustments} where ${chargeAdjustments.vehicleId} = ${vehicles.id} and ${chargeAdjustments.status} = 'approved')`,
      ...handoverColumns,
    })
    .from(vehicles)
    .leftJoin(tows, eq(tows.vehicleId, vehicles.id))
    .leftJoin(yardSpaces, eq(yardSpaces.id, vehicles.spaceId))
    .leftJoin(photos, eq(photos.vehicleId, vehicles.id))
    .leftJoin(releases, eq(releases.vehicleId, vehicles.id))
    .leftJoin(titleTransfers, eq(titleTransfers.vehicleId, vehicles.id))
    .where(where)
}
export type CardRow = Awaited<ReturnType<typeof cardRows>>[number]

// The columns by name, not "not closed": the (yard, state) index then skips the closed thousands.
export const activeInYard = (yardId: string) => and(eq(vehicles.yardId, yardId), inArray(vehicles.state, [...BOARD_COLUMNS]))
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
        vehicleIds ? inArray(holds.vehicleId, vehicleIds) : inArray(vehicles.state, [...BOARD_COLUMNS]),
        isNull(holds.liftedAt),
      ),
    )
    .orderBy(asc(holds.setAt))
}
export type HoldRow = Awaited<ReturnType<typeof activeHolds>>[number]
