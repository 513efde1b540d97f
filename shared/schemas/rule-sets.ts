import { z } from 'zod'
import { isTimeZone } from '../domain/time/local-time'
import { TOW_REASONS } from '../domain/tow/tow-reasons'
import { msg } from './field-messages'

/**
 * A local rule set: how a jurisdiction (or a yard's own ordinance) bills storage and runs its
 * notice and disposal clocks. Rule sets are data a manager copies and edits, so every value
 * carries where it came from and how sure we are of it.
 */

/**
 * The markers of shared/REFERENCES.md — V read in the source text, S a secondary page or older
 * copy, M from memory (verify first), C computed from the rule shown — and `none` for a
 * placeholder no source supplies.
 */
export const confidenceSchema = z.enum(['V', 'S', 'M', 'C', 'none'])

/**
 * Spanish words beside the English (issue 14). Optional everywhere: a rule set without them shows its
 * English, and an editor's empty box means "none". `shared/messages/rule-words.ts` picks the reader's.
 */
const spanishText = z
  .string()
  .trim()
  .max(2000)
  .optional()
  .transform((s) => (s ? s : undefined))
const spanishLabel = z.object({ label: spanishText }).optional()
/** A rule set's name in Spanish: as long as a copy's name may be. */
export const SPANISH_NAME_MAX = 120
const spanishName = z
  .string()
  .trim()
  .max(SPANISH_NAME_MAX, msg('ruleSets.spanishNameLength', 'Keep the Spanish name to 120 characters or fewer.'))
  .optional()
  .transform((s) => (s ? s : undefined))

export const sourceSchema = z.object({
  citation: z.string().min(1),
  confidence: confidenceSchema,
  note: z.string().min(1).optional(),
  /** The citation and note in Spanish: the statute's own name and section stay as the statute writes them. */
  es: z.object({ citation: spanishText, note: spanishText }).optional(),
})

const code = z.string().regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, msg('ruleSets.codeWords', 'use lower-case words joined by dashes'))
const cents = z.number({ error: msg('ruleSets.enterAmount', 'Enter an amount.') }).int(msg('ruleSets.enterAmountWholeCents', 'Enter the amount in whole cents.')).nonnegative(msg('ruleSets.amountCannotNegative', 'An amount cannot be negative.'))
const HOURS = msg('ruleSets.hoursRange', 'Give the hours as more than 0 and at most 168 (a week).')
const hours = z.number({ error: HOURS }).positive(HOURS).max(24 * 7, HOURS)
/** A value nobody publishes statewide: the UI shows "set your rate" until the manager does. */
const placeholder = z.boolean().default(false)

export const vehicleClassSchema = z.object({
  code,
  label: z.string().min(1),
  es: spanishLabel,
  dailyRateCents: cents,
  placeholder,
  source: sourceSchema,
})

export const feeSchema = z.object({
  code,
  label: z.string().min(1),
  es: spanishLabel,
  amountCents: cents,
  taxable: z.boolean(),
  /** once-per-stay fees (impound) are charged from arrival; per-event fees each time one is recorded. */
  charged: z.enum(['once-per-stay', 'per-event']),
  placeholder,
  source: sourceSchema,
})

export const storageRulesSchema = z.object({
  counting: z.object({
    /** calendar-day: each local calendar day or part of one; rolling-24h: each 24 h from arrival or part. */
    method: z.enum(['calendar-day', 'rolling-24h']),
    source: sourceSchema,
  }),
  /** A release this soon after a day begins does not start that day. */
  grace: z.object({ hours: hours, source: sourceSchema }).optional(),
  /** No storage at all for a stay shorter than this. */
  noChargeUnder: z.object({ hours, source: sourceSchema }).optional(),
  /** A release within this many hours of arrival is at most one day's storage. */
  oneDayIfReleasedWithin: z.object({ hours, source: sourceSchema }).optional(),
  cap: z
    .object({ maxDays: z.number().int().positive().optional(), maxStorageCents: cents.optional(), source: sourceSchema })
    .refine((cap) => cap.maxDays !== undefined || cap.maxStorageCents !== undefined, msg('ruleSets.capNeeds', 'a cap needs maxDays or maxStorageCents'))
    .optional(),
  taxable: z.boolean(),
})

