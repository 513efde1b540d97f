import { createHash } from 'node:crypto'
import { z } from 'zod'

/** Something about one vehicle on a yard's board changed; every app server refreshes that card. */
export const boardChangeSchema = z.object({
  yardId: z.uuid(),
  vehicleId: z.uuid(),
  /** What happened, for logs: moved, towed_in, hold, payment… */
  cause: z.string().max(40),
  /** The app server that published it: it has already applied the change itself. */
  origin: z.string().max(40),
})
export type BoardChange = z.infer<typeof boardChangeSchema>

/**
 * Sessions that ended — one signed out, or every session of a user who was deactivated, given a
 * new role or a new password — so that every app server ends their open streams at once.
 * A session goes by `sessionKey(sid)`: the id itself, a bearer credential, never leaves the server.
 */
export const sessionsEndedSchema = z.union([z.object({ sessionKey: z.string().min(1).max(64) }).strict(), z.object({ userId: z.uuid() }).strict()])
export type SessionsEnded = z.infer<typeof sessionsEndedSchema>

export const sessionKey = (sid: string) => createHash('sha256').update(sid).digest('base64url').slice(0, 32)

export interface LiveListener {
  change(change: BoardChange): void
  sessionsEnded(ended: SessionsEnded): void
  /** Messages may have been missed (the connection to the database dropped): start over. */
  lost(): void
  /** The bus is shutting down. */
  closed(): void
}

/**
 * Fan-out of board changes between app servers. In-process for one server on the embedded
 * database; PostgreSQL LISTEN/NOTIFY when several servers share one database (DESIGN.md "Scale").
 * Publish after the change has committed: a listener reads the database as soon as it hears.
 */
export interface LiveBus {
  publish(change: BoardChange): Promise<void>
  /** Every server's listeners hear it, this one's too. */
  endSessions(ended: SessionsEnded): Promise<void>
  subscribe(listener: LiveListener): () => void
  close(): Promise<void>
}
