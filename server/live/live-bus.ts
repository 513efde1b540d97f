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

export interface LiveListener {
  change(change: BoardChange): void
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
  subscribe(listener: LiveListener): () => void
  close(): Promise<void>
}
