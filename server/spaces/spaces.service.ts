import type { Database } from '@db/client'
import { appendHistory } from '@db/history'
import type { AssignSpace } from '@shared/schemas/spaces'
import type { User } from '@shared/schemas/users'
import { conflict, unprocessable } from '../errors'
import { boardChanged } from '../live/index'
import { bumpVersion, spaceOf, vehicleForUser } from '../vehicles/index'
import { freeSpace, isSpaceConflict, spaceTaken } from './spaces.queries'

/** Puts a vehicle in a space (or takes it out of one); a space holds one vehicle at a time. */
export async function assignSpace(db: Database, actor: User, vehicleId: string, input: AssignSpace) {
  try {
    const assigned = await db.transaction(async (tx) => {
      const { vehicle, yard } = await vehicleForUser(tx, actor.id, vehicleId, true)
      if (input.version !== vehicle.version) {
        throw conflict('Someone else changed this vehicle after you opened it. Reload and choose the space again.', { version: vehicle.version })
      }
      if (vehicle.state === 'closed') throw conflict('This vehicle has left the yard and no longer takes a space.')
      if (input.spaceId === vehicle.spaceId) throw unprocessable('The vehicle is already in that space.')
      const from = await spaceOf(tx, vehicle.spaceId)
      const to = input.spaceId ? await freeSpace(tx, yard.id, input.spaceId, 'spaceId', vehicleId) : null
      const version = await bumpVersion(tx, vehicleId, vehicle.version, { spaceId: input.spaceId })
      await appendHistory(tx, {
        vehicleId,
        actorId: actor.id,
        actorLabel: actor.name,
        kind: 'space_assigned',
        before: { space: from?.label ?? null },
        after: { space: to },
      })
      return { version: version!, space: to }
    })
    await boardChanged(db, { vehicleId, cause: 'space_assigned' })
    return assigned
  } catch (err) {
    if (isSpaceConflict(err)) throw spaceTaken(null, 'spaceId')
    throw err
  }
}
