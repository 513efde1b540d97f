import type { Executor } from '@db/client'
import type { User } from '@shared/schemas/users'
import { conflict, said } from '../errors'
import { changeVehicle, type VehicleChanges, type VehicleRow, type VehicleWork } from '../vehicles/index'
import { latestInspection, type InspectionRow } from './inspections.queries'

export interface InspectionWork extends VehicleWork {
  inspection: InspectionRow
}

/**
 * The vehicle's latest inspection, if it can take a change; otherwise a 409 saying why. `open` is
 * for findings and the estimate, which change only while the inspection is under way in Teardown;
 * values and the pickup marks may still be set after it is finished, until the vehicle leaves the yard.
 */
export async function inspectionFor(db: Executor, vehicle: VehicleRow, need: 'open' | 'any'): Promise<InspectionRow> {
  if (vehicle.state === 'closed') throw conflict(`${vehicle.stockNumber} has left the yard; its inspection can no longer change.`, said('closedInspection', { stock: vehicle.stockNumber }))
  const inspection = await latestInspection(db, vehicle.id)
  if (!inspection) throw conflict(`No inspection has been started on ${vehicle.stockNumber}. Start the inspection first.`, said('noInspection', { stock: vehicle.stockNumber }))
  if (need === 'open' && inspection.finishedAt) {
    throw conflict('This inspection is finished. To change findings or the estimate, move the vehicle back to Teardown and start a re-inspection.', said('inspectionFinished'))
  }
  if (need === 'open' && vehicle.state !== 'teardown') {
    throw conflict(`${vehicle.stockNumber} is not in Teardown; findings and the estimate are written there.`, said('notInTeardown', { stock: vehicle.stockNumber }))
  }
  return inspection
}

/** A change to the vehicle through its latest inspection: the vehicle's one unit of work, with the inspection checked under its lock. */
export function changeInspection<T>(changes: VehicleChanges, actor: User, vehicleId: string, need: 'open' | 'any', work: (w: InspectionWork) => Promise<T>) {
  return changeVehicle(changes, actor, vehicleId, async (w) => work({ ...w, inspection: await inspectionFor(w.tx, w.vehicle, need) }))
}
