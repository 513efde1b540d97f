import type { Locale } from './locales'

/**
 * A rule set's own words (a step's label, a fee's name, a citation, a note) are written in English with
 * the other languages beside them: `{ label, es: { label } }`. The reader's language wins where it has
 * words; where it has none the English shows, so a rule set written before the Spanish keeps working.
 * The client (the reader's language) and the server (the recipient's, on letters and e-mails) both pick here.
 */
export type Worded = { es?: object | undefined }

export function ruleWords<T extends Worded>(item: T, lng: Locale): T {
  if (lng === 'en') return item
  const own = item[lng]
  if (!own) return item
  let picked: T | undefined
  for (const [key, value] of Object.entries(own)) {
    if (typeof value !== 'string' || !value.trim() || typeof (item as Record<string, unknown>)[key] !== 'string') continue
    picked ??= { ...item }
    ;(picked as Record<string, unknown>)[key] = value
  }
  return picked ?? item
}

/** One of an item's words in the reader's language: `ruleWord(step, 'label', 'es')`. */
export function ruleWord<T extends Worded, K extends keyof T & string>(item: T, key: K, lng: Locale): T[K] {
  return ruleWords(item, lng)[key]
}

/**
 * A rule set's name and caution as a response carries them (`ruleSetTitleSchema`), with the Spanish of each
 * beside the English where the rule set has it.
 */
export function ruleSetTitle(ruleSet: { name: string; caution: string; es?: { name?: string | undefined; caution?: string | undefined } | undefined }): {
  name: string
  caution: string
  es?: { name?: string; caution?: string }
} {
  const name = ruleSet.es?.name
  const caution = ruleSet.es?.caution
  if (!name && !caution) return { name: ruleSet.name, caution: ruleSet.caution }
  return { name: ruleSet.name, caution: ruleSet.caution, es: { ...(name ? { name } : {}), ...(caution ? { caution } : {}) } }
}

/**
 * A step's Spanish label and citation as a response carries them beside the English (`es`), or
 * undefined when the rule set has neither: the client picks with `ruleWords` in its reader's language.
 */
export function stepWords(step: { es?: { label?: string } | undefined; source: { es?: { citation?: string } | undefined } }): { label?: string; citation?: string } | undefined {
  const label = step.es?.label
  const citation = step.source.es?.citation
  if (!label && !citation) return undefined
  return { ...(label ? { label } : {}), ...(citation ? { citation } : {}) }
}
