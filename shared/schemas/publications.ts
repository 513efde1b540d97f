import { z } from 'zod'
import { spanishWordsSchema } from './rule-sets'
import { NOTICE_PLAN_STATUSES } from './notices'
import { requiredText, text } from './fields'
import { msg } from './field-messages'

const ISO_DAY = /^\d{4}-\d{2}-\d{2}$/

/** The office records a newspaper publication: the paper and each day it ran (first day first). */
export const publicationInputSchema = z.object({
  newspaper: requiredText(160, msg('publications.enterNewspaperNoticeRan', 'Enter the newspaper the notice ran in.')),
  days: z
    .array(text({ error: msg('publications.enterDayWasPublished', 'Enter the day it was published.') }).regex(ISO_DAY, msg('publications.enterDayWasPublished', 'Enter the day it was published.')), { error: msg('publications.enterDaysWasPublished', 'Enter the days it was published.') })
    .min(1, msg('publications.enterDayWasPublished', 'Enter the day it was published.'))
    .max(8, msg('publications.enterAtMost8', 'Enter at most 8 days.')),
})
export type PublicationInput = z.input<typeof publicationInputSchema>

export const plannedPublicationSchema = z.object({
  kind: z.literal('publication'),
  status: z.enum(NOTICE_PLAN_STATUSES),
  dueDate: z.string().nullable(),
  opensOn: z.string().nullable(),
  publishedAt: z.string().nullable(),
  label: z.string(),
  citation: z.string(),
  /** Its label and citation in Spanish, where the rule set has them. */
  es: spanishWordsSchema.optional(),
})

export const publicationRecordSchema = z.object({
  id: z.uuid(),
  newspaper: z.string(),
  days: z.array(z.string()),
  proofFileId: z.uuid().nullable(),
  recordedAt: z.string(),
})

export const publicationsPageSchema = z.object({
  vehicleId: z.uuid(),
  /** What the rule set asks for; null when its branch has no publication step. */
  plan: plannedPublicationSchema.nullable(),
  publications: z.array(publicationRecordSchema),
})
export type PublicationsPage = z.infer<typeof publicationsPageSchema>

/** The office sets the lien sale's day (the yard's calendar day); the server refuses a day earlier than the law allows. */
export const saleDateInputSchema = z.object({
  day: text({ error: msg('publications.enterSaleDate', 'Enter the sale date.') }).regex(ISO_DAY, msg('publications.enterSaleDate', 'Enter the sale date.')),
})
export type SaleDateInput = z.input<typeof saleDateInputSchema>

export const saleDatePageSchema = z.object({
  vehicleId: z.uuid(),
  /** False when no sale date can be set yet (`blocked` says why: the lien-sale gate's code, or no rule set). */
  applies: z.boolean(),
  blocked: z.enum(['no-rule-set', 'no-sale-date', 'no-branch', 'needs-value', 'needs-model-year']).nullable(),
  /** The sale day on record, if one is set. */
  scheduled: z.string().nullable(),
  /** The first day the law allows the sale as of today, when the clocks can say. */
  earliest: z.string().nullable(),
})
export type SaleDatePage = z.infer<typeof saleDatePageSchema>
