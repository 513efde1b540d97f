import { cpSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { asc, eq, sql } from 'drizzle-orm'
import type { PgliteDatabase } from 'drizzle-orm/pglite'
import { migrate } from 'drizzle-orm/pglite/migrator'
import { pino } from 'pino'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { openDatabase, type DatabaseHandle } from '@db/client'
import * as t from '@db/schema'
import { createApp } from '../../server/app'
import { localFileStore } from '../../server/files/index'
import { loadSampleRuleSets } from '../../server/rule-sets/index'
import { signedIn, TEST_HISTORY_KEY } from '../helpers/app'
import { makeStaff } from '../helpers/factories'
import { anotherVehicle, towInBody } from '../helpers/tow-in'

// Issue 10: the police-notification rule of a private-property tow (Cal. Veh. Code § 22658: 1 hour from the call;
// Fla. Stat. § 715.07(2)(a): 30 minutes from the arrival — both from memory, marked "M" in the samples) reached the
// shipped samples after databases had loaded them, and a database keeps the sample version it loaded. The custom
// migration `*_sample_police_notice` adds the rule as a new version of every rule set derived from those samples;
// vehicles keep the version they arrived under. This starts from a database migrated up to the migration before it,
// holding the samples as they were shipped without the rule, and applies it.
const MIGRATIONS = path.resolve('db/migrations')
const SAMPLES = path.resolve('server/rule-sets/samples')
const shipped = (file: string) => JSON.parse(readFileSync(path.join(SAMPLES, file), 'utf8')) as Record<string, unknown>

let handle: DatabaseHandle
let app: ReturnType<typeof createApp>
let staff: Awaited<ReturnType<typeof makeStaff>>
let oldTowIn: { id: string; policeNotice: unknown }
let ownCopy: string
const dirs: string[] = []
const scratch = (prefix: string) => {
  const dir = mkdtempSync(path.join(tmpdir(), prefix))
  dirs.push(dir)
  return dir
}

const versionsOf = async (slug: string) =>
  handle.db
    .select({ version: t.ruleSetVersions.version, body: t.ruleSetVersions.body, id: t.ruleSetVersions.id })
    .from(t.ruleSetVersions)
    .innerJoin(t.ruleSets, eq(t.ruleSets.id, t.ruleSetVersions.ruleSetId))
    .where(eq(t.ruleSets.slug, slug))
    .orderBy(asc(t.ruleSetVersions.version))
const versionCount = async () => (await handle.db.select({ id: t.ruleSetVersions.id }).from(t.ruleSetVersions)).length
const withoutPoliceRule = (body: Record<string, unknown>) => Object.fromEntries(Object.entries(body).filter(([k]) => k !== 'policeNotice'))
/** A rule as this migration wrote it: English only (the samples' Spanish came later, added at start-up by `addSampleWords`). */
const englishOnly = (value: unknown): unknown =>
  Array.isArray(value) ? value.map(englishOnly) : value && typeof value === 'object' ? Object.fromEntries(Object.entries(value).filter(([k]) => k !== 'es').map(([k, v]) => [k, englishOnly(v)])) : value

beforeAll(async () => {
  // The migrations as they were before this one: the same folder with its journal entry left out.
  const before = scratch('holdfast-migrations-')
  cpSync(MIGRATIONS, before, { recursive: true })
  const journalFile = path.join(before, 'meta', '_journal.json')
  const journal = JSON.parse(readFileSync(journalFile, 'utf8')) as { entries: { tag: string }[] }
  const kept = journal.entries.filter((e) => !e.tag.endsWith('_sample_police_notice'))
  expect(kept).toHaveLength(journal.entries.length - 1)
  writeFileSync(journalFile, JSON.stringify({ ...journal, entries: kept }))
  handle = await openDatabase({ kind: 'memory' }, before)
  await handle.migrate()

  // The samples as shipped before the rule: the same files without `policeNotice` (and without the Spanish, which came later).
  const oldSamples = scratch('holdfast-old-samples-')
  for (const file of readdirSync(SAMPLES).filter((f) => f.endsWith('.json'))) writeFileSync(path.join(oldSamples, file), JSON.stringify(englishOnly(withoutPoliceRule(shipped(file)))))
  const loaded = await loadSampleRuleSets(handle.db, oldSamples)
  expect([...loaded.keys()].sort()).toEqual(['california-sample', 'florida-sample', 'ordinance-24h-template'])

  staff = await makeStaff(handle.db)
  const [california] = await handle.db.select().from(t.ruleSets).where(eq(t.ruleSets.slug, 'california-sample'))
  await handle.db.update(t.yards).set({ ruleSetId: california!.id }).where(eq(t.yards.id, staff.yard.id))
  app = createApp({
    db: handle.db,
    files: localFileStore(scratch('holdfast-files-')),
    historyKey: TEST_HISTORY_KEY,
    log: pino({ level: process.env.TEST_LOG ?? 'silent' }),
    sessionSecret: 'test-secret-that-is-long-enough-for-signing',
    version: 'test',
    signInLimits: { perAccount: 1000, perIp: 1000, windowMs: 60_000 },
  })

  // Before the migration: the company's own copy of the California sample, a copy moved to another state, and a
  // private-property tow-in, which the old sample asks no police call of.
  const m = await signedIn(app, staff.manager)
  ownCopy = (await m.post('/api/settings/rule-sets/california-sample/copy', { name: 'Quarry Spur rates' }).expect(201)).body.id
  const elsewhere = (await m.post('/api/settings/rule-sets/california-sample/copy', { name: 'Our Reno rates' }).expect(201)).body
  await m.put(`/api/settings/rule-sets/${elsewhere.id}`, { version: 1, ruleSet: { ...elsewhere.ruleSet, jurisdiction: 'State of Nevada, USA' }, reason: 'Reno yard' }).expect(200)
  const d = await signedIn(app, staff.dispatcher)
  const towed = await d.post('/api/vehicles', towInBody(staff.dispatcher.id, (b) => void (b.tow.reason = 'private_property')))
  expect(towed.status, JSON.stringify(towed.body)).toBe(201)
  expect(towed.body.policeNotice).toBeNull()
  oldTowIn = towed.body

  await migrate(handle.db as unknown as PgliteDatabase<typeof t>, { migrationsFolder: MIGRATIONS })
})

afterAll(async () => {
  await handle?.close()
  for (const dir of dirs) rmSync(dir, { recursive: true, force: true })
})

describe('the police-notification rule reaches rule sets already in a database (custom migration)', () => {
  it('adds it to each sample as version 2, word for word the shipped rule, and changes nothing else', async () => {
    for (const [slug, file] of [['california-sample', 'california.json'], ['florida-sample', 'florida.json']] as const) {
      const [v1, v2, ...more] = await versionsOf(slug)
      expect(more).toEqual([])
      expect(v1!.body.policeNotice).toBeUndefined()
      expect(v2!.version).toBe(2)
      expect(v2!.body.policeNotice).toEqual(englishOnly(shipped(file).policeNotice))
      expect(withoutPoliceRule(v2!.body)).toEqual(v1!.body)
    }
    // Cal. Veh. Code § 22658 [M]: within one hour of the call; Fla. Stat. § 715.07(2)(a) [M]: 30 minutes from the arrival.
    expect((await versionsOf('california-sample'))[1]!.body.policeNotice).toMatchObject({ hours: 1, from: 'tow-requested', towReasons: ['private_property'] })
    expect((await versionsOf('florida-sample'))[1]!.body.policeNotice).toMatchObject({ hours: 0.5, from: 'tow-completed', towReasons: ['private_property'] })
    // The city ordinance template has no police rule to add.
    expect(await versionsOf('ordinance-24h-template')).toHaveLength(1)
  })

  it("adds it to the company's copy of the California sample as its next version, in the settings record by no person, and leaves a copy moved to another state alone", async () => {
    const versions = await versionsOf(ownCopy)
    expect(versions.map((v) => v.version)).toEqual([1, 2])
    expect(versions[1]!.body.policeNotice).toEqual(englishOnly(shipped('california.json').policeNotice))
    expect(withoutPoliceRule(versions[1]!.body)).toEqual(versions[0]!.body)
    const [change] = await handle.db.select().from(t.settingsChanges).where(eq(t.settingsChanges.subjectId, ownCopy)).orderBy(asc(t.settingsChanges.at)).offset(1)
    expect(change).toMatchObject({ companyId: staff.company.id, actorId: null, area: 'rule-set', action: 'saved', subjectLabel: 'Quarry Spur rates (version 2)' })
    expect(change!.after).toMatchObject({ 'policeNotice.hours': 1, 'policeNotice.from': 'tow-requested' })
    expect(change!.reason).toMatch(/police-notification rule/)
    const m = await signedIn(app, staff.manager)
    const audit = (await m.get('/api/settings/audit').expect(200)).body.changes as { subjectId: string; actor: string | null }[]
    expect(audit.find((c) => c.subjectId === ownCopy)).toMatchObject({ actor: null })

    const [elsewhere] = await handle.db.select().from(t.ruleSets).where(eq(t.ruleSets.name, 'Our Reno rates'))
    expect((await versionsOf(elsewhere!.slug)).map((v) => [v.version, v.body.policeNotice])).toEqual([
      [1, undefined],
      [2, undefined],
    ])
  })

  it('a vehicle already on the lot keeps its version and its clocks; a new private-property tow-in gets the police clock', async () => {
    const d = await signedIn(app, staff.dispatcher)
    const [v1, v2] = await versionsOf('california-sample')
    const [old] = await handle.db.select().from(t.vehicles).where(eq(t.vehicles.id, oldTowIn.id))
    expect(old!.ruleSetVersionId).toBe(v1!.id)
    expect((await d.get(`/api/vehicles/${oldTowIn.id}`).expect(200)).body.summary.policeNotice).toBeNull()

    const body = towInBody(staff.dispatcher.id, (b) => {
      anotherVehicle(b)
      b.tow.reason = 'private_property'
      // Called 20 minutes ago: the hour is still running.
      b.tow.calledAt = new Date(Date.now() - 20 * 60_000).toISOString()
      b.tow.hookedAt = new Date(Date.now() - 12 * 60_000).toISOString()
    })
    const towed = await d.post('/api/vehicles', body)
    expect(towed.status, JSON.stringify(towed.body)).toBe(201)
    // Cal. Veh. Code § 22658 [M]: one hour from the call, the earliest time the tow-in records.
    expect(towed.body.policeNotice).toMatchObject({ status: 'open', hours: 1, start: 'called' })
    expect(Date.parse(towed.body.policeNotice.startAt)).toBe(Date.parse(body.tow.calledAt!))
    expect(Date.parse(towed.body.policeNotice.dueAt)).toBe(Date.parse(body.tow.calledAt!) + 60 * 60_000)
    const [fresh] = await handle.db.select().from(t.vehicles).where(eq(t.vehicles.id, towed.body.id))
    expect(fresh!.ruleSetVersionId).toBe(v2!.id)
    expect((await d.get(`/api/vehicles/${towed.body.id}`).expect(200)).body.summary.policeNotice).toMatchObject({ status: 'open', hours: 1 })
  })

  it('run again, it adds nothing: every derived rule set already has the rule', async () => {
    const file = readdirSync(MIGRATIONS).find((f) => f.endsWith('_sample_police_notice.sql'))!
    const before = await versionCount()
    const audit = (await handle.db.select().from(t.settingsChanges)).length
    await handle.db.execute(sql.raw(readFileSync(path.join(MIGRATIONS, file), 'utf8')))
    expect(await versionCount()).toBe(before)
    expect(await handle.db.select().from(t.settingsChanges)).toHaveLength(audit)
  })
})
