import { BOARD_COLUMNS, type BoardColumn } from '../../shared/domain/columns'
import type { BoardCard } from '../../shared/schemas/board'
import type { BoardYard } from './board-cards'

interface Entry {
  column: BoardColumn
  /** Arrival instant then stock number: ISO instants sort as text. */
  order: string
  json: string
}

/**
 * One yard's board, each card kept as its own JSON text: a change re-serialises one card, and the
 * response body is a join of texts made once per change, not a JSON.stringify of 2,000 objects per request.
 */
export class BoardSnapshot {
  private readonly entries = new Map<string, Entry>()
  private readonly head: string
  private joined: { eventId: string; body: Buffer } | null = null

  constructor(
    /** The time bucket it was computed in: balances and days move with the clock. */
    readonly bucket: number,
    yard: BoardYard,
    asOf: Date,
    cards: readonly BoardCard[],
  ) {
    this.head = `"yard":${JSON.stringify({ id: yard.id, name: yard.name, timeZone: yard.timeZone })},"asOf":"${asOf.toISOString()}"`
    for (const card of cards) this.put(card)
  }

  put(card: BoardCard): void {
    this.entries.set(card.id, { column: card.state as BoardColumn, order: card.arrivedAt + card.stockNumber, json: JSON.stringify(card) })
    this.joined = null
  }

  remove(vehicleId: string): void {
    if (this.entries.delete(vehicleId)) this.joined = null
  }

  /** The GET /api/board body; `eventId` is the last live event it already includes. */
  body(eventId: string): Buffer {
    if (this.joined?.eventId === eventId) return this.joined.body
    const byColumn = new Map<BoardColumn, Entry[]>(BOARD_COLUMNS.map((c) => [c, []]))
    for (const e of this.entries.values()) byColumn.get(e.column)?.push(e)
    const columns = BOARD_COLUMNS.map((c) => {
      const cards = byColumn.get(c)!.sort((a, b) => (a.order < b.order ? -1 : a.order > b.order ? 1 : 0))
      return `{"column":"${c}","cards":[${cards.map((e) => e.json).join(',')}]}`
    })
    const body = Buffer.from(`{"eventId":${JSON.stringify(eventId)},${this.head},"columns":[${columns.join(',')}]}`)
    this.joined = { eventId, body }
    return body
  }
}
