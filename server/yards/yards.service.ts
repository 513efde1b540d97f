import { and, eq, isNull, or } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { ruleSets, yards } from '@db/schema'
import { loadSampleRuleSets } from '../rule-sets/index'
import type { YardSetup } from '@shared/schemas/yards'
import { AppError, conflict, said } from '../errors'

/**
 * A company's yard, under one of the rule sets it may use — a shipped sample (loaded on first use) or
 * its own copy, never another company's.
 */
export async function createYard(db: Executor, companyId: string, input: YardSetup, ruleSetsFolder?: string) {
  const [taken] = await db.select({ id: yards.id }).from(yards).where(eq(yards.code, input.code))
  if (taken) throw conflict(`The yard code ${input.code} is already used: stock numbers must not repeat.`, said('yardCodeTaken', { code: input.code }))
  const usable = () =>
    db
      .select({ id: ruleSets.id })
      .from(ruleSets)
      .where(and(eq(ruleSets.slug, input.ruleSet), or(isNull(ruleSets.companyId), eq(ruleSets.companyId, companyId))))
  let [set] = await usable()
  if (!set) {
    await loadSampleRuleSets(db, ruleSetsFolder)
    ;[set] = await usable()
  }
  if (!set) throw new AppError(400, `There is no rule set "${input.ruleSet}".`, said('noRuleSetNamed', { name: input.ruleSet }))
  const { ruleSet: _slug, ...yard } = input
  const [row] = await db.insert(yards).values({ ...yard, companyId, ruleSetId: set.id }).returning()
  return row!
}
