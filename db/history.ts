import { createHmac, timingSafeEqual } from 'node:crypto'
import { asc, desc, eq, sql } from 'drizzle-orm'
import stringify from 'safe-stable-stringify'
import type { HistoryKind } from '@shared/schemas/history'
import type { Executor } from './client'
import { historyEvents, historyHeads, vehicles } from './schema/index'

export const GENESIS_HASH = '0'.repeat(64)

/**
 * The secret every link and head is sealed with (HMAC-SHA-256). It lives outside the database (a file
 * beside the data directory, server/history-key.ts), so whoever can rewrite the tables — a database
 * superuser with the append-only trigger disabled — still cannot make a rewritten history verify.
 */
export type HistoryKey = Buffer

export interface NewHistoryEvent {
  vehicleId: string
  actorId: string | null
  actorLabel: string
  kind: HistoryKind
  fromState?: string | null
  toState?: string | null
  reason?: string | null
  before?: Record<string, unknown> | null
  after?: Record<string, unknown> | null
  at?: Date
}

type HistoryRow = typeof historyEvents.$inferSelect

const hmac = (key: HistoryKey, text: string) => createHmac('sha256', key).update(text).digest('hex')

// Keys sorted at every depth: jsonb does not keep key order, and the hash must survive the round trip.
export function eventHash(key: HistoryKey, prevHash: string, e: Omit<HistoryRow, 'id' | 'hash' | 'prevHash'>): string {
  const body = stringify([
    e.vehicleId, e.seq, e.at.toISOString(), e.actorId, e.actorLabel, e.kind,
    e.fromState, e.toState, e.reason, e.before, e.after,
  ])
  return hmac(key, `event\n${prevHash}\n${body}`)
}

/** The seal of a vehicle's head: which event is its last, bound to the vehicle and the key. */
export function headSeal(key: HistoryKey, vehicleId: string, seq: number, hash: string): string {
  return hmac(key, `head\n${vehicleId}\n${seq}\n${hash}`)
}

const sameHex = (a: string, b: string) => a.length === b.length && timingSafeEqual(Buffer.from(a), Buffer.from(b))

type UnhashedRow = Omit<HistoryRow, 'id' | 'hash' | 'prevHash'>

function unhashed(vehicleId: string, seq: number, e: Omit<NewHistoryEvent, 'vehicleId'>): UnhashedRow {
  return {
    vehicleId,
    seq,
    // Milliseconds only, so the instant hashed is the instant stored.
    at: new Date(Math.floor((e.at ?? new Date()).getTime())),
    actorId: e.actorId,
    actorLabel: e.actorLabel,
    kind: e.kind,
    fromState: e.fromState ?? null,
    toState: e.toState ?? null,
    reason: e.reason ?? null,
    before: e.before ?? null,
    after: e.after ?? null,
  }
}

const linked = (key: HistoryKey, row: UnhashedRow, prevHash: string) => ({ ...row, prevHash, hash: eventHash(key, prevHash, row) })

/**
 * Appends one event to a vehicle's chain of custody. Call it inside the transaction that makes the
 * change it records; the vehicle row is locked so two appends cannot take the same sequence number.
 */
export async function appendHistory(tx: Executor, key: HistoryKey, e: NewHistoryEvent, options: { vehicleLocked?: boolean } = {}): Promise<HistoryRow> {
  // A caller that already holds the vehicle row (select … for update) saves a round trip.
  if (!options.vehicleLocked) await tx.execute(sql`select 1 from ${vehicles} where ${vehicles.id} = ${e.vehicleId} for update`)
  const { vehicleId, ...event } = e
  return (await appendEvents(tx, key, vehicleId, [event]))[0]!
}

/**
 * Appends the events of one change to a vehicle's chain, in order, in three statements whatever their
 * number: the chain's end read once (not at all for a vehicle created in this transaction, whose
 * chain starts at the genesis hash), every event in one insert, the head written once. The links and
 * seals are the ones `appendHistory` makes one event at a time. The caller holds the vehicle row.
 */
export async function appendEvents(tx: Executor, key: HistoryKey, vehicleId: string, events: Omit<NewHistoryEvent, 'vehicleId'>[], options: { newVehicle?: boolean } = {}): Promise<HistoryRow[]> {
  if (events.length === 0) return []
  const [last] = options.newVehicle
    ? []
    : await tx.select({ seq: historyEvents.seq, hash: historyEvents.hash }).from(historyEvents).where(eq(historyEvents.vehicleId, vehicleId)).orderBy(desc(historyEvents.seq)).limit(1)
  const { rows, head } = chainAfter(key, vehicleId, events, last)
  const inserted = await tx.insert(historyEvents).values(rows).returning()
  await tx.insert(historyHeads).values(head!).onConflictDoUpdate({ target: historyHeads.vehicleId, set: { seq: head!.seq, hash: head!.hash, seal: head!.seal } })
  return inserted
}

