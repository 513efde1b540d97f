import { and, eq } from 'drizzle-orm'
import type { Database } from '@db/client'
import { appendHistory } from '@db/history'
import { holds } from '@db/schema'
import type { Hold, LiftHold } from '@shared/schemas/holds'
import type { User } from '@shared/schemas/users'
import { conflict, notFound } from '../errors'
import { boardChanged } from '../live/index'
import { bumpVersion, vehicleForUser } from '../vehicles/index'

/**
 * Holds are added and lifted, never edited or removed: a lifted hold keeps who lifted it and why.
 * Each change bumps the vehicle's version, so a board move made against the old state is refused.
 */
export async function setHold(db: Database, actor: User, vehicleId: string, input: Hold) {
  const holdId = await db.transaction(async (tx) => {
    const { vehicle } = await vehicleForUser(tx, actor.id, vehicleId, true)
    if (vehicle.state === 'closed') throw conflict('This vehicle has left the yard; a hold can no longer be set.')
    const [row] = await tx
      .insert(holds)
      .values({ vehicleId, ...input, until: input.until ? new Date(input.until) : null, setById: actor.id })
      .returning({ id: holds.id })
    await bumpVersion(tx, vehicleId, vehicle.version)
    await appendHistory(tx, {
      vehicleId,
      actorId: actor.id,
      actorLabel: actor.name,
      kind: 'hold_set',
      after: { holdId: row!.id, kind: input.kind, agency: input.agency, caseNumber: input.caseNumber, until: input.until, note: input.note },
    })
    return row!.id
  })
  await boardChanged(db, { vehicleId, cause: 'hold_set' })
  return holdId
}

export async function liftHold(db: Database, actor: User, vehicleId: string, holdId: string, input: LiftHold) {
  await db.transaction(async (tx) => {
    const { vehicle } = await vehicleForUser(tx, actor.id, vehicleId, true)
    const [hold] = await tx.select().from(holds).where(and(eq(holds.id, holdId), eq(holds.vehicleId, vehicleId)))
    if (!hold) throw notFound('That hold')
    if (hold.liftedAt) throw conflict(`This hold was already lifted on ${hold.liftedAt.toISOString().slice(0, 10)}.`)
    await tx.update(holds).set({ liftedAt: new Date(), liftedById: actor.id, liftReason: input.reason }).where(eq(holds.id, holdId))
    await bumpVersion(tx, vehicleId, vehicle.version)
    await appendHistory(tx, {
      vehicleId,
      actorId: actor.id,
      actorLabel: actor.name,
      kind: 'hold_lifted',
      reason: input.reason,
      before: { holdId, kind: hold.kind, agency: hold.agency, caseNumber: hold.caseNumber },
    })
  })
  await boardChanged(db, { vehicleId, cause: 'hold_lifted' })
}
