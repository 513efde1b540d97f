import type { LegalClocks } from './clock-events'
import { type LienSaleGate, lienSaleGate } from './lien-sale-gate'
import { dayFromIsoDate, isoDate } from '../time/calendar-dates'

/**
 * Why a proposed lien-sale day is earlier than the law allows, from the clocks worked WITH that day
 * recorded as the sale date ("sale-scheduled"), or null when it is allowed:
 * - every "not before" date of the sale that does not hang on the sale date itself (the owners'
 *   time to oppose, so many days after the notice of sale or the advertisement) must have come by
 *   then — the same steps the lien-sale gate waits for;
 * - every step the rule set wants done some days BEFORE the sale (the notice of sale mailed 20 days
 *   before it, the advertisement 5 days before) must still be possible: done already in time, or
 *   its last day not yet past today.
 * `today` is the yard's calendar day. The answer names the step, its citation and its date (for a "not
 * before" step the first day it allows; for a step before the sale, the last day it could be done).
 * Only "too early" is judged here; a sale later than a notice
 * covers is the gate's "expired" when the sale comes.
 */
export function saleDayTooEarly(clocks: Pick<LegalClocks, 'deadlines'>, saleDay: string, today: string): { step: string; citation: string; date: string } | null {
  if (saleDay < today) return { step: 'The sale date', citation: '', date: today }
  for (const d of clocks.deadlines) {
    if (d.kind === 'earliest' && d.doneBy.event === 'lien-sale-held' && d.start.event !== 'sale-scheduled' && d.dueDate && d.dueDate > saleDay) {
      return { step: d.label, citation: d.source.citation, date: d.dueDate }
    }
    if (d.kind === 'deadline' && d.start.event === 'sale-scheduled' && d.direction === 'before' && d.dueDate) {
      const late = d.doneBy.at ? d.status === 'missed' : d.dueDate < today
      if (late) return { step: d.label, citation: d.source.citation, date: d.dueDate }
    }
  }
  return null
}

/**
 * Why no sale date can be set yet, or null when one can: the branch sets no lien-sale date at all,
 * no branch fits the vehicle, or a step waits for the value or the model year (the gate's words).
 */
export function saleDateBlocked(clocks: Pick<LegalClocks, 'deadlines' | 'alerts'>): LienSaleGate | null {
  const gate = lienSaleGate(clocks.deadlines, clocks.alerts)
  return gate.code === 'no-sale-date' || gate.code === 'no-branch' || gate.code === 'needs-value' || gate.code === 'needs-model-year' ? gate : null
}

/**
 * The first day from `today` on that `saleDayTooEarly` allows, trying each day with the clocks worked
 * for it by `clocksFor` (the core's own counting: business days, closed post offices). Null when none
 * within `horizonDays` (a step that has not started, e.g. the state's notice not yet mailed, cannot say).
 */
export function earliestSaleDay(clocksFor: (saleDay: string) => Pick<LegalClocks, 'deadlines'>, today: string, horizonDays = 400): string | null {
  const first = dayFromIsoDate(today)
  for (let n = 0; n <= horizonDays; n++) {
    const day = isoDate(first + n)
    if (!saleDayTooEarly(clocksFor(day), day, today)) return day
  }
  return null
}
