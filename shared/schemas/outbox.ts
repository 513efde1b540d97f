import { z } from 'zod'
import { pagingShape, requiredText, text } from './fields'
import { msg } from './field-messages'

export const MESSAGE_STATUSES = ['queued', 'sending', 'sent', 'failed'] as const
export type MessageStatus = (typeof MESSAGE_STATUSES)[number]

export const MESSAGE_LANGUAGES = ['en', 'es'] as const

export const outboxQuerySchema = z.object({
  status: z
    .enum(MESSAGE_STATUSES, { error: msg('outbox.chooseQueuedSendingSent', 'Choose queued, sending, sent or failed.') })
    .optional()
    .transform((v) => v ?? null),
  ...pagingShape,
})
export type OutboxQuery = z.input<typeof outboxQuerySchema>

export const outboxMessageParamsSchema = z.object({ messageId: z.uuid({ error: msg('outbox.thatNotMessageId', 'That is not a message id.') }) })
export const outboxAttachmentParamsSchema = outboxMessageParamsSchema.extend({
  attachmentId: z.uuid({ error: msg('outbox.thatNotAttachmentId', 'That is not an attachment id.') }),
})

/** What the server code hands the outbox (never from a browser: messages are queued by the app's own work). */
export const newMessageSchema = z.object({
  to: z.email({ error: msg('common.thatNotMailAddress', 'That is not an e-mail address.') }).max(254),
  toName: text().trim().max(200).nullish().transform((v) => v || null),
  subject: requiredText(300, msg('outbox.messageNeedsSubject', 'A message needs a subject.')).refine((v) => !/[\r\n]/.test(v), msg('outbox.subjectOneLine', 'A subject is one line.')),
  text: text().min(1, msg('outbox.messageNeedsBody', 'A message needs a body.')).max(200_000),
  html: text().max(500_000).nullish().transform((v) => v ?? null),
  language: z.enum(MESSAGE_LANGUAGES).default('en'),
  purpose: requiredText(60, msg('outbox.sayWhatMessageFor', 'Say what the message is for.')),
  vehicleId: z.uuid().nullish().transform((v) => v ?? null),
  attachments: z
    .array(
      z.object({
        filename: requiredText(200, msg('outbox.attachmentNeedsFileName', 'An attachment needs a file name.')).refine((v) => !/[\\/\r\n]/.test(v), msg('outbox.fileNameHasNo', 'A file name has no slashes or line breaks.')),
        contentType: z.string().regex(/^[a-z]+\/[a-z0-9.+-]+$/, msg('outbox.notContentType', 'Not a content type.')),
        content: z.custom<Uint8Array>((v) => v instanceof Uint8Array, msg('outbox.attachmentBytesAreUint8array', 'Attachment bytes are a Uint8Array.')).optional(),
        fileId: z.uuid().optional(),
      }).refine((a) => (a.content === undefined) !== (a.fileId === undefined), msg('outbox.attachmentEitherBytesStored', 'An attachment is either bytes or a stored file.')),
    )
    .max(10)
    .default([]),
})
export type NewMessage = z.input<typeof newMessageSchema>

const attachmentSchema = z.object({
  id: z.string(),
  filename: z.string(),
  contentType: z.string(),
  bytes: z.number(),
})

export const outboxRowSchema = z.object({
  id: z.string(),
  to: z.string(),
  toName: z.string().nullable(),
  subject: z.string(),
  purpose: z.string(),
  language: z.enum(MESSAGE_LANGUAGES),
  status: z.enum(MESSAGE_STATUSES),
  attempts: z.number(),
  lastError: z.string().nullable(),
  vehicle: z.object({ id: z.string(), stockNumber: z.string() }).nullable(),
  queuedBy: z.string().nullable(),
  createdAt: z.string(),
  sentAt: z.string().nullable(),
  attachmentCount: z.number(),
})
export type OutboxRow = z.infer<typeof outboxRowSchema>

export const outboxPageSchema = z.object({
  rows: z.array(outboxRowSchema),
  total: z.number(),
  page: z.number(),
  pageSize: z.number(),
  counts: z.record(z.enum(MESSAGE_STATUSES), z.number()),
})
export type OutboxPage = z.infer<typeof outboxPageSchema>

export const outboxMessageSchema = outboxRowSchema.extend({
  messageId: z.string(),
  text: z.string(),
  html: z.string().nullable(),
  smtpResponse: z.string().nullable(),
  updatedAt: z.string(),
  nextAttemptAt: z.string().nullable(),
  attachments: z.array(attachmentSchema),
})
export type OutboxMessage = z.infer<typeof outboxMessageSchema>