/** A new vehicle's whole chain at once, from the genesis hash, and its sealed head — for bulk loads such as the demo yard. */
export function chainFromStart(key: HistoryKey, vehicleId: string, events: Omit<NewHistoryEvent, 'vehicleId'>[]) {
  return chainAfter(key, vehicleId, events)
}

/** Events linked after the chain's end `last` (none: from the genesis hash), and the head they leave. */
function chainAfter(key: HistoryKey, vehicleId: string, events: Omit<NewHistoryEvent, 'vehicleId'>[], last?: { seq: number; hash: string }) {
  let prevHash = last?.hash ?? GENESIS_HASH
  const rows = events.map((e, i) => {
    const row = linked(key, unhashed(vehicleId, (last?.seq ?? 0) + i + 1, e), prevHash)
    prevHash = row.hash
    return row
  })
  const end = rows.at(-1)
  const head = end ? { vehicleId, seq: end.seq, hash: end.hash, seal: headSeal(key, vehicleId, end.seq, end.hash) } : null
  return { rows, head }
}

export function historyOf(db: Executor, vehicleId: string) {
  return db.select().from(historyEvents).where(eq(historyEvents.vehicleId, vehicleId)).orderBy(asc(historyEvents.seq))
}

export interface ChainCheck {
  ok: boolean
  events: number
  /** The first event whose stored hash or link does not match its content. */
  brokenAt?: { seq: number; reason: string }
  /** Everything found wrong, in words: the chain, its sealed head, the vehicle's state. */
  problems: string[]
}

/** The chain alone: every event links to the one before it and its content matches its keyed hash. */
export function verifyChain(key: HistoryKey, rows: HistoryRow[]): ChainCheck {
  let prev = GENESIS_HASH
  const broken = (seq: number, reason: string): ChainCheck => ({ ok: false, events: rows.length, brokenAt: { seq, reason }, problems: [`event ${seq}: ${reason}`] })
  for (const [i, row] of rows.entries()) {
    if (row.seq !== i + 1) return broken(row.seq, 'an event is missing before this one')
    if (row.prevHash !== prev) return broken(row.seq, 'it does not link to the event before it')
    if (!sameHex(eventHash(key, prev, row), row.hash)) return broken(row.seq, 'its content was changed after it was written, or it was not written by Holdfast')
    prev = row.hash
  }
  return { ok: true, events: rows.length, problems: [] }
}

type Head = typeof historyHeads.$inferSelect

/**
 * A vehicle's whole record of custody: its chain, the sealed head that says which event is the last
 * (so removed newest events, or a removed history, show), and the vehicle's state against the last
 * event that moved it. What this cannot see is said in README.md ("What the history's check proves").
 */
export function verifyCustody(key: HistoryKey, vehicle: { id: string; state: string }, rows: HistoryRow[], head: Head | undefined): ChainCheck {
  const check = verifyChain(key, rows)
  const problems = [...check.problems]
  const last = rows.at(-1)
  if (!head) problems.push('the history has no sealed head: it was removed, or never written by Holdfast')
  else if (!sameHex(headSeal(key, vehicle.id, head.seq, head.hash), head.seal)) problems.push('the sealed head was altered')
  else if (!last) problems.push(`the history is empty, but ${head.seq} events were written`)
  else if (head.seq !== last.seq || head.hash !== last.hash) {
    problems.push(head.seq > last.seq ? `events ${last.seq + 1} to ${head.seq} were removed` : `the last event is not the one sealed (event ${head.seq})`)
  }
  const lastMove = rows.findLast((r) => r.toState !== null)
  if (lastMove && lastMove.toState !== vehicle.state) problems.push(`the vehicle is in ${vehicle.state}, but its history last moved it to ${lastMove.toState}`)
  return { ...check, ok: problems.length === 0, problems }
}

export async function verifyVehicleHistory(db: Executor, key: HistoryKey, vehicleId: string): Promise<ChainCheck> {
  const [vehicle] = await db.select({ id: vehicles.id, state: vehicles.state }).from(vehicles).where(eq(vehicles.id, vehicleId))
  if (!vehicle) throw new Error(`no vehicle ${vehicleId}`)
  const [head] = await db.select().from(historyHeads).where(eq(historyHeads.vehicleId, vehicleId))
  return verifyCustody(key, vehicle, await historyOf(db, vehicleId), head)
}

/** Whether any history was ever written here: a missing key is then a loss, not a new install. */
export async function hasHistory(db: Executor): Promise<boolean> {
  const [row] = await db.select({ id: historyEvents.id }).from(historyEvents).limit(1)
  return row !== undefined
}
