import type { AssignSpace } from '@shared/schemas/spaces'
import type { User } from '@shared/schemas/users'
import { conflict, unprocessable, said } from '../errors'
import { changeVehicle, spaceOf, type VehicleChanges } from '../vehicles/index'
import { freeSpace, isSpaceConflict, spaceTaken } from './spaces.queries'

/** Puts a vehicle in a space (or takes it out of one); a space holds one vehicle at a time. */
export async function assignSpace(changes: VehicleChanges, actor: User, vehicleId: string, input: AssignSpace) {
  try {
    const { result: space, version } = await changeVehicle(
      changes,
      actor,
      vehicleId,
      async ({ tx, vehicle, yard, set, record }) => {
        if (vehicle.state === 'closed') throw conflict('This vehicle has left the yard and no longer takes a space.', said('closedSpace'))
        if (input.spaceId === vehicle.spaceId) throw unprocessable('The vehicle is already in that space.', said('alreadyInSpace'))
        const from = await spaceOf(tx, vehicle.spaceId)
        const to = input.spaceId ? await freeSpace(tx, yard.id, input.spaceId, 'spaceId', vehicleId, vehicle.vehicleClass) : null
        set({ spaceId: input.spaceId })
        record({ kind: 'space_assigned', before: { space: from?.label ?? null }, after: { space: to } })
        return to
      },
      {
        expectedVersion: input.version,
        stale: ({ vehicle }) => conflict('Someone else changed this vehicle after you opened it. Reload and choose the space again.', said('vehicleStale', undefined, { version: vehicle.version })),
      },
    )
    return { version, space }
  } catch (err) {
    if (isSpaceConflict(err)) throw spaceTaken(null, 'spaceId')
    throw err
  }
}
