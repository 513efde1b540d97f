import type { Deadline } from './clock-events'

/** Whether the law already lets the yard sell or dispose of the vehicle, from its legal clocks. */
export interface LienSaleGate {
  open: boolean
  /** The first day a sale or disposal may be held, once its clock has started. */
  date: string | null
  why: string
}

/**
 * A sale or disposal is allowed once every "not before" date that the sale itself answers has
 * been reached; a clock that has not started (no notice mailed yet) keeps it shut.
 */
export function lienSaleGate(deadlines: readonly Deadline[]): LienSaleGate {
  const steps = deadlines.filter((d) => d.kind === 'earliest' && d.doneBy.event === 'lien-sale-held')
  if (steps.length === 0) return { open: false, date: null, why: 'The rule set sets no lien-sale date for this vehicle.' }
  const waiting = steps.find((d) => !d.dueDate || d.status === 'not-started' || d.status === 'needs-information' || d.status === 'missed')
  if (waiting) return { open: false, date: null, why: waiting.statusReason }
  const date = steps.map((d) => d.dueDate!).sort().at(-1)!
  const open = steps.every((d) => d.status === 'reached' || d.status === 'met')
  return { open, date, why: open ? `Open since ${date}.` : `Not before ${date}.` }
}
