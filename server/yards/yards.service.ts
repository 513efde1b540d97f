import { eq } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { ruleSets, yards } from '@db/schema'
import { loadSampleRuleSets } from '../rule-sets/index'
import type { YardSetup } from '@shared/schemas/yards'
import { AppError, conflict } from '../errors'

/** A company's yard, under one of the rule sets (the shipped samples are loaded on first use). */
export async function createYard(db: Executor, companyId: string, input: YardSetup, ruleSetsFolder?: string) {
  const [taken] = await db.select({ id: yards.id }).from(yards).where(eq(yards.code, input.code))
  if (taken) throw conflict(`The yard code ${input.code} is already used: stock numbers must not repeat.`)
  let [set] = await db.select({ id: ruleSets.id }).from(ruleSets).where(eq(ruleSets.slug, input.ruleSet))
  if (!set) {
    await loadSampleRuleSets(db, ruleSetsFolder)
    ;[set] = await db.select({ id: ruleSets.id }).from(ruleSets).where(eq(ruleSets.slug, input.ruleSet))
  }
  if (!set) throw new AppError(400, `There is no rule set "${input.ruleSet}".`)
  const { ruleSet: _slug, ...yard } = input
  const [row] = await db.insert(yards).values({ ...yard, companyId, ruleSetId: set.id }).returning()
  return row!
}
