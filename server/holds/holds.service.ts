import { and, eq } from 'drizzle-orm'
import { holds } from '@db/schema'
import type { Hold, LiftHold } from '@shared/schemas/holds'
import type { User } from '@shared/schemas/users'
import { conflict, notFound, said } from '../errors'
import { changeVehicle, type VehicleChanges } from '../vehicles/index'

/**
 * Holds are added and lifted, never edited or removed: a lifted hold keeps who lifted it and why.
 * Each change bumps the vehicle's version, so a board move made against the old state is refused.
 */
export async function setHold(changes: VehicleChanges, actor: User, vehicleId: string, input: Hold) {
  const { result } = await changeVehicle(changes, actor, vehicleId, async ({ tx, vehicle, now, record }) => {
    if (vehicle.state === 'closed') throw conflict('This vehicle has left the yard; a hold can no longer be set.', said('closedHold'))
    const [row] = await tx
      .insert(holds)
      .values({ vehicleId, ...input, until: input.until ? new Date(input.until) : null, setById: actor.id, setAt: now })
      .returning({ id: holds.id })
    record({ kind: 'hold_set', after: { holdId: row!.id, kind: input.kind, agency: input.agency, caseNumber: input.caseNumber, until: input.until, note: input.note } })
    return row!.id
  })
  return result
}

export async function liftHold(changes: VehicleChanges, actor: User, vehicleId: string, holdId: string, input: LiftHold) {
  await changeVehicle(changes, actor, vehicleId, async ({ tx, now, record }) => {
    const [hold] = await tx.select().from(holds).where(and(eq(holds.id, holdId), eq(holds.vehicleId, vehicleId)))
    if (!hold) throw notFound('That hold')
    if (hold.liftedAt) throw conflict(`This hold was already lifted on ${hold.liftedAt.toISOString().slice(0, 10)}.`, said('holdLifted', { date: hold.liftedAt.toISOString().slice(0, 10) }))
    await tx.update(holds).set({ liftedAt: now, liftedById: actor.id, liftReason: input.reason }).where(eq(holds.id, holdId))
    record({ kind: 'hold_lifted', reason: input.reason, before: { holdId, kind: hold.kind, agency: hold.agency, caseNumber: hold.caseNumber } })
  })
}
