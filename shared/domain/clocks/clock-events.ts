import type { ClockEventKind, Source, TimelineStep } from '../../schemas/rule-sets'
import type { Holiday } from '../time/holidays'
import type { Instant } from '../time/local-time'

/** Something the office recorded that a legal clock starts from or is answered by. */
export type ClockEvent = { kind: ClockEventKind; at: Instant }

/**
 * Events recorded ahead of their time: a sale date is set weeks before it. Every other event
 * dated after the as-of instant has not happened yet as of then, and is left out.
 */
export const plannedEvents: ReadonlySet<ClockEventKind> = new Set(['sale-scheduled'])

export type ClockStatus = 'upcoming' | 'met' | 'missed' | 'reached' | 'not-started' | 'needs-information'

export type Deadline = {
  code: string
  label: string
  kind: TimelineStep['kind']
  status: ClockStatus
  statusReason: string
  /** The due date on the yard's calendar, once the start event is known. */
  dueDate?: string
  /** Deadline: the instant it is missed (midnight ending the due date). Earliest: the instant it opens. */
  dueAt?: string
  days: number
  dayKind: TimelineStep['dayKind']
  direction: TimelineStep['direction']
  weekendDaysSkipped: number
  holidaysSkipped: readonly Holiday[]
  start: { event: ClockEventKind; label: string; at?: string }
  doneBy: { event: ClockEventKind; label: string; at?: string }
  /** Why this branch of the rule (value or age band) was chosen. */
  branch?: string
  explanation: string
  source: Source
  placeholder: boolean
}

export type LegalClocks = {
  asOf: string
  timeZone: string
  deadlines: Deadline[]
  notApplicable: { code: string; label: string; reason: string }[]
  caution: string
}

/** How each event reads in a sentence: "7 business days after the vehicle was placed in storage". */
export const clockEventLabels: Record<ClockEventKind, string> = {
  stored: 'the vehicle was placed in storage',
  'lien-arose': 'the lien arose',
  'owner-records-requested': 'owner and lienholder records were requested',
  'lien-sale-application-filed': 'the lien sale application was filed',
  'owner-notice-mailed': 'the owner notice was mailed',
  'lien-notice-mailed': 'the notice of pending lien sale was mailed',
  'sale-scheduled': 'the sale date',
  'sale-advertised': 'the sale was advertised',
  'sale-notice-posted': 'the sale notice was posted',
  'lien-sale-held': 'the lien sale was held',
}

