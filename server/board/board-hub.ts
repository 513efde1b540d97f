import { randomUUID } from 'node:crypto'
import type { Logger } from 'pino'
import type { Database } from '@db/client'
import type { BoardCard } from '@shared/schemas/board'
import type { BoardChange, BoardNotifier, LiveBus, SessionsEnded, VehicleChange } from '../live/index'
import { activeCards, cardOf, type BoardYard } from './board-cards'
import { BoardFeed, type FeedClient } from './board-feed'
import { BoardSnapshot, type BoardBody } from './board-snapshot'
import { SessionStreams, type StreamOwner } from './session-streams'

export interface BoardHubOptions {
  /** How long a computed board is served before balances and days are worked out again. */
  bucketMs?: number
}

const noop = () => undefined

/**
 * The boards this app server shows: per yard, a cached snapshot and a live feed. A change (from
 * this server or, through the bus, from another) re-reads one card, patches the snapshot and goes
 * out on the feed. Per yard, rebuilds and changes run one after another, so a snapshot never
 * misses a change that raced it.
 */
export class BoardHub implements BoardNotifier {
  private readonly origin = randomUUID().slice(0, 8)
  private readonly bucketMs: number
  private readonly yards = new Map<string, BoardYard>()
  private readonly snapshots = new Map<string, BoardSnapshot>()
  private readonly feeds = new Map<string, BoardFeed>()
  private readonly queues = new Map<string, Promise<unknown>>()
  private readonly streams = new SessionStreams()
  private readonly unsubscribe: () => void

  constructor(
    private readonly db: Database,
    private readonly bus: LiveBus,
    private readonly log: Pick<Logger, 'warn'>,
    options: BoardHubOptions = {},
  ) {
    this.bucketMs = options.bucketMs ?? 60_000
    this.unsubscribe = bus.subscribe({
      change: (c) => c.origin !== this.origin && this.apply(c),
      sessionsEnded: (ended) => this.streams.end(ended),
      lost: () => this.startOver(),
      closed: () => this.endClients(),
    })
  }

  /**
   * A vehicle changed on this server: refresh it here at once, then tell the other servers. Never
   * throws — the change itself has committed; a board that misses it catches up within a bucket.
   */
  async changed(change: VehicleChange): Promise<void> {
    try {
      const full: BoardChange = { vehicleId: change.vehicleId, cause: change.cause, yardId: change.yardId, origin: this.origin }
      this.apply(full, change.card)
      await this.bus.publish(full)
    } catch (err) {
      this.log.warn({ err, change }, 'could not announce a board change')
    }
  }

  /** Sessions ended: their streams end here at once, then on every other server through the bus. */
  async sessionsEnded(ended: SessionsEnded): Promise<void> {
    this.streams.end(ended)
    try {
      await this.bus.endSessions(ended)
    } catch (err) {
      this.log.warn({ err }, 'could not announce the end of sessions; their streams end at their next heartbeat')
    }
  }

  /**
   * Counts a stream against its session; null when the session already has as many as it may.
   * `end` is called when the session ends; the returned function releases the stream.
   */
  holdStream(owner: StreamOwner, end: () => void): (() => void) | null {
    return this.streams.add(owner, end)
  }

  /** The board as GET /api/board sends it, after every change already heard. */
  boardBody(yard: BoardYard, now = new Date()): Promise<BoardBody> {
    return this.withSnapshot(yard, now, (snapshot) => snapshot.body(this.feed(yard.id).lastId))
  }

  /**
   * The same snapshot's cards and the instant their bills and clocks were worked out (this minute's
   * bucket): the office's reports (server/reports) read the lot from here rather than bill it again.
   */
  cards(yard: BoardYard, now = new Date()): Promise<{ asOf: Date; cards: readonly BoardCard[] }> {
    return this.withSnapshot(yard, now, (snapshot) => ({ asOf: snapshot.asOf, cards: snapshot.cards() }))
  }

  private withSnapshot<T>(yard: BoardYard, now: Date, read: (snapshot: BoardSnapshot) => T): Promise<T> {
    this.yards.set(yard.id, yard)
    return this.inOrder(yard.id, async () => {
      const bucket = Math.floor(now.getTime() / this.bucketMs)
      let snapshot = this.snapshots.get(yard.id)
      if (snapshot?.bucket !== bucket) {
        snapshot = new BoardSnapshot(bucket, yard, now, await activeCards(this.db, yard, now))
        this.snapshots.set(yard.id, snapshot)
      }
      return read(snapshot)
    })
  }

  /** A board's event stream: what it missed since `lastEventId`, then every change as it happens. */
  subscribe(yard: BoardYard, client: FeedClient, lastEventId?: string): () => void {
    this.yards.set(yard.id, yard)
    const feed = this.feed(yard.id)
    feed.add(client, lastEventId)
    return () => feed.clients.delete(client)
  }

  close(): void {
    this.unsubscribe()
    this.endClients()
  }

  private apply(change: BoardChange, known?: BoardCard): void {
    const yard = this.yards.get(change.yardId)
    // A yard whose board this server has never shown has nothing here to refresh.
    if (!yard) return
    void this.inOrder(yard.id, async () => {
      const card = known ?? (await cardOf(this.db, yard, change.vehicleId, new Date()))
      const snapshot = this.snapshots.get(yard.id)
      if (!card || card.state === 'closed') {
        snapshot?.remove(change.vehicleId)
        this.feed(yard.id).push({ type: 'removed', id: change.vehicleId })
      } else {
        snapshot?.put(card)
        this.feed(yard.id).push({ type: 'card', card })
      }
    }).catch((err) => this.log.warn({ err, change }, 'could not refresh a board card'))
  }

  private startOver(): void {
    this.snapshots.clear()
    for (const feed of this.feeds.values()) feed.push({ type: 'resync' })
  }

  private endClients(): void {
    for (const feed of this.feeds.values()) {
      feed.flush()
      for (const c of [...feed.clients]) c.end()
    }
  }

  private feed(yardId: string): BoardFeed {
    let feed = this.feeds.get(yardId)
    if (!feed) this.feeds.set(yardId, (feed = new BoardFeed(this.origin)))
    return feed
  }

  private inOrder<T>(yardId: string, task: () => Promise<T>): Promise<T> {
    const run = (this.queues.get(yardId) ?? Promise.resolve()).then(task)
    this.queues.set(yardId, run.then(noop, noop))
    return run
  }
}
