import { z } from 'zod'
import { spanishWordsSchema } from './rule-sets'
import { CONTACT_LANGUAGES, CONTACT_ROLES, isoDaySchema } from './contacts'
import { alongsideFieldIssues, optionalText } from './fields'
import { msg } from './field-messages'

/**
 * The letters a rule set's timeline asks the yard to mail, each by the clock event its mailing
 * records: the first notice to the owner and every lienholder, the notice of pending lien sale, the
 * low-value notice of intent to dispose.
 */
export const NOTICE_KINDS = ['owner_notice', 'sale_notice', 'disposal_notice'] as const
export type NoticeKind = (typeof NOTICE_KINDS)[number]

export const SEND_METHODS = ['certified_mail', 'email'] as const
export type SendMethod = (typeof SEND_METHODS)[number]

/** Where a notice stands: planned (the rule set asks for it), due (its window is open), sent, or not yet (its clock has not started). */
export const NOTICE_PLAN_STATUSES = ['not-started', 'not-yet', 'due', 'overdue', 'sent', 'late'] as const
export type NoticePlanStatus = (typeof NOTICE_PLAN_STATUSES)[number]

/** One notice the rule set asks for this vehicle, with its dates and where it stands. */
export const plannedNoticeSchema = z.object({
  kind: z.enum(NOTICE_KINDS),
  status: z.enum(NOTICE_PLAN_STATUSES),
  /** Mail by the end of this day (the rule set's deadline), if it sets one. */
  dueDate: z.string().nullable(),
  /** Not before this day (a "not more than N days before the sale" window), if it sets one. */
  opensOn: z.string().nullable(),
  /** When the mailing was recorded, if it was. */
  mailedAt: z.string().nullable(),
  label: z.string(),
  citation: z.string(),
  /** Its label and citation in Spanish, where the rule set has them. */
  es: spanishWordsSchema.optional(),
})
export type PlannedNotice = z.infer<typeof plannedNoticeSchema>

export const noticeSendingSchema = z.object({
  id: z.uuid(),
  method: z.enum(SEND_METHODS),
  trackingNumber: z.string().nullable(),
  mailedOn: z.string().nullable(),
  emailTo: z.string().nullable(),
  outboxMessageId: z.uuid().nullable(),
  returnedOn: z.string().nullable(),
  returnNote: z.string().nullable(),
  sentBy: z.string().nullable(),
  createdAt: z.string(),
})
export type NoticeSending = z.infer<typeof noticeSendingSchema>

export const noticeRecordSchema = z.object({
  id: z.uuid(),
  kind: z.enum(NOTICE_KINDS),
  contact: z.object({ id: z.uuid(), name: z.string(), role: z.enum(CONTACT_ROLES) }),
  language: z.enum(CONTACT_LANGUAGES),
  dueDate: z.string().nullable(),
  nextDate: z.string().nullable(),
  /** The letter as made: one of the vehicle's files (GET /api/files/:id). */
  fileId: z.uuid(),
  createdAt: z.string(),
  createdBy: z.string().nullable(),
  sendings: z.array(noticeSendingSchema),
})
export type NoticeRecord = z.infer<typeof noticeRecordSchema>

export const noticesPageSchema = z.object({
  planned: z.array(plannedNoticeSchema),
  notices: z.array(noticeRecordSchema),
})
export type NoticesPage = z.infer<typeof noticesPageSchema>

/** Make the letters of one kind: one per recipient (the owner and every lienholder unless some are named). */
export const generateNoticesSchema = z.object({
  kind: z.enum(NOTICE_KINDS, { error: msg('notices.chooseWhichNoticeMake', 'Choose which notice to make.') }),
  contactIds: z.array(z.uuid({ error: msg('common.thatNotContactId', 'That is not a contact id.') })).max(20).optional(),
})
export type GenerateNotices = z.input<typeof generateNoticesSchema>

/**
 * How a notice goes out: by certified mail (the tracking number and the mailing day, the event that
 * starts or meets the clocks) and/or by e-mail (through the outbox, the PDF attached).
 */
export const sendNoticeSchema = z
  .object({
    certifiedMail: z.boolean().default(false),
    email: z.boolean().default(false),
    trackingNumber: optionalText(40),
    mailedOn: isoDaySchema(msg('notices.enterDayWasMailed', 'Enter the day it was mailed.')).nullish().or(z.literal('').transform(() => null)).transform((v) => v ?? null),
  })
  .superRefine((s, ctx) => {
    if (!s.certifiedMail && !s.email) ctx.addIssue({ code: 'custom', path: ['certifiedMail'], message: msg('notices.chooseCertifiedMailMail', 'Choose certified mail, e-mail or both.') })
    if (s.certifiedMail) {
      if (!s.trackingNumber) ctx.addIssue({ code: 'custom', path: ['trackingNumber'], message: msg('notices.enterCertifiedMailTracking', 'Enter the certified-mail tracking number.') })
      else if (!/^[A-Z0-9 -]{10,40}$/i.test(s.trackingNumber)) ctx.addIssue({ code: 'custom', path: ['trackingNumber'], message: msg('notices.trackingNumberHas10', 'A tracking number has 10 or more letters and digits.') })
      if (!s.mailedOn) ctx.addIssue({ code: 'custom', path: ['mailedOn'], message: msg('notices.enterDayWasMailed', 'Enter the day it was mailed.') })
    }
  }, alongsideFieldIssues)
export type SendNoticeInput = z.input<typeof sendNoticeSchema>
export type SendNotice = z.output<typeof sendNoticeSchema>

export const returnedSchema = z.object({
  returnedOn: isoDaySchema(msg('notices.enterDayLetterCame', 'Enter the day the letter came back.')),
  note: optionalText(300),
})
export type ReturnedInput = z.input<typeof returnedSchema>

export const noticeParamsSchema = z.object({
  vehicleId: z.uuid({ error: msg('common.thatNotVehicleId', 'That is not a vehicle id.') }),
  noticeId: z.uuid({ error: msg('notices.thatNotNoticeId', 'That is not a notice id.') }),
})
export const sendingParamsSchema = noticeParamsSchema.extend({ sendingId: z.uuid({ error: msg('notices.thatNotSendingId', 'That is not a sending id.') }) })

/** "All notices due today": what happened for each vehicle and each letter. */
export const bulkResultSchema = z.object({
  vehicleId: z.uuid(),
  stockNumber: z.string(),
  kind: z.enum(NOTICE_KINDS),
  contactName: z.string().nullable(),
  outcome: z.enum(['queued', 'failed', 'skipped']),
  /** The notice made, to retry its sending. */
  noticeId: z.uuid().nullable(),
  reason: z.string().nullable(),
})
export type BulkResult = z.infer<typeof bulkResultSchema>

export const dueNoticeSchema = z.object({
  vehicleId: z.uuid(),
  stockNumber: z.string(),
  kind: z.enum(NOTICE_KINDS),
  dueDate: z.string().nullable(),
  status: z.enum(NOTICE_PLAN_STATUSES),
})
export type DueNotice = z.infer<typeof dueNoticeSchema>
export const dueNoticesSchema = z.object({ due: z.array(dueNoticeSchema) })
