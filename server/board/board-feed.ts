import type { BoardEvent } from '@shared/schemas/board'

export interface FeedMessage {
  id: string
  data: string
}

export interface FeedClient {
  send(message: FeedMessage): void
  end(): void
}

/**
 * One yard's live events in order, with the last few hundred kept so a reconnecting board
 * (EventSource sends Last-Event-ID) gets what it missed. Ids are "<server epoch>.<sequence>":
 * an id from another server or an older run cannot be replayed, and that board starts over.
 */
export class BoardFeed {
  readonly clients = new Set<FeedClient>()
  private seq = 0
  private readonly recent: { seq: number; data: string }[] = []

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
    const message = { id: this.lastId, data }
    for (const c of [...this.clients]) c.send(message)
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
