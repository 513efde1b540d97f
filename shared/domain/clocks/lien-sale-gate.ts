import { stepWords } from '../../messages/rule-words'
import type { ClockAlert, Deadline } from './clock-events'

/**
 * Why the gate is open or shut, for a screen to word: open; not before a date; a step not yet
 * started; something done too early; a notice too old to cover a sale now; the value or model year
 * missing; no branch of the rule set fitting the vehicle; no sale date in the rule set at all.
 */
export type LienSaleGateCode =
  | 'open' | 'not-before' | 'waiting' | 'too-early' | 'expired' | 'needs-value' | 'needs-model-year' | 'no-branch' | 'no-sale-date'

/** Whether the law already lets the yard sell or dispose of the vehicle, from its legal clocks. */
export interface LienSaleGate {
  open: boolean
  /** The first day a sale or disposal may be held, once every clock it waits for has started. */
  date: string | null
  why: string
  code: LienSaleGateCode
  /** Once there is a date: the "not before" step that sets it, and that step's citation. */
  step?: string
  citation?: string
  /** The step and its citation in Spanish, where the rule set has them. */
  es?: { step?: string; citation?: string }
}

const shut = (code: LienSaleGateCode, why: string): LienSaleGate => ({ open: false, date: null, why, code })

/**
 * A sale or disposal is allowed once every "not before" date of the branch that applies has been
 * reached (the sale's own dates and the steps before it: a notice mailed early enough, a posting, an
 * advertisement), none of them done too early, and no "sale by" date of the branch has passed (a
 * notice too old to cover a sale today). A clock that has not started keeps it shut; so does a
 * step waiting for the value or the model year, and a vehicle no branch fits.
 */
export function lienSaleGate(deadlines: readonly Deadline[], alerts: readonly ClockAlert[] = []): LienSaleGate {
  const noBranch = alerts.find((a) => a.code === 'no-branch')
  if (noBranch) return shut('no-branch', noBranch.message)
  const needing = deadlines.find((d) => d.status === 'needs-information')
  if (needing) return shut(needing.needs === 'model-year' ? 'needs-model-year' : 'needs-value', needing.statusReason)
  const notBefore = deadlines.filter((d) => d.kind === 'earliest')
  if (!notBefore.some((d) => d.doneBy.event === 'lien-sale-held')) return shut('no-sale-date', 'The rule set sets no lien-sale date for this vehicle.')
  const tooEarly = notBefore.find((d) => d.status === 'missed')
  if (tooEarly) return shut('too-early', `${tooEarly.label}: ${tooEarly.statusReason}`)
  const waiting = notBefore.find((d) => !d.dueDate || d.status === 'not-started')
  if (waiting) return shut('waiting', `${waiting.label}: ${waiting.statusReason}`)
  const expired = deadlines.find((d) => d.kind === 'deadline' && d.doneBy.event === 'lien-sale-held' && d.status === 'missed')
  if (expired) return shut('expired', `${expired.label}: ${expired.dueDate} has passed (${expired.explanation}) Start that step again.`)
  // The last "not before" date decides; of steps ending the same day, the sale's own date names the rule.
  const last = notBefore.reduce((a, b) => (b.dueDate! > a.dueDate! || (b.dueDate === a.dueDate && b.doneBy.event === 'lien-sale-held') ? b : a))
  const date = last.dueDate!
  const open = notBefore.every((d) => d.status === 'reached' || d.status === 'met')
  const es = stepWords(last)
  const rule = { step: last.label, citation: last.source.citation, ...(es ? { es: { step: es.label, citation: es.citation } } : {}) }
  return open ? { open, date, why: `Open since ${date}.`, code: 'open', ...rule } : { open, date, why: `Not before ${date}.`, code: 'not-before', ...rule }
}
