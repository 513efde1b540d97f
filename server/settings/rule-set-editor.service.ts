import { randomBytes } from 'node:crypto'
import { and, desc, eq, isNull, or } from 'drizzle-orm'
import type { Database, Executor } from '@db/client'
import { ruleSets, ruleSetVersions, yards } from '@db/schema'
import { ruleSetSchema, type RuleSet } from '@shared/schemas/rule-sets'
import type { CopyRuleSet, RuleSetDetail, RuleSetSummary, SaveRuleSet } from '@shared/schemas/rule-set-editor'
import { ruleSetEditSchema } from '@shared/schemas/rule-set-editor'
import type { User } from '@shared/schemas/users'
import { conflict, fieldIssue, forbidden, notFound, unprocessable, said } from '../errors'
import { latestRuleSets, type RuleSetVersion } from '../rule-sets/index'
import { changedValues, itemNames, recordSettingsChange } from '../settings-audit/index'
import { companyOf } from '../users/index'
import { assertKnownCalendars } from './rule-set-calendars'
import { yardOfUser } from '../yards/index'
import { ruleSetTitle } from '@shared/messages/rule-words'

/** The rule sets a manager sees in Settings: the samples and the company's own, marked editable and in use. */
export async function ruleSetsForSettings(db: Database, actor: User): Promise<RuleSetSummary[]> {
  const companyId = await companyOf(db, actor.id)
  const [sets, owned, yard] = await Promise.all([latestRuleSets(db, companyId), ownedIds(db, companyId), yardOfUser(db, actor.id)])
  return sets.map(({ slug, version, ruleSetId, ruleSet }) => ({
    id: slug,
    version,
    ...ruleSetTitle(ruleSet),
    jurisdiction: ruleSet.jurisdiction,
    sample: ruleSet.sample,
    own: owned.has(ruleSetId),
    inUse: yard?.ruleSetId === ruleSetId,
  }))
}

export async function ruleSetForSettings(db: Database, actor: User, slug: string): Promise<RuleSetDetail> {
  const companyId = await companyOf(db, actor.id)
  const found = await visible(db, companyId, slug)
  const yard = await yardOfUser(db, actor.id)
  return { id: found.slug, version: found.version, own: (await ownedIds(db, companyId)).has(found.ruleSetId), inUse: yard?.ruleSetId === found.ruleSetId, ruleSet: found.ruleSet }
}

/** A copy of a sample (or of the company's own rule set) that the company owns and may edit, as its version 1. */
export async function copyRuleSet(db: Database, actor: User, slug: string, input: CopyRuleSet): Promise<RuleSetDetail> {
  const companyId = await companyOf(db, actor.id)
  const source = await visible(db, companyId, slug)
  const newSlug = `${slugOf(input.name)}-${randomBytes(3).toString('hex')}`
  const body: RuleSet = { ...structuredClone(source.ruleSet), id: newSlug, name: input.name, sample: false }
  // The copy has a name of its own: the Spanish of the name it was copied from no longer names it.
  if (body.es) delete body.es.name
  return db.transaction(async (tx) => {
    const [set] = await tx.insert(ruleSets).values({ companyId, slug: newSlug, name: input.name, sample: 'local' }).returning({ id: ruleSets.id })
    await tx.insert(ruleSetVersions).values({ ruleSetId: set!.id, version: 1, body, createdById: actor.id })
    await recordSettingsChange(tx, {
      companyId,
      actorId: actor.id,
      area: 'rule-set',
      action: 'copied',
      subjectId: newSlug,
      subjectLabel: input.name,
      before: { copiedFrom: `${source.ruleSet.name} (version ${source.version})` },
      after: { name: input.name, version: 1 },
    })
    return { id: newSlug, version: 1, own: true, inUse: false, ruleSet: body }
  })
}

/**
 * Saves an edit as the next version: vehicles already on the lot keep the version they arrived under,
 * new tow-ins at a yard using this rule set take the new one. Refused for a sample (copy it first), for a
 * version other than the one the manager started from, and when nothing changed.
 */