export const taxSchema = z.object({
  ratePercent: z
    .number({ error: msg('ruleSets.taxRateRange', 'A tax rate is from 0 to 30 percent.') })
    .min(0, msg('ruleSets.taxRateRange', 'A tax rate is from 0 to 30 percent.'))
    .max(30, msg('ruleSets.taxRateRange', 'A tax rate is from 0 to 30 percent.'))
    .refine((p) => Math.abs(p * 10_000 - Math.round(p * 10_000)) < 1e-6, msg('ruleSets.fourDecimals', 'at most four decimals')),
  placeholder,
  source: sourceSchema,
})

/** The events a legal clock can start from or be satisfied by, as the office records them. */
export const clockEventKindSchema = z.enum([
  'stored',
  'lien-arose',
  'owner-records-requested',
  'lien-sale-application-filed',
  'owner-notice-mailed',
  /** The state's own notice to the owners (California's DMV under Civ. Code § 3071), not the yard's. */
  'state-notice-mailed',
  /** The yard's notice of pending lien sale, or of the sale. */
  'lien-notice-mailed',
  /** The yard's notice of intent to dispose of a low-valued vehicle. */
  'disposal-notice-mailed',
  'sale-scheduled',
  'sale-advertised',
  'sale-notice-posted',
  'lien-sale-held',
])

const bandEnd = z.number().int(msg('ruleSets.bandWhole', 'Give a whole number, 0 or more.')).nonnegative(msg('ruleSets.bandWhole', 'Give a whole number, 0 or more.'))
const range = z
  .object({ over: bandEnd.optional(), atMost: bandEnd.optional() })
  .refine((r) => r.over !== undefined || r.atMost !== undefined, msg('ruleSets.overOrAtMost', 'give over, atMost or both'))

export const timelineStepSchema = z.object({
  code,
  label: z.string().min(1),
  es: spanishLabel,
  /** deadline: `doneBy` must happen on or before the due date; earliest: not before it. */
  kind: z.enum(['deadline', 'earliest']),
  from: clockEventKindSchema,
  direction: z.enum(['after', 'before']),
  days: z
    .number({ error: msg('ruleSets.daysRange', 'Give the days as a whole number from 0 to 3660.') })
    .int(msg('ruleSets.daysRange', 'Give the days as a whole number from 0 to 3660.'))
    .nonnegative(msg('ruleSets.daysRange', 'Give the days as a whole number from 0 to 3660.'))
    .max(3660, msg('ruleSets.daysRange', 'Give the days as a whole number from 0 to 3660.')),
  dayKind: z.enum(['calendar', 'business']),
  doneBy: clockEventKindSchema,
  /** Branches: the step applies only to vehicles in this value (cents) or age (years) band. */
  when: z.object({ valueCents: range.optional(), ageYears: range.optional() }).optional(),
  placeholder,
  source: sourceSchema,
})

/** A holiday calendar by jurisdiction, as date-holidays names them: country, and state where it has its own. */
export const calendarKeySchema = z.object({ country: z.string().length(2), state: z.string().min(1).optional() })

/**
 * Which days a business-day count passes over besides Saturdays and Sundays. Where the statute does
 * not name its holidays, a day is skipped only when every calendar listed closes it, so a due date can
 * only come earlier than under any one of them.
 */
export const businessDaysSchema = z.object({
  skip: z.literal('closed-by-every-calendar'),
  calendars: z.array(calendarKeySchema).min(1, msg('ruleSets.chooseCalendar', 'Choose at least one calendar.')),
  source: sourceSchema,
})

/**
 * A notice that must be mailed by a date cannot be mailed on a day post offices are closed: such a
 * deadline moves to the open day before it (never after).
 */
export const mailDeadlinesSchema = z.object({
  move: z.literal('earlier'),
  /** Post offices close on this calendar's public holidays… */
  postOfficeCalendar: calendarKeySchema,
  /** …and on these weekdays (0 = Sunday … 6 = Saturday). */
  closedWeekdays: z.array(z.number().int().min(0).max(6)).max(6, msg('ruleSets.oneWeekdayOpen', 'Leave at least one weekday open.')),
  source: sourceSchema,
})

/**
 * A duty to tell the police of a tow within hours of it (a private-property tow, in many states):
 * a clock from the tow itself, counted in hours, met by recording who was told, when and the report number.
 * `tow-requested` counts from the earliest time the tow-in records (the call, else the hook-up, else the
 * arrival), so a missing time can only bring the due time earlier; `tow-completed` from the arrival at the yard.
 */
