import type { Locale } from './locales'

/**
 * A rule set's own words (a step's label, a fee's name, a citation, a note) are written in English with
 * the other languages beside them: `{ label, es: { label } }`. The reader's language wins where it has
 * words; where it has none the English shows, so a rule set written before the Spanish keeps working.
 * The client (the reader's language) and the server (the recipient's, on letters and e-mails) both pick here.
 */
export type Worded = { [key: string]: unknown; es?: { [key: string]: unknown } | undefined }

export function ruleWords<T extends Worded>(item: T, lng: Locale): T {
  if (lng === 'en') return item
  const own = item[lng]
  if (!own) return item
  let picked: T | undefined
  for (const [key, value] of Object.entries(own)) {
    if (typeof value !== 'string' || !value.trim() || typeof item[key] !== 'string') continue
    picked ??= { ...item }
    ;(picked as Record<string, unknown>)[key] = value
  }
  return picked ?? item
}

/** One of an item's words in the reader's language: `ruleWord(step, 'label', 'es')`. */
export function ruleWord<T extends Worded, K extends keyof T & string>(item: T, key: K, lng: Locale): T[K] {
  return ruleWords(item, lng)[key]
}
