import { and, desc, eq, isNull } from 'drizzle-orm'
import { alias } from 'drizzle-orm/pg-core'
import type { Executor } from '@db/client'
import { ownerDecisions, ownerLinks, users } from '@db/schema'
import type { OwnerDecisionRecord, OwnerLinkRecord } from '@shared/schemas/owner'

export type OwnerLinkRow = typeof ownerLinks.$inferSelect

/** The link whose token or code hashes to `hash`, whatever its state. */
export async function linkByHash(db: Executor, column: 'token' | 'code', hash: string): Promise<OwnerLinkRow | undefined> {
  const [row] = await db
    .select()
    .from(ownerLinks)
    .where(eq(column === 'token' ? ownerLinks.tokenHash : ownerLinks.codeHash, hash))
  return row
}

export function linkStatus(link: Pick<OwnerLinkRow, 'expiresAt' | 'revokedAt'>, now: Date): OwnerLinkRecord['status'] {
  if (link.revokedAt) return 'revoked'
  return link.expiresAt.getTime() <= now.getTime() ? 'expired' : 'active'
}

const revoker = alias(users, 'revoker')

/** Every link given out for a vehicle, newest first, with who made and who revoked it. */
export async function linksOf(db: Executor, vehicleId: string, now = new Date(), only?: string): Promise<OwnerLinkRecord[]> {
  const rows = await db
    .select({
      id: ownerLinks.id,
      createdAt: ownerLinks.createdAt,
      expiresAt: ownerLinks.expiresAt,
      revokedAt: ownerLinks.revokedAt,
      createdBy: users.name,
      revokedBy: revoker.name,
    })
    .from(ownerLinks)
    .innerJoin(users, eq(users.id, ownerLinks.createdById))
    .leftJoin(revoker, eq(revoker.id, ownerLinks.revokedById))
    .where(only ? and(eq(ownerLinks.vehicleId, vehicleId), eq(ownerLinks.id, only)) : eq(ownerLinks.vehicleId, vehicleId))
    .orderBy(desc(ownerLinks.createdAt))
  return rows.map(({ createdBy, revokedBy, ...link }) => ({
    id: link.id,
    createdAt: link.createdAt.toISOString(),
    createdBy,
    expiresAt: link.expiresAt.toISOString(),
    revokedAt: link.revokedAt?.toISOString() ?? null,
    revokedBy: revokedBy ?? null,
    status: linkStatus(link, now),
  }))
}

/** A link of this vehicle that is not revoked yet, locked for the change. */
export async function openLinkOf(db: Executor, vehicleId: string, linkId: string): Promise<OwnerLinkRow | undefined> {
  const [row] = await db
    .select()
    .from(ownerLinks)
    .where(and(eq(ownerLinks.id, linkId), eq(ownerLinks.vehicleId, vehicleId), isNull(ownerLinks.revokedAt)))
    .for('update')
  return row
}

/** Every choice the owner made, newest first. */
export async function decisionsOf(db: Executor, vehicleId: string, limit?: number): Promise<OwnerDecisionRecord[]> {
  const query = db.select().from(ownerDecisions).where(eq(ownerDecisions.vehicleId, vehicleId)).orderBy(desc(ownerDecisions.at), desc(ownerDecisions.id))
  const rows = limit ? await query.limit(limit) : await query
  return rows.map((d) => ({
    id: d.id,
    choice: d.choice,
    signOverTo: d.signOverTo,
    fullName: d.fullName,
    phone: d.phone,
    note: d.note,
    ip: d.ip,
    at: d.at.toISOString(),
  }))
}
