/**
 * A board's rule-set words said once. A card's next deadline and police clock carry the rule set's label,
 * citation and their Spanish: the same text on every card of that rule set and step, most of a card's
 * bytes. GET /api/board sends each such text once, in `words`, and the card names it by key; the client
 * (and the server's own readers of the board) put the words back before anyone reads the card.
 */

/** The parts of a card's summary whose words are shared, and which of their fields are the words. */
const SHARED = {
  nextDeadline: ['label', 'citation', 'es'],
  policeNotice: ['label', 'es', 'source'],
} as const

type Part = keyof typeof SHARED
type Json = Record<string, unknown>

/** The field a split part keeps in place of its words. */
const WORDS_FIELD = 'words'

/**
 * The card without its shared words, and the words keyed: `keyOf` gives each distinct text its key
 * (the same text, the same key). The card is not changed.
 */
export function splitWords<T extends { summary: unknown }>(card: T, keyOf: (words: string) => string): T {
  const summary = card.summary as Json | null
  if (!summary) return card
  const out: Json = { ...summary }
  for (const part of Object.keys(SHARED) as Part[]) {
    const value = summary[part] as Json | null | undefined
    if (!value) continue
    const words: Json = {}
    const rest: Json = { ...value }
    for (const field of SHARED[part]) {
      if (field in value) words[field] = value[field]
      delete rest[field]
    }
    rest[WORDS_FIELD] = keyOf(JSON.stringify(words))
    out[part] = rest
  }
  return { ...card, summary: out }
}

/** A card as GET /api/board sent it, with its words put back from the board's `words` (changed in place). */
export function joinWords(card: unknown, words: Readonly<Record<string, unknown>>): void {
  const summary = (card as { summary?: Json | null } | null)?.summary
  if (!summary) return
  for (const part of Object.keys(SHARED) as Part[]) {
    const value = summary[part] as Json | null | undefined
    const key = value?.[WORDS_FIELD]
    if (!value || typeof key !== 'string') continue
    delete value[WORDS_FIELD]
    Object.assign(value, words[key] as Json | undefined)
  }
}

/** A board body as sent, with every card's words put back and `words` gone (changed in place). */
export function joinBoardWords(board: unknown): unknown {
  const b = board as { words?: Record<string, unknown>; columns?: { cards?: unknown[] }[] } | null
  if (!b || typeof b !== 'object' || !b.words) return board
  for (const column of b.columns ?? []) for (const card of column.cards ?? []) joinWords(card, b.words)
  delete b.words
  return board
}
