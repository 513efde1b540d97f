import { createHash } from 'node:crypto'
import { asc, desc, eq, sql } from 'drizzle-orm'
import stringify from 'safe-stable-stringify'
import type { HistoryKind } from '@shared/schemas/history'
import type { Executor } from './client'
import { historyEvents, vehicles } from './schema/index'

export const GENESIS_HASH = '0'.repeat(64)

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

// Keys sorted at every depth: jsonb does not keep key order, and the hash must survive the round trip.
export function eventHash(prevHash: string, e: Omit<HistoryRow, 'id' | 'hash' | 'prevHash'>): string {
  const body = stringify([
    e.vehicleId, e.seq, e.at.toISOString(), e.actorId, e.actorLabel, e.kind,
    e.fromState, e.toState, e.reason, e.before, e.after,
  ])
  return createHash('sha256').update(`${prevHash}\n${body}`).digest('hex')
}

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

const linked = (row: UnhashedRow, prevHash: string) => ({ ...row, prevHash, hash: eventHash(prevHash, row) })

/**
 * Appends one event to a vehicle's chain of custody. Call it inside the transaction that makes the
 * change it records; the vehicle row is locked so two appends cannot take the same sequence number.
 */
export async function appendHistory(tx: Executor, e: NewHistoryEvent, options: { vehicleLocked?: boolean } = {}): Promise<HistoryRow> {
  // A caller that already holds the vehicle row (select … for update) saves a round trip.
  if (!options.vehicleLocked) await tx.execute(sql`select 1 from ${vehicles} where ${vehicles.id} = ${e.vehicleId} for update`)
  const [last] = await tx
    .select({ seq: historyEvents.seq, hash: historyEvents.hash })
    .from(historyEvents)
    .where(eq(historyEvents.vehicleId, e.vehicleId))
    .orderBy(desc(historyEvents.seq))
    .limit(1)
  const row = linked(unhashed(e.vehicleId, (last?.seq ?? 0) + 1, e), last?.hash ?? GENESIS_HASH)
  const [inserted] = await tx.insert(historyEvents).values(row).returning()
  return inserted!
}

/** A new vehicle's whole chain at once, from the genesis hash — for bulk loads such as the demo yard. */
export function chainFromStart(vehicleId: string, events: Omit<NewHistoryEvent, 'vehicleId'>[]) {
  let prevHash = GENESIS_HASH
  return events.map((e, i) => {
    const row = linked(unhashed(vehicleId, i + 1, e), prevHash)
    prevHash = row.hash
    return row
  })
}

export function historyOf(db: Executor, vehicleId: string) {
  return db.select().from(historyEvents).where(eq(historyEvents.vehicleId, vehicleId)).orderBy(asc(historyEvents.seq))
}

export interface ChainCheck {
  ok: boolean
  events: number
  /** The first event whose stored hash or link does not match its content. */
  brokenAt?: { seq: number; reason: string }
}

export function verifyChain(rows: HistoryRow[]): ChainCheck {
  let prev = GENESIS_HASH
  for (const [i, row] of rows.entries()) {
    if (row.seq !== i + 1) return { ok: false, events: rows.length, brokenAt: { seq: row.seq, reason: 'an event is missing before this one' } }
    if (row.prevHash !== prev) return { ok: false, events: rows.length, brokenAt: { seq: row.seq, reason: 'it does not link to the event before it' } }
    if (eventHash(prev, row) !== row.hash) return { ok: false, events: rows.length, brokenAt: { seq: row.seq, reason: 'its content was changed after it was written' } }
    prev = row.hash
  }
  return { ok: true, events: rows.length }
}