export async function saveRuleSet(db: Database, actor: User, slug: string, input: SaveRuleSet): Promise<RuleSetDetail> {
  const companyId = await companyOf(db, actor.id)
  const ruleSet = ruleSetEditSchema.parse({ ...input.ruleSet, id: slug })
  assertKnownCalendars(ruleSet)
  return db.transaction(async (tx) => {
    const [set] = await tx
      .select({ id: ruleSets.id, companyId: ruleSets.companyId })
      .from(ruleSets)
      .where(and(eq(ruleSets.slug, slug), or(isNull(ruleSets.companyId), eq(ruleSets.companyId, companyId))))
      .for('update')
    if (!set) throw notFound('That rule set')
    if (set.companyId === null) throw forbidden('A sample cannot be changed: copy it, then edit the copy.', 'sampleLocked')
    const [latest] = await tx.select().from(ruleSetVersions).where(eq(ruleSetVersions.ruleSetId, set.id)).orderBy(desc(ruleSetVersions.version)).limit(1)
    if (latest!.version !== input.version) {
      throw conflict(`Someone saved version ${latest!.version} of this rule set after you opened it. Reload it, then make your change again.`, said('ruleSetStale', { version: latest!.version }, { version: latest!.version }))
    }
    const before = ruleSetSchema.parse(latest!.body)
    const diff = changedValues(before, ruleSet)
    if (Object.keys(diff.after).length === 0 && Object.keys(diff.before).length === 0) throw unprocessable('Nothing was changed: this version already says that.', said('nothingChanged'))
    const version = latest!.version + 1
    await tx.insert(ruleSetVersions).values({ ruleSetId: set.id, version, body: ruleSet, createdById: actor.id })
    await tx.update(ruleSets).set({ name: ruleSet.name }).where(eq(ruleSets.id, set.id))
    await recordSettingsChange(tx, {
      companyId,
      actorId: actor.id,
      area: 'rule-set',
      action: 'saved',
      subjectId: slug,
      subjectLabel: `${ruleSet.name} (version ${version})`,
      ...diff,
      names: itemNames(before, ruleSet, [...Object.keys(diff.before), ...Object.keys(diff.after)]),
      reason: input.reason ?? null,
    })
    const [yard] = await tx.select({ ruleSetId: yards.ruleSetId }).from(yards).where(eq(yards.companyId, companyId)).limit(1)
    return { id: slug, version, own: true, inUse: yard?.ruleSetId === set.id, ruleSet }
  })
}

/** Points the manager's yard at a rule set: new tow-ins take its current version from now on. */
export async function chooseYardRuleSet(db: Database, actor: User, input: { ruleSetId: string; reason: string | null }): Promise<RuleSetSummary[]> {
  const companyId = await companyOf(db, actor.id)
  const yard = await yardOfUser(db, actor.id)
  if (!yard) throw notFound('A yard for your company')
  const chosen = await visible(db, companyId, input.ruleSetId, 'ruleSetId')
  if (yard.ruleSetId === chosen.ruleSetId) throw unprocessable(`The yard already uses ${chosen.ruleSet.name}.`, said('yardUsesRuleSet', { name: chosen.ruleSet.name }))
  const previous = yard.ruleSetId ? (await latestRuleSets(db, companyId)).find((r) => r.ruleSetId === yard.ruleSetId) : undefined
  await db.transaction(async (tx) => {
    await tx.update(yards).set({ ruleSetId: chosen.ruleSetId }).where(eq(yards.id, yard.id))
    await recordSettingsChange(tx, {
      companyId,
      actorId: actor.id,
      area: 'yard',
      action: 'rule-set-chosen',
      subjectId: yard.id,
      subjectLabel: yard.name,
      before: { ruleSet: previous ? previous.ruleSet.name : null },
      after: { ruleSet: chosen.ruleSet.name, version: chosen.version },
      reason: input.reason,
    })
  })
  return ruleSetsForSettings(db, actor)
}

async function visible(db: Executor, companyId: string, slug: string, field?: string): Promise<RuleSetVersion> {
  const found = (await latestRuleSets(db, companyId)).find((r) => r.slug === slug)
  if (!found) {
    if (field) throw unprocessable('There is no such rule set.', said('noSuchRuleSet', undefined, { issues: [fieldIssue(field, 'ruleSetEditor.chooseListed', 'Choose one of the rule sets listed.')] }))
    throw notFound('That rule set')
  }
  return found
}

async function ownedIds(db: Executor, companyId: string): Promise<Set<string>> {
  const rows = await db.select({ id: ruleSets.id }).from(ruleSets).where(eq(ruleSets.companyId, companyId))
  return new Set(rows.map((r) => r.id))
}

function slugOf(name: string): string {
  const words = name
    .normalize('NFKD')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 40)
    .replace(/-+$/, '')
  return words || 'rule-set'
}
