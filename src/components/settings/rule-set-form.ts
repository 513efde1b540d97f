import type { RuleSetInput } from '@shared/schemas/rule-sets'

/** What every section of the rule-set form shares: the draft it edits, the schema's messages, read-only. */
export interface RuleSetSectionProps {
  errors: Record<string, string>
  readOnly: boolean
}
export type Draft = RuleSetInput

/** The schema's message for a path of the rule set (the form's errors are keyed "ruleSet.<path>"). */
export const errorAt = (props: { errors: Record<string, string> }) => (path: string) => props.errors[`ruleSet.${path}`]

export const blankSource = () => ({ citation: '', confidence: 'none' as const })

/** A code no other item of the list has: `fee-1`, `fee-2`… (codes are kebab-case, unique in the rule set). */
export function freshCode(prefix: string, taken: readonly { code: string }[]) {
  let n = taken.length + 1
  while (taken.some((x) => x.code === `${prefix}-${n}`)) n++
  return `${prefix}-${n}`
}

// The Spanish beside an English word (issue 14); an empty box means none, and the English shows.
export type WithSpanish = { es?: { [key: string]: string | undefined } | undefined }
export const spanish = (item: WithSpanish, key: string) => item.es?.[key] ?? ''
export const setSpanish = (item: WithSpanish, key: string, value: string) => (item.es = { ...item.es, [key]: value })

/** A calendar as one option value ("US/CA", "US"): date-holidays' country and, where it has one, state. */
export const calendarValue = (key: { country: string; state?: string | undefined }) => (key.state ? `${key.country}/${key.state}` : key.country)
export function calendarKey(value: string): { country: string; state?: string } {
  const [country = '', state] = value.split('/')
  return state ? { country, state } : { country }
}
