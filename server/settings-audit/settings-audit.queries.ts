import { count, desc, eq } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { settingsChanges, users } from '@db/schema'
import type { SettingsAction, SettingsArea, SettingsChange } from '@shared/schemas/settings-audit'

export interface SettingsChangeEntry {
  companyId: string
  actorId: string | null
  area: SettingsArea
  action: SettingsAction
  subjectId: string
  subjectLabel: string
  before?: Record<string, unknown> | null
  after?: Record<string, unknown> | null
  /** The names of the list items the paths point into (`itemNames`). */
  names?: Record<string, string> | null
  reason?: string | null
}

/** Writes one audit row; call it with the transaction that makes the change, so both or neither are kept. */
export async function recordSettingsChange(db: Executor, entry: SettingsChangeEntry): Promise<void> {
  await db.insert(settingsChanges).values({ ...entry, before: entry.before ?? null, after: entry.after ?? null, names: entry.names ?? null, reason: entry.reason ?? null })
}

/** A company's settings changes, newest first. */
export async function listSettingsChanges(db: Executor, companyId: string, page: number, pageSize: number): Promise<{ changes: SettingsChange[]; total: number }> {
  const rows = await db
    .select({ change: settingsChanges, actor: users.name })
    .from(settingsChanges)
    .leftJoin(users, eq(users.id, settingsChanges.actorId))
    .where(eq(settingsChanges.companyId, companyId))
    .orderBy(desc(settingsChanges.at), desc(settingsChanges.id))
    .limit(pageSize)
    .offset((page - 1) * pageSize)
  const [total] = await db.select({ n: count() }).from(settingsChanges).where(eq(settingsChanges.companyId, companyId))
  return {
    total: total!.n,
    changes: rows.map(({ change: c, actor }) => ({
      id: c.id,
      at: c.at.toISOString(),
      actor,
      area: c.area as SettingsArea,
      action: c.action as SettingsAction,
      subjectId: c.subjectId,
      subjectLabel: c.subjectLabel,
      before: c.before,
      after: c.after,
      names: c.names ?? {},
      reason: c.reason,
    })),
  }
}
