import { and, eq } from 'drizzle-orm'
import { ownerLinks } from '@db/schema'
import type { OwnerLinkCreated } from '@shared/schemas/owner'
import type { User } from '@shared/schemas/users'
import { conflict, notFound, said } from '../errors'
import { changeVehicle, type VehicleChanges, type VehicleWork } from '../vehicles/index'
import { keyHash, newCode, newToken } from './owner-keys'
import { linksOf, openLinkOf } from './owner.queries'

const DAY_MS = 86_400_000

/**
 * A new owner link for one vehicle: a random token and a short code, stored only as hashes and
 * answered once, here. Creating it is an event in the vehicle's history (its id and expiry, never the token).
 */
export async function createOwnerLink(changes: VehicleChanges, actor: User, vehicleId: string, days: number, now = new Date()): Promise<OwnerLinkCreated> {
  const token = newToken()
  const code = newCode()
  const expiresAt = new Date(now.getTime() + days * DAY_MS)
  const { result: id } = await changeVehicle(changes, actor, vehicleId, async (scope) => {
    if (scope.vehicle.state === 'closed') throw conflict('This vehicle has left the yard: its owner needs no link now.', said('closedOwnerLink'))
    return addOwnerLink(scope, { token, code, expiresAt, now })
  })
  const [link] = await linksOf(changes.db, vehicleId, now, id)
  return { link: link!, token, code, path: `/o/${token}` }
}

/**
 * Stores a new link's hashes inside a change to the vehicle already under way (a notice letter makes one
 * per recipient) and records its history event; the caller hands the token and code out, once.
 */
export async function addOwnerLink(
  { tx, vehicleId, actor, record }: Pick<VehicleWork, 'tx' | 'vehicleId' | 'actor' | 'record'>,
  link: { token: string; code: string; expiresAt: Date; now: Date },
): Promise<string> {
  const [row] = await tx
    .insert(ownerLinks)
    .values({ vehicleId, tokenHash: keyHash('owner-token', link.token), codeHash: keyHash('owner-code', link.code), createdById: actor.id, createdAt: link.now, expiresAt: link.expiresAt })
    .returning({ id: ownerLinks.id })
  record({ kind: 'owner_link_created', after: { linkId: row!.id, expiresAt: link.expiresAt.toISOString() } })
  return row!.id
}

/** The link stops opening the page at once. Revoking one already revoked changes nothing. */
export async function revokeOwnerLink(changes: VehicleChanges, actor: User, vehicleId: string, linkId: string): Promise<void> {
  await changeVehicle(changes, actor, vehicleId, async ({ tx, record }) => {
    const link = await openLinkOf(tx, vehicleId, linkId)
    if (!link) {
      const [any] = await tx.select({ id: ownerLinks.id }).from(ownerLinks).where(and(eq(ownerLinks.id, linkId), eq(ownerLinks.vehicleId, vehicleId)))
      if (!any) throw notFound('That owner link')
      return
    }
    const now = new Date()
    await tx.update(ownerLinks).set({ revokedAt: now, revokedById: actor.id }).where(eq(ownerLinks.id, linkId))
    record({ kind: 'owner_link_revoked', before: { linkId, expiresAt: link.expiresAt.toISOString() } })
  })
}
