import { eq } from 'drizzle-orm'
import type { Database, Tx } from '@db/client'
import { appendEvents, type HistoryKey, type NewHistoryEvent } from '@db/history'
import { vehicles } from '@db/schema'
import type { BoardCard } from '@shared/schemas/board'
import type { HistoryKind } from '@shared/schemas/history'
import type { User } from '@shared/schemas/users'
import { conflict, type AppError, said } from '../errors'
import type { BoardNotifier } from '../live/index'
import { vehicleById, vehicleForUser, type VehicleRow, type YardRow } from './vehicles.queries'

/** What changing a vehicle needs: the database and the boards to tell. createApp makes the one of the app. */
export interface VehicleChanges {
  db: Database
  boards: BoardNotifier
  /** Seals each history event and the vehicle's head (db/history.ts). */
  historyKey: HistoryKey
  /**
   * The instant a change is made at, read once per change: the wall clock unless given. The demo
   * loader drives the same services through a few simulated weeks with its own clock.
   */
  clock?: () => Date
}

/** One event of a change for the vehicle's history; who made it comes from the change. */
export type HistoryEntry = Omit<NewHistoryEvent, 'vehicleId' | 'actorId' | 'actorLabel'>

/** Vehicle columns a change may set; the version and updatedAt are the unit's own. */
export type VehicleColumns = Partial<Omit<typeof vehicles.$inferInsert, 'id' | 'yardId' | 'version' | 'updatedAt' | 'createdAt'>>

/** What the work of a change is handed: the transaction, and where to write what it did. */
export interface ChangeScope {
  tx: Tx
  vehicleId: string
  actor: User
  /** The instant of this change (the changes' clock): its history events' time unless they say another. */
  now: Date
  /** An event for the history, appended in this transaction once the work is done. */
  record(event: HistoryEntry): void
}

export interface VehicleWork extends ChangeScope {
  /** The vehicle as it was when it was locked, and its yard. */
  vehicle: VehicleRow
  yard: YardRow
  /** Vehicle columns to change, written together with the version bump. */
  set(columns: VehicleColumns): void
}

export interface ChangeOptions {
  /** The version the person saw. Another one is a 409: a change is never made over someone else's. */
  expectedVersion?: number
  /** That 409 in words that fit the screen, instead of the general ones. */
  stale?: (locked: { tx: Tx; vehicle: VehicleRow; yard: YardRow }) => AppError | Promise<AppError>
  /** After the commit: the vehicle's new board card, built once for the caller's answer and the boards. */
  card?: (db: Database, yard: YardRow) => Promise<BoardCard | undefined>
}

export interface Changed<T> {
  result: T
  /** The vehicle's version now: one more than before, or the same when the work recorded nothing. */
  version: number
  changed: boolean
  card?: BoardCard
}

const staleVersion = (version: number) =>
  conflict('Someone else changed this vehicle after you opened it. Reload to see their change, then try again.', said('vehicleStale', undefined, { version }))

function collector() {
  const events: HistoryEntry[] = []
  return { events, record: (e: HistoryEntry) => void events.push(e) }
}

/**
 * THE way to change a vehicle. In one transaction: lock the vehicle row (a vehicle of another
 * company is "not found"), refuse a stale `expectedVersion`, run the work, then — if it recorded
 * anything — write its column changes with the version bumped and append its history events.
 * After the commit the boards hear of it. Work that records nothing changes nothing: no bump, no
 * event, no board message (a second tap on something already done). Work that throws leaves no trace.
 */
export async function changeVehicle<T>(
  changes: VehicleChanges,
  actor: User,
  vehicleId: string,
  work: (w: VehicleWork) => Promise<T>,
  options: ChangeOptions = {},
): Promise<Changed<T>> {
  const who = { id: actor.id, label: actor.name }
  return change(changes, who, vehicleId, (tx) => vehicleForUser(tx, actor.id, vehicleId, true), (w) => work({ ...w, actor }), options)
}

/** What an owner's change is handed: the same as staff work, without a staff member behind it. */
export type OwnerWork = Omit<VehicleWork, 'actor'>

/**
 * The same unit of work for a change the vehicle's owner makes from their page (no account): the
 * caller has already proved, by the owner link, which vehicle this is. The history names the owner
 * by `label` with no staff id.
 */
