import { and, asc, eq, inArray } from 'drizzle-orm'
import type { Database, Executor } from '@db/client'
import { userYards, users, vehicles, yardSpaces, yards } from '@db/schema'
import { spaceLabel } from '@shared/schemas/spaces'
import { towRatesSchema } from '@shared/schemas/tows'
import type { User } from '@shared/schemas/users'
import type { EditYard, SpaceBlock, YardSettings } from '@shared/schemas/yard-settings'
import type { NewYard } from '@shared/schemas/yard-settings'
import { conflict, fieldIssue, notFound } from '../errors'
import { changedValues, recordSettingsChange } from '../settings-audit/index'
import { latestRuleSets, sampleChoices } from '../rule-sets/index'
import { companyOf } from '../users/index'
import { createYard, yardsOfUser } from '../yards/index'

type YardRow = typeof yards.$inferSelect

const fields = (y: YardRow) => ({
  name: y.name,
  code: y.code,
  address: y.address,
  phone: y.phone,
  lat: y.lat,
  lng: y.lng,
  timeZone: y.timeZone,
  labourRateCents: y.labourRateCents,
  // The known rates only (the demo's rates carry a note); an edit saves these and nothing else.
  towRates: towRatesSchema.parse(y.towRates ?? {}),
})

/** The manager's yards (those they belong to) with every space, retired ones included. */
export async function yardsForSettings(db: Executor, actor: User): Promise<YardSettings[]> {
  const mine = await yardsOfUser(db, actor.id)
  if (mine.length === 0) return []
  const ids = mine.map((y) => y.id)
  const spaces = await db
    .select({ space: yardSpaces, occupant: vehicles.stockNumber })
    .from(yardSpaces)
    .leftJoin(vehicles, eq(vehicles.spaceId, yardSpaces.id))
    .where(inArray(yardSpaces.yardId, ids))
    .orderBy(asc(yardSpaces.row), asc(yardSpaces.number))
  const sets = await latestRuleSets(db, await companyOf(db, actor.id))
  return mine.map((y) => {
    const named = sets.find((s) => s.ruleSetId === y.ruleSetId)?.ruleSet
    return {
      id: y.id,
      ...fields(y),
      ruleSetName: named?.name ?? null,
      ...(named?.es?.name ? { es: { ruleSetName: named.es.name } } : {}),
      spaces: spaces
        .filter((s) => s.space.yardId === y.id)
        .map((s) => ({ id: s.space.id, label: spaceLabel(s.space), row: s.space.row, number: s.space.number, size: s.space.size, retired: s.space.retiredAt !== null, occupant: s.occupant })),
    }
  })
}

async function myYard(db: Executor, actor: User, yardId: string, lock = false) {
  const yard = (await yardsOfUser(db, actor.id)).find((y) => y.id === yardId)
  if (!yard) throw notFound('That yard')
  if (lock) await db.select({ id: yards.id }).from(yards).where(eq(yards.id, yardId)).for('update')
  return yard
}

function codeTaken(code: string) {
  const message = `The stock-number prefix ${code} is already used by a yard: stock numbers must not repeat.`
  return conflict(message, { issues: [fieldIssue('code', 'yardSettings.prefixTaken', message, { code })] })
}

/** Rows firstRow… × numbers 1…perRow; a space already there is refused naming the block. */
export async function insertSpaces(db: Executor, yardId: string, block: SpaceBlock, path = 'rows') {
  const first = block.firstRow.charCodeAt(0)
  if (first + block.rows - 1 > 90) {
    const message = `From row ${block.firstRow}, ${block.rows} rows go past Z.`
    throw conflict(message, { issues: [fieldIssue(path, 'yardSettings.rowsPastZ', message, { row: block.firstRow, rows: block.rows })] })
  }
  const wanted = Array.from({ length: block.rows }, (_, r) => String.fromCharCode(first + r)).flatMap((row) =>
    Array.from({ length: block.perRow }, (_, n) => ({ yardId, row, number: n + 1, size: block.size })),
  )
  const existing = await db.select({ row: yardSpaces.row, number: yardSpaces.number }).from(yardSpaces).where(eq(yardSpaces.yardId, yardId))
  const clash = wanted.find((w) => existing.some((e) => e.row === w.row && e.number === w.number))
  if (clash) {
    const message = `Space ${spaceLabel(clash)} already exists. Start at another row.`
    throw conflict(message, { issues: [fieldIssue('firstRow', 'yardSettings.spaceExists', message, { label: spaceLabel(clash) })] })
  }
  await db.insert(yardSpaces).values(wanted)
  return wanted.length
}