export const policeNoticeSchema = z.object({
  label: z.string().min(1),
  es: spanishLabel,
  hours: z
    .number({ error: msg('ruleSets.policeHours', 'Give the hours as more than 0 and at most 72.') })
    .positive(msg('ruleSets.policeHours', 'Give the hours as more than 0 and at most 72.'))
    .max(72, msg('ruleSets.policeHours', 'Give the hours as more than 0 and at most 72.')),
  from: z.enum(['tow-requested', 'tow-completed']),
  towReasons: z.array(z.enum(TOW_REASONS)).min(1, msg('ruleSets.chooseTowReason', 'Choose at least one kind of tow.')),
  placeholder,
  source: sourceSchema,
})

export const totalLossSchema = z.discriminatedUnion('rule', [
  z.object({
    rule: z.literal('percent-of-value'),
    percent: z
      .number({ error: msg('ruleSets.percentRange', 'Give a share above 0 and at most 100 percent.') })
      .positive(msg('ruleSets.percentRange', 'Give a share above 0 and at most 100 percent.'))
      .max(100, msg('ruleSets.percentRange', 'Give a share above 0 and at most 100 percent.')),
    source: sourceSchema,
  }),
  z.object({ rule: z.literal('total-loss-formula'), source: sourceSchema }),
])

function unique<T>(items: readonly T[], key: (item: T) => string): boolean {
  return new Set(items.map(key)).size === items.length
}

export const ruleSetSchema = z
  .object({
    id: code,
    name: z.string().min(1),
    jurisdiction: z.string().min(1),
    sample: z.boolean(),
    /** Shown wherever the rule set is: requirements vary, and the sample is not legal advice. */
    caution: z.string().min(1),
    /** The name and the caution in Spanish. */
    es: z.object({ name: spanishName, caution: spanishText }).optional(),
    timeZone: z.string().refine(isTimeZone, msg('ruleSets.ianaTimeZone', 'an IANA time zone such as America/Los_Angeles')),
    holidayCalendar: calendarKeySchema,
    businessDays: businessDaysSchema.optional(),
    mailDeadlines: mailDeadlinesSchema.optional(),
    currency: z.literal('USD'),
    vehicleClasses: z.array(vehicleClassSchema).min(1),
    storage: storageRulesSchema,
    fees: z.array(feeSchema),
    tax: taxSchema,
    /** What the arrival itself records for the clocks; a storage lien, for one, commonly arises with the storage. */
    arrivalEvents: z.object({ kinds: z.array(clockEventKindSchema).min(1), source: sourceSchema }).optional(),
    timeline: z.array(timelineStepSchema),
    policeNotice: policeNoticeSchema.optional(),
    totalLoss: totalLossSchema,
    notes: z.array(z.string().min(1)).default([]),
  })
  .refine((r) => unique(r.vehicleClasses, (c) => c.code), { message: msg('ruleSets.classCodesDiffer', 'vehicle class codes must differ'), path: ['vehicleClasses'] })
  .refine((r) => unique(r.fees, (f) => f.code), { message: msg('ruleSets.feeCodesDiffer', 'fee codes must differ'), path: ['fees'] })

/**
 * A rule set named in a response: its name and caution in English, with their Spanish beside them where it
 * has them (`ruleSetTitle` in shared/messages/rule-words.ts builds it; `ruleWords` picks the reader's).
 */
export const ruleSetTitleSchema = z.object({
  name: z.string(),
  caution: z.string(),
  es: z.object({ name: z.string().optional(), caution: z.string().optional() }).optional(),
})
export type RuleSetTitle = z.infer<typeof ruleSetTitleSchema>

/** A rule set's words as a response carries them beside the English: the Spanish label and citation. */
export const spanishWordsSchema = z.object({ label: z.string().optional(), citation: z.string().optional() })
export type SpanishWords = z.infer<typeof spanishWordsSchema>

export type Confidence = z.infer<typeof confidenceSchema>
export type Source = z.infer<typeof sourceSchema>
export type VehicleClass = z.infer<typeof vehicleClassSchema>
export type Fee = z.infer<typeof feeSchema>
export type StorageRules = z.infer<typeof storageRulesSchema>
export type ClockEventKind = z.infer<typeof clockEventKindSchema>
export type TimelineStep = z.infer<typeof timelineStepSchema>
export type CalendarKey = z.infer<typeof calendarKeySchema>
export type PoliceNoticeRule = z.output<typeof policeNoticeSchema>
export type TotalLossRule = z.infer<typeof totalLossSchema>
/** A rule set as the functions use it (defaults applied). */
export type RuleSet = z.output<typeof ruleSetSchema>
/** A rule set as written in a file or sent by a client (defaults optional). */
export type RuleSetInput = z.input<typeof ruleSetSchema>
