import type { BoardChange, LiveBus, LiveListener, SessionsEnded } from './live-bus'

/** One process, one database: changes go straight to the listeners. */
export function memoryBus(): LiveBus {
  const listeners = new Set<LiveListener>()
  return {
    async publish(change: BoardChange) {
      for (const l of [...listeners]) l.change(change)
    },
    async endSessions(ended: SessionsEnded) {
      for (const l of [...listeners]) l.sessionsEnded(ended)
    },
    subscribe(listener) {
      listeners.add(listener)
      return () => listeners.delete(listener)
    },
    async close() {
      for (const l of [...listeners]) l.closed()
      listeners.clear()
    },
  }
}
