import { eq, sql } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { vehicles } from '@db/schema'
import { conflict } from '../errors'
import { vehicleForUser, type VehicleRow } from '../vehicles/index'
import { latestInspection, type InspectionRow } from './inspections.queries'

export interface Locked {
  vehicle: VehicleRow
  yard: Awaited<ReturnType<typeof vehicleForUser>>['yard']
  inspection: InspectionRow
}

/**
 * The vehicle (locked for the change) and its latest inspection. `open` is for findings and the
 * estimate, which change only while the inspection is under way in Teardown; values and the
 * pickup marks may still be set after it is finished, until the vehicle leaves the yard.
 */
export async function lockInspection(tx: Executor, userId: string, vehicleId: string, need: 'open' | 'any'): Promise<Locked> {
  const { vehicle, yard } = await vehicleForUser(tx, userId, vehicleId, true)
  if (vehicle.state === 'closed') throw conflict(`${vehicle.stockNumber} has left the yard; its inspection can no longer change.`)
  const inspection = await latestInspection(tx, vehicleId)
  if (!inspection) throw conflict(`No inspection has been started on ${vehicle.stockNumber}. Start the inspection first.`)
  if (need === 'open' && inspection.finishedAt) {
    throw conflict('This inspection is finished. To change findings or the estimate, move the vehicle back to Teardown and start a re-inspection.')
  }
  if (need === 'open' && vehicle.state !== 'teardown') {
    throw conflict(`${vehicle.stockNumber} is not in Teardown; findings and the estimate are written there.`)
  }
  return { vehicle, yard, inspection }
}

/** Vehicle fields the inspection sets, with the version bumped so a board move made against the old card is refused. */
export async function updateVehicle(tx: Executor, vehicleId: string, changes: Partial<typeof vehicles.$inferInsert>) {
  await tx
    .update(vehicles)
    .set({ ...changes, version: sql`${vehicles.version} + 1`, updatedAt: new Date() })
    .where(eq(vehicles.id, vehicleId))
}

export const actorOf = (user: { id: string; name: string }) => ({ actorId: user.id, actorLabel: user.name })
