import type { BoardEvent } from '@shared/schemas/board'

export interface FeedMessage {
  id: string
  data: string
}

export interface FeedClient {
  /** Server-Sent Events text, one or more whole events: the same bytes go to every board of the yard. */
  write(chunk: Buffer | string): void
  end(): void
}

/** How long events gather before they go out together: a board a quarter of a second late is still live. */
export const FLUSH_MS = 250

/** One event as the stream carries it. */
const sseEvent = (m: FeedMessage) => `id: ${m.id}\ndata: ${m.data}\n\n`

/**
 * One yard's live events in order, with the last few hundred kept so a reconnecting board
 * (EventSource sends Last-Event-ID) gets what it missed. Ids are "<server epoch>.<sequence>":
 * an id from another server or an older run cannot be replayed, and that board starts over.
 * Events that arrive within `FLUSH_MS` go to each board as one write: with 500 boards open, a
 * write per board per event is most of what a busy yard's server does.
 */
export class BoardFeed {
  readonly clients = new Set<FeedClient>()
  private seq = 0
  private readonly recent: { seq: number; data: string }[] = []
  private pending: string[] = []
  private timer: NodeJS.Timeout | undefined

  constructor(
    private readonly epoch: string,
    private readonly keep = 500,
  ) {}

  get lastId(): string {
    return `${this.epoch}.${this.seq}`
  }

  push(event: BoardEvent): void {
    const data = JSON.stringify(event)
    this.seq += 1
    this.recent.push({ seq: this.seq, data })
    if (this.recent.length > this.keep) this.recent.shift()
    this.pending.push(sseEvent({ id: this.lastId, data }))
    this.timer ??= setTimeout(() => this.flush(), FLUSH_MS).unref()
  }

  /** Sends what has gathered to every board now (and stops the timer: a closing server calls it last). */
  flush(): void {
    clearTimeout(this.timer)
    this.timer = undefined
    if (this.pending.length === 0) return
    const chunk = Buffer.from(this.pending.join(''))
    this.pending = []
    for (const c of [...this.clients]) c.write(chunk)
  }

  /**
   * Adds a board: first what it missed since `lastId` (or, when that cannot be known, word to start
   * over), then every event as it goes out. Events still gathering go out to the others first, so
   * the new board hears each event once.
   */
  add(client: FeedClient, lastId?: string): void {
    this.flush()
    if (lastId) {
      const missed = this.since(lastId)
      client.write(missed ? missed.map(sseEvent).join('') : sseEvent(this.resyncMessage()))
    }
    this.clients.add(client)
  }

  /** What a board that last saw `lastId` missed; null when that cannot be known. */
  since(lastId: string): FeedMessage[] | null {
    const [epoch, seqText] = lastId.split('.')
    const seen = Number(seqText)
    if (epoch !== this.epoch || !Number.isInteger(seen) || seen > this.seq) return null
    if (seen === this.seq) return []
    const oldest = this.recent[0]?.seq ?? this.seq + 1
    if (seen + 1 < oldest) return null
    return this.recent.filter((m) => m.seq > seen).map((m) => ({ id: `${this.epoch}.${m.seq}`, data: m.data }))
  }

  /** A message for one board only: start over from a fresh GET /api/board. */
  resyncMessage(): FeedMessage {
    return { id: this.lastId, data: JSON.stringify({ type: 'resync' }) }
  }
}
