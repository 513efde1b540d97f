import type { ClockEventKind } from '../../schemas/rule-sets'
import type { NoticeKind, NoticePlanStatus, PlannedNotice } from '../../schemas/notices'
import type { Deadline, LegalClocks } from '../clocks/clock-events'
import { stepWords } from '../../messages/rule-words'

/** The clock event each letter's mailing records: the mailing day starts or meets the clocks. */
export const NOTICE_EVENTS: Record<NoticeKind, ClockEventKind> = {
  owner_notice: 'owner-notice-mailed',
  sale_notice: 'lien-notice-mailed',
  disposal_notice: 'disposal-notice-mailed',
}

const KINDS = Object.keys(NOTICE_EVENTS) as NoticeKind[]

/**
 * The letters a vehicle's legal clocks ask for, from the rule set's own timeline: a kind is planned
 * when a step of the branch that applies is met by its mailing (a deadline to mail it, a window to
 * mail it in) or starts from it. Its due date is the deadline step's; `opensOn` the "not more than
 * N days before" step's. `today` is the yard's calendar day ("2026-12-02").
 */
export function plannedNotices(clocks: Pick<LegalClocks, 'deadlines'>, today: string): PlannedNotice[] {
  const out: PlannedNotice[] = []
  for (const kind of KINDS) {
    const event = NOTICE_EVENTS[kind]
    const steps = clocks.deadlines.filter((d) => d.doneBy.event === event || d.start.event === event)
    if (steps.length === 0) continue
    const due = steps.find((d) => d.kind === 'deadline' && d.doneBy.event === event)
    const opens = steps.find((d) => d.kind === 'earliest' && d.doneBy.event === event)
    const mailedAt = steps.map((d) => (d.doneBy.event === event ? d.doneBy.at : d.start.at)).find((at) => at !== undefined) ?? null
    const main = due ?? opens ?? steps[0]!
    out.push({
      kind,
      status: statusOf(due, opens, mailedAt, today),
      dueDate: due?.dueDate ?? null,
      opensOn: opens?.dueDate ?? null,
      mailedAt,
      label: main.label,
      citation: main.source.citation,
      ...words(main),
    })
  }
  return out
}

/** Where a notice (a letter, or the newspaper publication) stands against its window. */
export function statusOf(due: Deadline | undefined, opens: Deadline | undefined, mailedAt: string | null, today: string): NoticePlanStatus {
  if (mailedAt) return due?.status === 'missed' || opens?.status === 'missed' ? 'late' : 'sent'
  // A deadline that has not started (a sale date not yet set) or a window not yet known.
  if ((due && !due.dueDate) || (opens && !opens.dueDate)) return 'not-started'
  if (opens?.dueDate && today < opens.dueDate) return 'not-yet'
  if (due?.dueDate && today > due.dueDate) return 'overdue'
  return 'due'
}

/** Notices that should go out now: the window is open and nothing has been mailed yet. */
export const isDueNow = (n: PlannedNotice) => n.status === 'due' || n.status === 'overdue'

/**
 * The first day the yard may sell or dispose of the vehicle once this notice is mailed: the latest
 * "not before" date of the sale that the clocks can already work out. Null when none can be.
 */
export function nextStepDate(clocks: Pick<LegalClocks, 'deadlines'>): string | null {
  const dates = clocks.deadlines
    .filter((d) => d.kind === 'earliest' && d.doneBy.event === 'lien-sale-held' && d.dueDate)
    .map((d) => d.dueDate!)
    .sort()
  return dates.at(-1) ?? null
}

/** A step's Spanish label and citation beside the English, where the rule set has them. */
export function words(step: Deadline): { es?: { label?: string; citation?: string } } {
  const es = stepWords(step)
  return es ? { es } : {}
}
