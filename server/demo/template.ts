// The demo yard built once, at `npm run build`, into a database template, so a new install does not
// play the demo's few weeks through the services at its first start (about 10–30 s) but copies them.
//
// The history is sealed with a key that never enters the database. The template is sealed with a
// throw-away build key that is never written anywhere; the first start makes the install's own key
// (server/history-key.ts) and re-seals every chain and head with it in one transaction before the
// server serves. The tokens the demo made (owner links in its notices, its used gate passes) are
// replaced by random hashes nobody holds, so no token that grants anything ships with the build.
import { randomBytes } from 'node:crypto'
import { readFileSync, writeFileSync } from 'node:fs'
import { asc, sql } from 'drizzle-orm'
import type { Database, Executor } from '@db/client'
import { GENESIS_HASH, eventHash, headSeal, type HistoryKey } from '@db/history'
import * as t from '@db/schema'
import type { FileStore } from '../files/index'
import { DEMO_PASSWORD, DEMO_STAFF } from './scenario'
import { loadDemoIfEmpty, type DemoLoaded } from './seed'

/** What ships beside the demo template: when its clock stopped, and the files its services stored. */
export interface DemoTemplateMeta {
  builtAt: string
  files: { key: string; data: string }[]
}

/** A demo ends at its build's "now": older than this, a first start plays the demo afresh instead. */
export const DEMO_TEMPLATE_MAX_AGE_MS = 24 * 3_600_000

/** A file store that keeps what is put in memory, for the build to ship beside the template. */
function keepingStore(): FileStore & { kept: Map<string, Buffer> } {
  const kept = new Map<string, Buffer>()
  return {
    kept,
    where: 'the demo template build (in memory)',
    put: async (key, data) => void kept.set(key, Buffer.from(data)),
    get: async () => {
      throw new Error('The demo template build reads no files back.')
    },
    delete: async (key) => void kept.delete(key),
    list: async () => [...kept.keys()].sort(),
    check: async () => {},
  }
}

/**
 * Plays the demo into `db` (migrated, empty) sealed with a throw-away key, and writes what ships beside
 * the template to `metaFile`. The key is dropped here: only the first start's re-seal makes it verify.
 */
export async function buildDemoTemplate(db: Database, metaFile: string, now: Date, ruleSetsFolder?: string): Promise<void> {
  const store = keepingStore()
  const loaded = await loadDemoIfEmpty(db, randomBytes(32), now, ruleSetsFolder, store)
  if (!loaded) throw new Error('The demo template must start from an empty database.')
  const meta: DemoTemplateMeta = { builtAt: now.toISOString(), files: [...store.kept].map(([key, data]) => ({ key, data: data.toString('base64') })) }
  writeFileSync(metaFile, JSON.stringify(meta))
}

/** The demo template's description, when it exists and its demo is recent enough to show. */
export function usableDemoTemplate(metaFile: string, now = new Date()): DemoTemplateMeta | null {
  let meta: DemoTemplateMeta
  try {
    meta = JSON.parse(readFileSync(metaFile, 'utf8')) as DemoTemplateMeta
  } catch {
    return null
  }
  const age = now.getTime() - Date.parse(meta.builtAt)
  return age >= 0 && age <= DEMO_TEMPLATE_MAX_AGE_MS ? meta : null
}

/**
 * Every vehicle's chain and sealed head computed again under `key`, from the events' content, in the
 * caller's transaction. The append-only trigger is set aside for this transaction only (ALTER TABLE
 * is transactional): only the process that created the database from the build's template calls it.
 */
export async function resealHistory(tx: Executor, key: HistoryKey): Promise<{ vehicles: number; events: number }> {
  const rows = await tx.select().from(t.historyEvents).orderBy(asc(t.historyEvents.vehicleId), asc(t.historyEvents.seq))
  const ids: string[] = []
  const prevs: string[] = []
  const hashes: string[] = []
  const heads = new Map<string, { seq: number; hash: string }>()
  let vehicle = ''
  let prev = GENESIS_HASH
  for (const row of rows) {
    if (row.vehicleId !== vehicle) {
      vehicle = row.vehicleId
      prev = GENESIS_HASH
    }
    const hash = eventHash(key, prev, row)
    ids.push(row.id)
    prevs.push(prev)
    hashes.push(hash)
    heads.set(vehicle, { seq: row.seq, hash })
    prev = hash
  }
  // One statement per table, the new values as one JSON parameter.
  const links = JSON.stringify(ids.map((id, i) => ({ id, prev: prevs[i], hash: hashes[i] })))
  await tx.execute(sql`alter table history_events disable trigger history_events_append_only`)
  await tx.execute(sql`
    update history_events h set prev_hash = v.prev, hash = v.hash
    from jsonb_to_recordset(${links}::jsonb) as v(id uuid, prev text, hash text)
    where h.id = v.id`)
  await tx.execute(sql`alter table history_events enable trigger history_events_append_only`)
  const sealed = JSON.stringify([...heads].map(([vehicleId, h]) => ({ vehicle_id: vehicleId, seq: h.seq, hash: h.hash, seal: headSeal(key, vehicleId, h.seq, h.hash) })))
  await tx.execute(sql`
    update history_heads h set seq = v.seq, hash = v.hash, seal = v.seal
    from jsonb_to_recordset(${sealed}::jsonb) as v(vehicle_id uuid, seq int, hash text, seal text)
    where h.vehicle_id = v.vehicle_id`)
  return { vehicles: heads.size, events: rows.length }
}

/** Every stored token's and short code's hash replaced by the hash of nothing anyone holds: the build's tokens open nothing. */
async function forgetBuildTokens(tx: Executor): Promise<void> {
  const fresh = () => randomBytes(32).toString('hex')
  for (const table of [t.ownerLinks, t.gatePasses]) {
    const rows = await tx.select({ id: table.id }).from(table)
    if (rows.length === 0) continue
    const hashes = JSON.stringify(rows.map((r) => ({ id: r.id, token_hash: fresh(), code_hash: fresh() })))
    await tx.execute(sql`
      update ${table} x set token_hash = v.token_hash, code_hash = v.code_hash
      from jsonb_to_recordset(${hashes}::jsonb) as v(id uuid, token_hash text, code_hash text)
      where x.id = v.id`)
  }
  const feeds = await tx.select({ id: t.calendarFeeds.id }).from(t.calendarFeeds)
  if (feeds.length > 0) {
    const hashes = JSON.stringify(feeds.map((r) => ({ id: r.id, token_hash: fresh() })))
    await tx.execute(sql`
      update ${t.calendarFeeds} x set token_hash = v.token_hash
      from jsonb_to_recordset(${hashes}::jsonb) as v(id uuid, token_hash text)
      where x.id = v.id`)
  }
}

/**
 * The first start of a database made from the demo template: the files go into this install's store,
 * then the history is re-sealed with this install's key and the build's tokens are forgotten, in one
 * transaction, before anything is served.
 */
export async function adoptDemoTemplate(db: Database, key: HistoryKey, store: FileStore, meta: DemoTemplateMeta): Promise<DemoLoaded & { resealed: { vehicles: number; events: number } }> {
  for (const f of meta.files) await store.put(f.key, Buffer.from(f.data, 'base64'))
  const resealed = await db.transaction(async (tx) => {
    await forgetBuildTokens(tx)
    return resealHistory(tx, key)
  })
  return { password: DEMO_PASSWORD, users: DEMO_STAFF.map(({ email, role }) => ({ email, role })), resealed }
}
