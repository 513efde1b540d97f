import { eq } from 'drizzle-orm'
import type { Database } from '@db/client'
import { historyOf } from '@db/history'
import * as t from '@db/schema'
import { loadSampleRuleSets } from '../../server/rule-sets/index'
import { signedIn, type TestApp } from './app'
import { makeStaff, makeVehicle } from './factories'

const loaded = new WeakMap<Database, Promise<unknown>>()

/** The version id of a shipped sample rule set ("california-sample", "florida-sample"), loading them once per database. */
export async function sampleVersionId(db: Database, slug: string): Promise<string> {
  if (!loaded.has(db)) loaded.set(db, loadSampleRuleSets(db))
  await loaded.get(db)
  const [row] = await db
    .select({ id: t.ruleSetVersions.id })
    .from(t.ruleSetVersions)
    .innerJoin(t.ruleSets, eq(t.ruleSets.id, t.ruleSetVersions.ruleSetId))
    .where(eq(t.ruleSets.slug, slug))
  if (!row) throw new Error(`no sample rule set ${slug}`)
  return row.id
}

export const LABOUR_RATE_CENTS = 12_345

/**
 * A company whose yard charges $123.45 an hour, its four staff signed in, and one vehicle in
 * Teardown under the California sample (Total Loss Formula) with its keys.
 */
export async function teardownFixture(app: TestApp, vehicle: Partial<typeof t.vehicles.$inferInsert> = {}) {
  const staff = await makeStaff(app.db)
  await app.db.update(t.yards).set({ labourRateCents: LABOUR_RATE_CENTS }).where(eq(t.yards.id, staff.yard.id))
  const ruleSetVersionId = await sampleVersionId(app.db, 'california-sample')
  const v = await makeVehicle(app.db, staff.yard.id, { state: 'teardown', keys: 'yes', ruleSetVersionId, ...vehicle })
  const [tech, manager, dispatcher, office] = await Promise.all([staff.technician, staff.manager, staff.dispatcher, staff.office].map((u) => signedIn(app.app, u)))
  const base = `/api/vehicles/${v.id}/inspection`
  return { staff, vehicle: v, base, tech: tech!, manager: manager!, dispatcher: dispatcher!, office: office! }
}

export type Fixture = Awaited<ReturnType<typeof teardownFixture>>

/** Every row an inspection writes, for one vehicle: a refusal changes none of them. */
export async function inspectionCounts(db: Database, vehicleId: string) {
  const inspections = await db.select().from(t.inspections).where(eq(t.inspections.vehicleId, vehicleId))
  const ids = inspections.map((i) => i.id)
  const rowsOf = async (table: typeof t.inspectionItems | typeof t.inspectionLines | typeof t.inspectionPhotos) =>
    (await db.select().from(table)).filter((r) => ids.includes(r.inspectionId)).length
  const [vehicle] = await db.select().from(t.vehicles).where(eq(t.vehicles.id, vehicleId))
  return {
    inspections: inspections.length,
    items: await rowsOf(t.inspectionItems),
    lines: await rowsOf(t.inspectionLines),
    photos: await rowsOf(t.inspectionPhotos),
    files: (await db.select().from(t.files).where(eq(t.files.vehicleId, vehicleId))).length,
    history: (await historyOf(db, vehicleId)).length,
    vehicleVersion: vehicle!.version,
    inspectionState: JSON.stringify(inspections),
  }
}

export const historyKinds = async (db: Database, vehicleId: string) => (await historyOf(db, vehicleId)).map((e) => e.kind)

/** Safety read, so the pickup marks and the finish are allowed. */
export async function acknowledged(f: Fixture) {
  await f.tech.post(f.base).expect((r) => expect201or200(r.status))
  await f.tech.post(`${f.base}/safety`).expect(200)
}

function expect201or200(status: number) {
  if (status !== 201 && status !== 200) throw new Error(`start answered ${status}`)
}

export const line = (over: Record<string, unknown> = {}) => ({ part: 'Ball joint', quantity: 1, unitPriceCents: 8_999, labourHours: 1.5, ...over })

/** PUT as a browser tab would send it (the session helper has no put of its own). */
export const put = (s: Fixture['tech'], url: string, body: object) => s.agent.put(url).set('x-csrf-token', s.csrf).send(body)
