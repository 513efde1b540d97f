import { mkdtempSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { count, eq, inArray, sql } from 'drizzle-orm'
import { hashPassword } from '../users/index'
import { loadSampleRuleSets } from '../rule-sets/index'
import { type FileStore, localFileStore } from '../files/index'
import type { VehicleChanges } from '../vehicles/index'
import type { Database } from '@db/client'
import type { HistoryKey } from '@db/history'
import * as t from '@db/schema'
import { DEMO_VEHICLES, type DemoVehicle } from './vehicles'
import { DEMO_COMPANY, DEMO_PASSWORD, DEMO_SPACES, DEMO_STAFF, DEMO_YARD } from './scenario'
import { type DemoStaff, playDemo } from './simulation'

/** The demo's few weeks: its oldest stay began about this long before now. */
const WEEKS_BEFORE = 10 * 7 * 24 * 3_600_000

export interface DemoLoaded {
  password: string
  users: { email: string; role: string }[]
}

/** The demo sign-ins while the demo's staff still sign in with the demo password's accounts; none for a real yard. */
export async function demoSignIns(db: Database): Promise<DemoLoaded | null> {
  const rows = await db.select({ email: t.users.email }).from(t.users).where(inArray(t.users.email, DEMO_STAFF.map((s) => s.email)))
  const present = DEMO_STAFF.filter((s) => rows.some((r) => r.email === s.email))
  return present.length > 0 ? { password: DEMO_PASSWORD, users: present.map(({ email, role }) => ({ email, role })) } : null
}

/** The advisory lock servers take to load the demo once (any constant of Holdfast's own, unlike the migrations' key). */
const DEMO_LOCK_KEY = 4_640_221_907

/**
 * The demo yard, when the database has no yard yet; its history is sealed with the server's history key.
 * Its files (ID photos, signatures, notice letters) go to `files` — a throwaway folder when none is given.
 */
export async function loadDemoIfEmpty(db: Database, historyKey: HistoryKey, now = new Date(), ruleSetsFolder?: string, files?: FileStore): Promise<DemoLoaded | null> {
  const [row] = await db.select({ n: count() }).from(t.yards)
  if ((row?.n ?? 0) > 0) return null
  const store = files ?? localFileStore(mkdtempSync(path.join(tmpdir(), 'holdfast-demo-files-')))
  const loaded = await db.transaction(async (tx) => {
    // Two servers starting together on one empty PostgreSQL: the first loads the demo, the other waits
    // here and then finds it there. (One embedded database has one server; the lock costs it nothing.)
    await tx.execute(sql`select pg_advisory_xact_lock(${DEMO_LOCK_KEY})`)
    const [again] = await tx.select({ n: count() }).from(t.yards)
    if ((again?.n ?? 0) > 0) return false
    await loadDemo(tx as unknown as Database, historyKey, now, ruleSetsFolder, store)
    return true
  })
  return loaded ? { password: DEMO_PASSWORD, users: DEMO_STAFF.map(({ email, role }) => ({ email, role })) } : null
}

async function loadDemo(db: Database, historyKey: HistoryKey, now: Date, ruleSetsFolder: string | undefined, files: FileStore): Promise<void> {
  // The company, its yard and staff were set up before the weeks the demo plays.
  const setUpAt = new Date(now.getTime() - WEEKS_BEFORE)
  const [company] = await db.insert(t.companies).values({ ...DEMO_COMPANY, createdAt: setUpAt }).returning()
  const ruleSetVersions = await loadSampleRuleSets(db, ruleSetsFolder)
  const california = ruleSetVersions.get('california-sample')
  const [ruleSet] = california
    ? await db.select({ id: t.ruleSetVersions.ruleSetId }).from(t.ruleSetVersions).where(eq(t.ruleSetVersions.id, california))
    : []
  const [yard] = await db
    .insert(t.yards)
    .values({ ...DEMO_YARD, companyId: company!.id, ruleSetId: ruleSet?.id ?? null, createdAt: setUpAt })
    .returning()
  const spaces = await db
    .insert(t.yardSpaces)
    .values(DEMO_SPACES.map((s) => ({ ...s, yardId: yard!.id })))
    .returning()

  const passwordHash = await hashPassword(DEMO_PASSWORD)
  const rows = await db
    .insert(t.users)
    .values(DEMO_STAFF.map((s) => ({ ...s, companyId: company!.id, passwordHash, createdAt: setUpAt, updatedAt: setUpAt })))
    .returning()
  const staff = Object.fromEntries(rows.map((u) => [u.role, { id: u.id, email: u.email, name: u.name, role: u.role }])) as unknown as DemoStaff

  // The oldest first (a vehicle's VIN and space follow this order). Vehicles still in the yard take the
  // first free spaces of their size; those that have left took spaces from the far end, given back as they left.
  const sorted = [...DEMO_VEHICLES].sort((a, b) => b.hoursAgo - a.hoursAgo)
  const free = { standard: spaces.filter((s) => s.size === 'standard'), heavy: spaces.filter((s) => s.size === 'wide'), motorcycle: spaces.filter((s) => s.size === 'motorcycle') }
  const spaceOf = new Map<DemoVehicle, string | null>()
  for (const v of sorted) if (v.state !== 'closed') spaceOf.set(v, free[v.vehicleClass].shift()?.id ?? null)
  for (const v of sorted) if (v.state === 'closed') spaceOf.set(v, free[v.vehicleClass].pop()?.id ?? null)

  let clock = now.getTime()
  const quiet = { changed: async () => {}, sessionsEnded: async () => {} }
  const changes: VehicleChanges = { db, boards: quiet, historyKey, clock: () => new Date(clock) }
  await playDemo(
    { changes, files, staff, now, setClock: (at) => void (clock = at), spaceFor: (v) => spaceOf.get(v) ?? null, publicUrl: 'http://localhost:3000' },
    sorted,
  )
}