/** What a new yard may start from: the shipped samples and the company's own rule sets (by id). */
export async function ruleSetIdsFor(db: Executor, actor: User, ruleSetsFolder?: string): Promise<string[]> {
  const own = await latestRuleSets(db, await companyOf(db, actor.id))
  return [...new Set([...sampleChoices(ruleSetsFolder).map((s) => s.id), ...own.map((r) => r.slug)])]
}

export async function addYard(db: Database, actor: User, input: NewYard, ruleSetsFolder?: string) {
  return db.transaction(async (tx) => {
    const [me] = await tx.select({ companyId: users.companyId, allYards: users.allYards }).from(users).where(eq(users.id, actor.id))
    const [taken] = await tx.select({ id: yards.id }).from(yards).where(eq(yards.code, input.code))
    if (taken) throw codeTaken(input.code)
    const { spaces, labourRateCents, towRates, ...setup } = input
    const yard = await createYard(tx, me!.companyId, { ...setup, phone: setup.phone ?? undefined }, ruleSetsFolder)
    await tx.update(yards).set({ labourRateCents, towRates }).where(eq(yards.id, yard.id))
    if (!me!.allYards) await tx.insert(userYards).values({ userId: actor.id, yardId: yard.id })
    const count = spaces ? await insertSpaces(tx, yard.id, spaces) : 0
    const after = { ...fields({ ...yard, labourRateCents, towRates }), ruleSet: input.ruleSet, spaces: count }
    await recordSettingsChange(tx, { companyId: me!.companyId, actorId: actor.id, area: 'yard', action: 'yard-added', subjectId: yard.id, subjectLabel: yard.name, after })
    return yard.id
  })
}

export async function editYard(db: Database, actor: User, yardId: string, input: EditYard) {
  await db.transaction(async (tx) => {
    const yard = await myYard(tx, actor, yardId, true)
    if (input.code && input.code !== yard.code) {
      const [taken] = await tx.select({ id: yards.id }).from(yards).where(eq(yards.code, input.code))
      if (taken) throw codeTaken(input.code)
    }
    const [after] = await tx.update(yards).set(input).where(eq(yards.id, yardId)).returning()
    const diff = changedValues(fields(yard), fields(after!))
    if (Object.keys(diff.after).length === 0) return
    await recordSettingsChange(tx, { companyId: yard.companyId, actorId: actor.id, area: 'yard', action: 'yard-edited', subjectId: yard.id, subjectLabel: after!.name, ...diff })
  })
}

export async function addSpaces(db: Database, actor: User, yardId: string, block: SpaceBlock) {
  await db.transaction(async (tx) => {
    const yard = await myYard(tx, actor, yardId, true)
    const count = await insertSpaces(tx, yard.id, block)
    const last = String.fromCharCode(block.firstRow.charCodeAt(0) + block.rows - 1)
    const after = { rows: `${block.firstRow}–${last}`, numbers: `1–${block.perRow}`, size: block.size, spaces: count }
    await recordSettingsChange(tx, { companyId: yard.companyId, actorId: actor.id, area: 'yard', action: 'spaces-added', subjectId: yard.id, subjectLabel: yard.name, after })
  })
}

/** A space with a vehicle on it cannot be retired: the refusal names the vehicle. */
export async function retireSpace(db: Database, actor: User, yardId: string, spaceId: string) {
  await db.transaction(async (tx) => {
    const yard = await myYard(tx, actor, yardId, true)
    const [space] = await tx.select().from(yardSpaces).where(and(eq(yardSpaces.id, spaceId), eq(yardSpaces.yardId, yard.id))).for('update')
    if (!space) throw notFound('That space')
    const label = spaceLabel(space)
    if (space.retiredAt) throw conflict(`Space ${label} is already retired.`, { issues: [fieldIssue('spaceId', 'yardSettings.alreadyRetired', `Space ${label} is already retired.`, { label })] })
    const [holder] = await tx.select({ stockNumber: vehicles.stockNumber }).from(vehicles).where(eq(vehicles.spaceId, spaceId))
    if (holder) {
      const message = `Space ${label} holds ${holder.stockNumber}: move the vehicle out before retiring the space.`
      throw conflict(message, { issues: [fieldIssue('spaceId', 'yardSettings.spaceHolds', message, { label, stock: holder.stockNumber })] })
    }
    await tx.update(yardSpaces).set({ retiredAt: new Date() }).where(eq(yardSpaces.id, spaceId))
    await recordSettingsChange(tx, { companyId: yard.companyId, actorId: actor.id, area: 'yard', action: 'space-retired', subjectId: yard.id, subjectLabel: yard.name, before: { space: label, retired: false }, after: { space: label, retired: true } })
  })
}
