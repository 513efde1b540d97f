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

/** What a "needs-information" step waits for: the screens say "enter the value to see this deadline". */
export type ClockNeed = 'value' | 'model-year'

/**
 * Something about the vehicle's clocks as a whole that a screen must show rather than leave blank:
 * steps waiting for the value or the model year, or no branch of the rule set fitting the vehicle.
 */
export type ClockAlert = { code: 'needs-value' | 'needs-model-year' | 'no-branch'; message: string }

/** A counting rule the rule set states beside its steps (how business days or mailing days count), with its source. */
export type CountingRule = {
  /** Which rule, for the screens' words: business days by the named calendars, or a mailing moved to the open day before. */
  code: 'business-days' | 'mailing-day'
  rule: string
  source: Source
  /** For business days: the calendars whose every closing is skipped ("US, US-FL"). */
  calendars?: string
}

/** Events that are a mailing: a deadline to mail moves earlier off a day post offices are closed. */
export const mailingEvents: ReadonlySet<ClockEventKind> = new Set([
  'owner-notice-mailed',
  'state-notice-mailed',
  'lien-notice-mailed',
  'disposal-notice-mailed',
])

export type Deadline = {
  code: string
  label: string
  /** The step's label in Spanish, where the rule set has it (shared/messages/rule-words.ts picks). */
  es?: { label?: string }
  kind: TimelineStep['kind']
  status: ClockStatus
  statusReason: string
  /** Set with status "needs-information": what to record to see this date. */
  needs?: ClockNeed
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
  /** The explanation as data, for the reader's language (`explanation` stays the English for the feed and older readers). */
  explained: StepExplanation
  source: Source
  /** The rule set's own counting rules this date was worked out by (business days, mailing days), each cited. */
  rules?: CountingRule[]
  placeholder: boolean
}

/**
 * A step's explanation as data: "7 business days after the vehicle was placed in storage
 * (2026-12-01): due by 2026-12-10, skipping 2 weekend days". The screens word it in the reader's
 * language (src/composables/clock-words.ts); the core's English stays in `explanation`.
 */
export type StepExplanation = {
  code: 'step'
  kind: TimelineStep['kind']
  days: number
  dayKind: TimelineStep['dayKind']
  direction: TimelineStep['direction']
  from: ClockEventKind
  /** Once the start is recorded: its day, the due date, and what the count skipped or moved. */
  start?: string
  date?: string
  counted?: string
  closed?: { holiday?: string; es?: { holiday: string }; weekday?: number }
  weekendDays?: number
  holidays?: readonly Holiday[]
}

/** Any explanation a deadline list shows: a step's, the police clock's, or the lien sale's date. */
export type ClockExplanation =
  | StepExplanation
  | { code: 'police'; hours: number; start: 'called' | 'hooked' | 'arrived'; startAt: string; dueAt: string }
  | { code: 'eligible-since' | 'not-before'; date: string }

export type LegalClocks = {
  asOf: string
  timeZone: string
  deadlines: Deadline[]
  notApplicable: { code: string; label: string; reason: string }[]
  /** Shown instead of nothing: "needs the value", "needs the model year", "no branch applies". */
  alerts: ClockAlert[]
  caution: string
}

/** How each event reads in a sentence: "7 business days after the vehicle was placed in storage". */
export const clockEventLabels: Record<ClockEventKind, string> = {
  stored: 'the vehicle was placed in storage',
  'lien-arose': 'the lien arose',
  'owner-records-requested': 'owner and lienholder records were requested',
  'lien-sale-application-filed': 'the lien sale application was filed',
  'owner-notice-mailed': 'the owner notice was mailed',
  'state-notice-mailed': "the state's notice to the owners was mailed",
  'lien-notice-mailed': "the yard's notice of pending lien sale was mailed",
  'disposal-notice-mailed': 'the notice of intent to dispose was mailed',
  'sale-scheduled': 'the sale date',
  'sale-advertised': 'the sale was advertised',
  'sale-notice-posted': 'the sale notice was posted',
  'lien-sale-held': 'the vehicle was sold or disposed of',
}

