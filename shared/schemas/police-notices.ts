import { z } from 'zod'
import { alongsideFieldIssues, instantSchema, optionalText, requiredText } from './fields'
import { sourceSchema } from './rule-sets'
import { msg } from './field-messages'

/** A notification may be typed a little ahead of the server's clock; beyond that it is a typing mistake. */
const FUTURE_SLACK_MS = 10 * 60_000

/** What the dispatcher records once the police have been told of a tow. */
export const policeNoticeInputSchema = z
  .object({
    agency: requiredText(120, msg('policeNotices.namePoliceAgencyYou', 'Name the police agency you told.')),
    person: optionalText(120),
    notifiedAt: instantSchema,
    reportNumber: optionalText(60),
  })
  .superRefine((n, ctx) => {
    if (Date.parse(n.notifiedAt) > Date.now() + FUTURE_SLACK_MS) {
      ctx.addIssue({ code: 'custom', path: ['notifiedAt'], message: msg('policeNotices.whenPoliceWereTold', 'When the police were told cannot be in the future.') })
    }
  }, alongsideFieldIssues)
export type PoliceNoticeInput = z.input<typeof policeNoticeInputSchema>

export const policeNotificationSchema = z.object({
  notifiedAt: z.string(),
  agency: z.string(),
  person: z.string().nullable(),
  reportNumber: z.string().nullable(),
})

/** The police-notification clock as the card, the vehicle page and the Deadlines page show it. */
export const policeNoticeClockSchema = z.object({
  label: z.string(),
  es: z.object({ label: z.string().optional() }).optional(),
  status: z.enum(['open', 'overdue', 'met', 'late']),
  hours: z.number(),
  start: z.enum(['called', 'hooked', 'arrived']),
  startAt: z.string(),
  dueAt: z.string(),
  minutesLeft: z.number(),
  explanation: z.string(),
  source: sourceSchema,
  placeholder: z.boolean(),
  notification: policeNotificationSchema.nullable(),
})
export type PoliceNoticeClockView = z.infer<typeof policeNoticeClockSchema>

export const policeNoticeReplySchema = z.object({ version: z.number(), clock: policeNoticeClockSchema })
export type PoliceNoticeReply = z.infer<typeof policeNoticeReplySchema>
