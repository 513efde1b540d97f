import { z } from 'zod'
import { clockExplanationSchema } from './clock-explanations'
import { msg } from './field-messages'
import { spanishWordsSchema } from './rule-sets'

/** What a listed deadline is: telling the police of a tow, a step of the rule set's timeline, or the lien sale. */
export const DEADLINE_KINDS = ['police', 'notice', 'lien-sale'] as const
export type DeadlineKind = (typeof DEADLINE_KINDS)[number]

/**
 * One open deadline of one vehicle, as the Deadlines page and the calendar feed list it. `day` is the
 * yard's calendar day it falls on; `status` says whether it has passed (overdue), is still to come
 * (due), or — for a lien sale — is already allowed (eligible, listed on today).
 */
export const deadlineEntrySchema = z.object({
  vehicleId: z.uuid(),
  stockNumber: z.string(),
  vehicle: z.string(),
  plate: z.string().nullable(),
  kind: z.enum(DEADLINE_KINDS),
  code: z.string(),
  label: z.string(),
  day: z.string(),
  /** The instant it falls due: the police clock's minute, or the end of a deadline's day. */
  dueAt: z.string().nullable(),
  status: z.enum(['overdue', 'due', 'eligible']),
  /** An eligible lien sale: the day it became allowed (it is listed on today). */
  since: z.string().optional(),
  explanation: z.string(),
  citation: z.string(),
  /** The explanation as data, worded in the reader's language (`explanation` is the English). */
  explained: clockExplanationSchema.optional(),
  /** Its words in Spanish, where the rule set has them (shared/messages/rule-words.ts picks the reader's). */
  es: spanishWordsSchema.optional(),
  /** A timeline step: the recorded event that meets it (e.g. owner-records-requested), for the Today page. */
  doneBy: z.string().optional(),
})
export type DeadlineEntry = z.infer<typeof deadlineEntrySchema>

export const deadlineListSchema = z.object({
  asOf: z.string(),
  today: z.string(),
  timeZone: z.string(),
  entries: z.array(deadlineEntrySchema),
})
export type DeadlineList = z.infer<typeof deadlineListSchema>

/** Filters of the Deadlines page: the kinds to list (all when none is given). */
export const deadlineQuerySchema = z.object({
  kind: z
    .union([z.enum(DEADLINE_KINDS), z.array(z.enum(DEADLINE_KINDS))], { error: msg('deadlines.chooseKinds', `Choose kinds among ${DEADLINE_KINDS.join(', ')}.`, { kinds: DEADLINE_KINDS.join(', ') }) })
    .optional()
    .transform((k) => (k === undefined ? [...DEADLINE_KINDS] : Array.isArray(k) ? k : [k])),
})

/** The signed-in person's calendar feed: whether one is active, and until when. The URL only when made. */
export const calendarFeedSchema = z.object({
  active: z.boolean(),
  createdAt: z.string().nullable(),
  expiresAt: z.string().nullable(),
  /** The secret address, answered once, when the feed is made or renewed; never again. */
  url: z.string().optional(),
})
export type CalendarFeed = z.infer<typeof calendarFeedSchema>
