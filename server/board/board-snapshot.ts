import { promisify } from 'node:util'
import { gzip } from 'node:zlib'
import { BOARD_COLUMNS, type BoardColumn } from '@shared/domain/lifecycle'
import type { BoardCard } from '@shared/schemas/board'
import type { BoardYard } from './board-cards'

const gzipAsync = promisify(gzip)

interface Entry {
  column: BoardColumn
  /** Arrival instant then stock number: ISO instants sort as text. */
  order: string
  /** The card's JSON, encoded once: joining 2,000 strings and encoding the result costs more than the rest. */
  bytes: Buffer
}

const COMMA = Buffer.from(',')

/**
 * One yard's board, each card kept as its own JSON bytes: a change re-serialises one card, and the
 * response body is a concatenation of bytes made once per change, not a JSON.stringify of 2,000 objects per request.
 */
export class BoardSnapshot {
  private readonly entries = new Map<string, Entry>()
  private readonly head: string
  private joined: BoardBody | null = null
  private parsed: readonly BoardCard[] | null = null

  private readonly yardId: string

  constructor(
    /** The time bucket it was computed in: balances and days move with the clock. */
    readonly bucket: number,
    yard: BoardYard,
    readonly asOf: Date,
    cards: readonly BoardCard[],
  ) {
    this.yardId = yard.id
    this.head = `"yard":${JSON.stringify({ id: yard.id, name: yard.name, timeZone: yard.timeZone })},"asOf":"${asOf.toISOString()}"`
    for (const card of cards) this.put(card)
  }

  put(card: BoardCard): void {
    this.entries.set(card.id, { column: card.state as BoardColumn, order: card.arrivedAt + card.stockNumber, bytes: Buffer.from(JSON.stringify(card)) })
    this.joined = null
    this.parsed = null
  }

  /** Every card, parsed once per change from its text and shared: callers read them and never change them. */
  cards(): readonly BoardCard[] {
    this.parsed ??= [...this.entries.values()].map((e) => JSON.parse(e.bytes.toString()) as BoardCard)
    return this.parsed
  }

  remove(vehicleId: string): void {
    if (this.entries.delete(vehicleId)) this.joined = this.parsed = null
  }

  /** The GET /api/board body; `eventId` is the last live event it already includes. */
  body(eventId: string): BoardBody {
    if (this.joined?.eventId === eventId) return this.joined
    const byColumn = new Map<BoardColumn, Entry[]>(BOARD_COLUMNS.map((c) => [c, []]))
    for (const e of this.entries.values()) byColumn.get(e.column)?.push(e)
    const parts: Buffer[] = [Buffer.from(`{"eventId":${JSON.stringify(eventId)},${this.head},"columns":[`)]
    BOARD_COLUMNS.forEach((c, i) => {
      const cards = byColumn.get(c)!.sort((a, b) => (a.order < b.order ? -1 : a.order > b.order ? 1 : 0))
      parts.push(Buffer.from(`${i > 0 ? ',' : ''}{"column":"${c}","cards":[`))
      cards.forEach((e, j) => (j > 0 ? parts.push(COMMA, e.bytes) : parts.push(e.bytes)))
      parts.push(Buffer.from(']}'))
    })
    parts.push(Buffer.from(']}'))
    const json = Buffer.concat(parts)
    this.joined = new BoardBody(json, eventId, `W/"${this.yardId}.${this.bucket}.${eventId}"`)
    return this.joined
  }
}

/**
 * One board body, with a validator (a board that has it already gets 304) and its gzip made once,
 * off the event loop, for the browsers that ask: 2,000 cards are about 1.4 MB of JSON, a tenth gzipped.
 */
export class BoardBody {
  private compressed: Promise<Buffer> | undefined

  constructor(
    readonly json: Buffer,
    readonly eventId: string,
    readonly etag: string,
  ) {}

  gzip(): Promise<Buffer> {
    this.compressed ??= gzipAsync(this.json, { level: 1 })
    return this.compressed
  }
}
