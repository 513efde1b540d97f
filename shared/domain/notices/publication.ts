import type { NoticePlanStatus } from '../../schemas/notices'
import type { LegalClocks } from '../clocks/clock-events'
import { statusOf, words } from './planned-notices'

/** The event a newspaper publication records: its first day in print starts and meets the clocks. */
export const PUBLICATION_EVENT = 'sale-advertised' as const

export interface PlannedPublication {
  kind: 'publication'
  status: NoticePlanStatus
  /** Publish by the end of this day (e.g. 5 days before the sale), if the rule set says. */
  dueDate: string | null
  /** Not before this day (e.g. 20 days before the sale), if the rule set says. */
  opensOn: string | null
  /** When the first publication was recorded, if it was. */
  publishedAt: string | null
  label: string
  citation: string
  es?: { label?: string; citation?: string }
}

/**
 * The newspaper publication (advertisement) a vehicle's clocks ask for — California Civ. Code § 3071's
 * "advertise the sale 5 to 20 days before it" for a vehicle valued over $4,000 in the sample — read from
 * the rule set's own timeline as the letters are: planned when a step of the branch that applies is met
 * by the publication or starts from it; null when the branch has no such step.
 */
export function plannedPublication(clocks: Pick<LegalClocks, 'deadlines'>, today: string): PlannedPublication | null {
  const event = PUBLICATION_EVENT
  const steps = clocks.deadlines.filter((d) => d.doneBy.event === event || d.start.event === event)
  if (steps.length === 0) return null
  const due = steps.find((d) => d.kind === 'deadline' && d.doneBy.event === event)
  const opens = steps.find((d) => d.kind === 'earliest' && d.doneBy.event === event)
  const publishedAt = steps.map((d) => (d.doneBy.event === event ? d.doneBy.at : d.start.at)).find((at) => at !== undefined) ?? null
  const main = due ?? opens ?? steps[0]!
  return { kind: 'publication', status: statusOf(due, opens, publishedAt, today), dueDate: due?.dueDate ?? null, opensOn: opens?.dueDate ?? null, publishedAt, label: main.label, citation: main.source.citation, ...words(main) }
}
