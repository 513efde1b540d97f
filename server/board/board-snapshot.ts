import { promisify } from 'node:util'
import { gzip } from 'node:zlib'
import { joinWords, splitWords } from '@shared/domain/board'
import { BOARD_COLUMNS, type BoardColumn } from '@shared/domain/lifecycle'
import type { BoardCard } from '@shared/schemas/board'
import type { BoardYard } from './board-cards'

const gzipAsync = promisify(gzip)

interface Entry {
  column: BoardColumn
  /** Arrival instant then stock number: ISO instants sort as text. */
  order: string
  /** The card's JSON without its rule-set words, encoded once: joining 2,000 strings and encoding the result costs more than the rest. */
  bytes: Buffer
  /** The keys of the words it names (shared/domain/board). */
  words: string[]
}

const COMMA = Buffer.from(',')

/**
 * One yard's board, each card kept as its own JSON bytes: a change re-serialises one card, and the
 * response body is a concatenation of bytes made once per change, not a JSON.stringify of 2,000 objects per request.
 * The rule set's words on the cards (a deadline's label and citation, in English and Spanish) go once in the
 * body's `words`, each card naming its own by key: they were most of a card's bytes.
 */
export class BoardSnapshot {
  private readonly entries = new Map<string, Entry>()
  private readonly head: string
  private joined: BoardBody | null = null
  private parsed: readonly BoardCard[] | null = null
  /** Each distinct text of words by its key and the key by its text; kept for the snapshot's life (a minute's bucket). */
  private readonly wordsByKey = new Map<string, string>()
  private readonly keyOfWords = new Map<string, string>()

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
    const words: string[] = []
    const split = splitWords(card, (text) => {
      let key = this.keyOfWords.get(text)
      if (!key) {
        key = `w${this.keyOfWords.size + 1}`
        this.keyOfWords.set(text, key)
        this.wordsByKey.set(key, text)
      }
      words.push(key)
      return key
    })
    this.entries.set(card.id, { column: card.state as BoardColumn, order: card.arrivedAt + card.stockNumber, bytes: Buffer.from(JSON.stringify(split)), words })
    this.joined = null
    this.parsed = null
  }

  /** Every card, parsed once per change from its text and shared: callers read them and never change them. */
  cards(): readonly BoardCard[] {
    if (!this.parsed) {
      const words = Object.fromEntries([...this.wordsByKey].map(([key, text]) => [key, JSON.parse(text) as unknown]))
      this.parsed = [...this.entries.values()].map((e) => {
        const card = JSON.parse(e.bytes.toString()) as BoardCard
        joinWords(card, words)
        return card
      })
    }
    return this.parsed
  }

  remove(vehicleId: string): void {
    if (this.entries.delete(vehicleId)) this.joined = this.parsed = null
  }

  /** The GET /api/board body; `eventId` is the last live event it already includes. */
  body(eventId: string): BoardBody {
    if (this.joined?.eventId === eventId) return this.joined
    const byColumn = new Map<BoardColumn, Entry[]>(BOARD_COLUMNS.map((c) => [c, []]))
    const used = new Set<string>()
    for (const e of this.entries.values()) {
      byColumn.get(e.column)?.push(e)
      for (const k of e.words) used.add(k)
    }
    const words = [...used].map((k) => `"${k}":${this.wordsByKey.get(k)!}`).join(',')
    const parts: Buffer[] = [Buffer.from(`{"eventId":${JSON.stringify(eventId)},${this.head},"words":{${words}},"columns":[`)]
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
 * off the event loop, for the browsers that ask: 2,000 cards are about 2.9 MB of JSON (npm run bench -- board), much less gzipped.
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
