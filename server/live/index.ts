import type { Executor } from '@db/client'
import type { BoardCard } from '@shared/schemas/board'
import type { BoardChange, SessionsEnded } from './live-bus'

export { boardChangeSchema, sessionKey, type BoardChange, type LiveBus, type LiveListener, type SessionsEnded } from './live-bus'
export { memoryBus } from './memory-bus'
export { postgresBus } from './postgres-bus'

/**
 * The yard is looked up from the vehicle when the caller does not have it at hand; a caller that
 * already holds the vehicle's new card passes it, and this server's boards use it as it is.
 */
export type VehicleChange = Omit<BoardChange, 'origin' | 'yardId'> & { yardId?: string; card?: BoardCard }

export interface BoardNotifier {
  changed(change: VehicleChange): Promise<void>
  sessionsEnded(ended: SessionsEnded): Promise<void>
}

// One board hub per app (createApp registers it against its database), so a service that only
// holds the database can still tell the boards — one call, no extra parameter through every layer.
const notifiers = new WeakMap<object, BoardNotifier>()

export function registerBoardNotifier(db: Executor, notifier: BoardNotifier): void {
  notifiers.set(db, notifier)
}

/**
 * Tells every open board (on every app server) that a vehicle changed: moved, towed in, held,
 * paid. Call it after the change has committed, with the database rather than the transaction.
 * It never throws: what it announces has already happened.
 */
export async function boardChanged(db: Executor, change: VehicleChange): Promise<void> {
  await notifiers.get(db)?.changed(change)
}

/**
 * Ends the open board streams of a signed-out session, or of every session of a user whose
 * sessions were just deleted (endSessionsOf), on every app server. Call it after the commit.
 * It never throws: the sessions are already gone, and each stream also checks at its heartbeat.
 */
export async function sessionsEnded(db: Executor, ended: SessionsEnded): Promise<void> {
  await notifiers.get(db)?.sessionsEnded(ended)
}
