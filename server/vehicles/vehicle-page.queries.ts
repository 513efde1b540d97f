import { asc, eq } from 'drizzle-orm'
import { alias } from 'drizzle-orm/pg-core'
import type { Executor } from '@db/client'
import { historyOf } from '@db/history'
import { holds, propertyItems, ruleSetVersions, tows, users, yardSpaces } from '@db/schema'
import type { HistoryEvent } from '@shared/schemas/history'
import type { HoldRecord } from '@shared/schemas/holds'
import type { TowRecord } from '@shared/schemas/vehicle-page'
import { spaceLabel } from '@shared/schemas/spaces'
import type { TowLine } from '@shared/domain/tow'

const iso = (d: Date | null) => d?.toISOString() ?? null

export async function towOf(db: Executor, vehicleId: string): Promise<TowRecord | null> {
  const [t] = await db.select().from(tows).where(eq(tows.vehicleId, vehicleId))
  if (!t) return null
  const { id: _id, vehicleId: _v, createdAt: _c, ...rest } = t
  return { ...rest, calledAt: iso(t.calledAt), hookedAt: iso(t.hookedAt), arrivedAt: t.arrivedAt.toISOString(), chargeLines: t.chargeLines as TowLine[] }
}

export async function holdsOf(db: Executor, vehicleId: string): Promise<HoldRecord[]> {
  const setter = alias(users, 'setter')
  const lifter = alias(users, 'lifter')
  const rows = await db
    .select({ hold: holds, setBy: setter.name, liftedBy: lifter.name })
    .from(holds)
    .leftJoin(setter, eq(setter.id, holds.setById))
    .leftJoin(lifter, eq(lifter.id, holds.liftedById))
    .where(eq(holds.vehicleId, vehicleId))
    .orderBy(asc(holds.setAt))
  return rows.map(({ hold: h, setBy, liftedBy }) => ({
    id: h.id,
    kind: h.kind,
    agency: h.agency,
    caseNumber: h.caseNumber,
    until: iso(h.until),
    note: h.note,
    setBy,
    setAt: h.setAt.toISOString(),
    liftedBy,
    liftedAt: iso(h.liftedAt),
    liftReason: h.liftReason,
  }))
}

export const propertyOf = (db: Executor, vehicleId: string) =>
  db
    .select({ id: propertyItems.id, item: propertyItems.item, location: propertyItems.location, count: propertyItems.count })
    .from(propertyItems)
    .where(eq(propertyItems.vehicleId, vehicleId))
    .orderBy(asc(propertyItems.createdAt), asc(propertyItems.item))

export async function historyEvents(db: Executor, vehicleId: string): Promise<HistoryEvent[]> {
  return (await historyOf(db, vehicleId)).map((e) => ({
    seq: e.seq,
    at: e.at.toISOString(),
    actor: e.actorLabel,
    kind: e.kind,
    fromState: e.fromState,
    toState: e.toState,
    reason: e.reason,
    before: e.before,
    after: e.after,
    hash: e.hash,
  }))
}

export async function nameOf(db: Executor, userId: string | null) {
  if (!userId) return null
  const [u] = await db.select({ id: users.id, name: users.name }).from(users).where(eq(users.id, userId))
  return u ?? null
}

export async function spaceOf(db: Executor, spaceId: string | null) {
  if (!spaceId) return null
  const [s] = await db.select().from(yardSpaces).where(eq(yardSpaces.id, spaceId))
  return s ? { id: s.id, label: spaceLabel(s) } : null
}

export async function versionNumber(db: Executor, versionId: string | null) {
  if (!versionId) return null
  const [v] = await db.select({ version: ruleSetVersions.version }).from(ruleSetVersions).where(eq(ruleSetVersions.id, versionId))
  return v?.version ?? null
}
