import { and, eq } from 'drizzle-orm'
import type { Database } from '@db/client'
import { historyOf } from '@db/history'
import * as t from '@db/schema'
import { loadSampleRuleSets } from '../../server/rule-sets/index'
import type { HoldKind } from '@shared/domain/lifecycle'

const samples = new WeakMap<Database, Promise<Map<string, string>>>()

/** The shipped sample rule sets, loaded once per test database: slug → version id. */
export function sampleRuleSets(db: Database): Promise<Map<string, string>> {
  let loaded = samples.get(db)
  // Read back by slug: another helper may have loaded the samples into this database first.
  if (!loaded) {
    loaded = loadSampleRuleSets(db).then(async () => {
      const rows = await db.select({ slug: t.ruleSets.slug, id: t.ruleSetVersions.id }).from(t.ruleSetVersions).innerJoin(t.ruleSets, eq(t.ruleSets.id, t.ruleSetVersions.ruleSetId)).where(and(eq(t.ruleSets.sample, 'sample'), eq(t.ruleSetVersions.version, 1)))
      return new Map(rows.map((r) => [r.slug, r.id]))
    })
    samples.set(db, loaded)
  }
  return loaded
}

/** The version id of a sample rule set, e.g. "florida-sample", to bill a test vehicle by. */
export async function sampleVersion(db: Database, slug: string): Promise<string> {
  const id = (await sampleRuleSets(db)).get(slug)
  if (!id) throw new Error(`no sample rule set ${slug}`)
  return id
}

export async function setHold(db: Database, vehicleId: string, kind: HoldKind, more: Partial<typeof t.holds.$inferInsert> = {}) {
  const [hold] = await db.insert(t.holds).values({ vehicleId, kind, ...more }).returning()
  return hold!
}

export async function vehicleRow(db: Database, id: string) {
  const [row] = await db.select().from(t.vehicles).where(eq(t.vehicles.id, id))
  return row!
}

export const historyCount = async (db: Database, id: string) => (await historyOf(db, id)).length

export const DAY = 24 * 3_600_000
