import type { BoardCard } from '@shared/schemas/board'
import type { BoardChange, SessionsEnded } from './live-bus'

export { boardChangeSchema, sessionKey, type BoardChange, type LiveBus, type LiveListener, type SessionsEnded } from './live-bus'
export { memoryBus } from './memory-bus'
export { postgresBus } from './postgres-bus'

/** A change this server made to a vehicle; a caller that already holds the vehicle's new card passes it. */
export type VehicleChange = Omit<BoardChange, 'origin'> & { card?: BoardCard }

/**
 * Tells every open board (on every app server) that a vehicle changed. Called after the change has
 * committed; it never throws, for what it announces has already happened. createApp hands the one
 * notifier of the app (its board hub) to whatever changes vehicles.
 */
export interface BoardNotifier {
  changed(change: VehicleChange): Promise<void>
  sessionsEnded(ended: SessionsEnded): Promise<void>
}