export async function changeVehicleAsOwner<T>(
  changes: VehicleChanges,
  label: string,
  vehicleId: string,
  work: (w: OwnerWork) => Promise<T>,
): Promise<Changed<T>> {
  return change(changes, { id: null, label }, vehicleId, (tx) => vehicleById(tx, vehicleId, true), work, {})
}

type Who = { id: string | null; label: string }

async function change<T>(
  changes: VehicleChanges,
  who: Who,
  vehicleId: string,
  lock: (tx: Tx) => Promise<{ vehicle: VehicleRow; yard: YardRow }>,
  work: (w: OwnerWork) => Promise<T>,
  options: ChangeOptions,
): Promise<Changed<T>> {
  const now = changes.clock?.() ?? new Date()
  const done = await changes.db.transaction(async (tx) => {
    const { vehicle, yard } = await lock(tx)
    if (options.expectedVersion !== undefined && options.expectedVersion !== vehicle.version) {
      throw await (options.stale?.({ tx, vehicle, yard }) ?? staleVersion(vehicle.version))
    }
    const { events, record } = collector()
    let columns: VehicleColumns = {}
    const result = await work({ tx, vehicleId, vehicle, yard, now, record, set: (c) => void (columns = { ...columns, ...c }) })
    if (events.length === 0) {
      if (Object.keys(columns).length > 0) throw new Error('A change to a vehicle must say in its history what it changed.')
      return { result, yard, version: vehicle.version, cause: null }
    }
    // The row is locked, so the version read above is still the row's.
    await tx.update(vehicles).set({ ...columns, version: vehicle.version + 1, updatedAt: now }).where(eq(vehicles.id, vehicleId))
    await appendAll(tx, changes.historyKey, vehicleId, who, events, now, false)
    return { result, yard, version: vehicle.version + 1, cause: events[0]!.kind }
  })
  if (!done.cause) return { result: done.result, version: done.version, changed: false }
  const card = await tellBoards(changes, { yard: done.yard, vehicleId, cause: done.cause }, options.card)
  return { result: done.result, version: done.version, changed: true, card }
}

/**
 * A vehicle's first change: its creation. There is no row to lock yet: the work inserts the vehicle
 * with `vehicleId` in `yard` and records the events its history starts with; the unit appends them
 * in the same transaction and, after the commit, tells the boards.
 */
export async function createVehicle<T>(
  changes: VehicleChanges,
  actor: User,
  yard: YardRow,
  vehicleId: string,
  work: (scope: ChangeScope) => Promise<T>,
): Promise<T> {
  const now = changes.clock?.() ?? new Date()
  const done = await changes.db.transaction(async (tx) => {
    const { events, record } = collector()
    const result = await work({ tx, vehicleId, actor, now, record })
    if (events.length === 0) throw new Error('A new vehicle starts its history with how it came in.')
    await appendAll(tx, changes.historyKey, vehicleId, { id: actor.id, label: actor.name }, events, now, true)
    return { result, cause: events[0]!.kind }
  })
  await tellBoards(changes, { yard, vehicleId, cause: done.cause })
  return done.result
}

// The vehicle row is held (locked, or new and seen by no other transaction): no second lock, and the change's events go in together.
async function appendAll(tx: Tx, key: HistoryKey, vehicleId: string, who: Who, events: HistoryEntry[], now: Date, newVehicle: boolean) {
  await appendEvents(tx, key, vehicleId, events.map((e) => ({ ...e, at: e.at ?? now, actorId: who.id, actorLabel: who.label })), { newVehicle })
}

async function tellBoards(
  changes: VehicleChanges,
  change: { yard: YardRow; vehicleId: string; cause: HistoryKind },
  cardOf?: ChangeOptions['card'],
): Promise<BoardCard | undefined> {
  let card: BoardCard | undefined
  try {
    card = await cardOf?.(changes.db, change.yard)
  } finally {
    // Even when the card could not be built, the boards hear of a change that has committed (they read it themselves).
    await changes.boards.changed({ yardId: change.yard.id, vehicleId: change.vehicleId, cause: change.cause, card })
  }
  return card
}
