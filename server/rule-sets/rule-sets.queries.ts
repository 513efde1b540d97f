import { desc, eq, inArray, isNull, or } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { ruleSets, ruleSetVersions } from '@db/schema'
import { ruleSetSchema, type RuleSet } from '@shared/schemas/rule-sets'

// Versions never change once written, so a parsed version can be kept for the life of the process.
const parsedVersions = new Map<string, RuleSet>()

function parse(versionId: string, body: unknown): RuleSet {
  let parsed = parsedVersions.get(versionId)
  if (!parsed) {
    parsed = ruleSetSchema.parse(body)
    parsedVersions.set(versionId, parsed)
  }
  return parsed
}

export interface RuleSetVersion {
  versionId: string
  version: number
  ruleSetId: string
  slug: string
  ruleSet: RuleSet
}

/** The rule sets a company may use: the shipped samples and its own, each at its latest version. */
export async function latestRuleSets(db: Executor, companyId: string): Promise<RuleSetVersion[]> {
  const rows = await db
    .selectDistinctOn([ruleSets.id], { versionId: ruleSetVersions.id, version: ruleSetVersions.version, ruleSetId: ruleSets.id, slug: ruleSets.slug })
    .from(ruleSets)
    .innerJoin(ruleSetVersions, eq(ruleSetVersions.ruleSetId, ruleSets.id))
    .where(or(isNull(ruleSets.companyId), eq(ruleSets.companyId, companyId)))
    .orderBy(ruleSets.id, desc(ruleSetVersions.version))
  const bodies = await versionsById(db, rows.map((r) => r.versionId))
  return rows.flatMap((r) => withBody(r, bodies)).sort((a, b) => a.ruleSet.name.localeCompare(b.ruleSet.name))
}

export async function latestRuleSetBySlug(db: Executor, companyId: string, slug: string): Promise<RuleSetVersion | undefined> {
  return (await latestRuleSets(db, companyId)).find((r) => r.slug === slug)
}

export async function latestVersionOf(db: Executor, ruleSetId: string): Promise<RuleSetVersion | undefined> {
  const [row] = await db
    .select({ versionId: ruleSetVersions.id, version: ruleSetVersions.version, ruleSetId: ruleSets.id, slug: ruleSets.slug })
    .from(ruleSetVersions)
    .innerJoin(ruleSets, eq(ruleSets.id, ruleSetVersions.ruleSetId))
    .where(eq(ruleSets.id, ruleSetId))
    .orderBy(desc(ruleSetVersions.version))
    .limit(1)
  return row && withBody(row, await versionsById(db, [row.versionId]))[0]
}

// The latest versions are found without their bodies (a rule set's JSON is large and a version never
// changes): only a version this process has not parsed yet is read whole, by versionsById.
const withBody = (row: Omit<RuleSetVersion, 'ruleSet'>, bodies: Map<string, RuleSet>): RuleSetVersion[] => {
  const ruleSet = bodies.get(row.versionId)
  return ruleSet ? [{ ...row, ruleSet }] : []
}

/** Parsed bodies of the given versions (the ones vehicles arrived under). */
export async function versionsById(db: Executor, ids: string[]): Promise<Map<string, RuleSet>> {
  const found = new Map<string, RuleSet>()
  const missing = ids.filter((id) => {
    const known = parsedVersions.get(id)
    if (known) found.set(id, known)
    return !known
  })
  if (missing.length === 0) return found
  const rows = await db.select({ id: ruleSetVersions.id, body: ruleSetVersions.body }).from(ruleSetVersions).where(inArray(ruleSetVersions.id, [...new Set(missing)]))
  for (const row of rows) found.set(row.id, parse(row.id, row.body))
  return found
}
