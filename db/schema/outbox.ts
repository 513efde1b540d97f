import { sql } from 'drizzle-orm'
import { check, customType, index, integer, pgTable, text, uuid } from 'drizzle-orm/pg-core'
import { MESSAGE_STATUSES } from '@shared/schemas/outbox'
import { companies } from './companies'
import { files } from './files'
import { users } from './users'
import { vehicles } from './vehicles'
import { at, createdAt, id } from './columns'

const bytea = customType<{ data: Buffer; driverData: Buffer | Uint8Array }>({
  dataType: () => 'bytea',
  fromDriver: (v) => Buffer.from(v),
})

// The durable outbox: a message is written here (in the same transaction as whatever caused it) and a
// worker sends it later, so a crash between "queued" and "sent" loses nothing (server/outbox/).
export const outboundMessages = pgTable(
  'outbound_messages',
  {
    id: id(),
    companyId: uuid().notNull().references(() => companies.id),
    vehicleId: uuid().references(() => vehicles.id),
    // Who queued it (null when the system did) and what for, e.g. "notice.first" or "receipt".
    queuedById: uuid().references(() => users.id),
    purpose: text().notNull(),
    toAddress: text().notNull(),
    toName: text(),
    subject: text().notNull(),
    text: text().notNull(),
    html: text(),
    language: text({ enum: ['en', 'es'] }).notNull().default('en'),
    // The Message-ID header, fixed at queue time: a resend after a crash carries the same one.
    messageId: text().notNull().unique(),
    status: text({ enum: MESSAGE_STATUSES }).notNull().default('queued'),
    attempts: integer().notNull().default(0),
    lastError: text(),
    // A claim: who holds the job and until when. A "sending" row is taken over only after its lease.
    claimToken: uuid(),
    leaseUntil: at(),
    nextAttemptAt: at().notNull().defaultNow(),
    // The SMTP server's answer when it accepted the message.
    smtpResponse: text(),
    // The last time someone sent a failed message again, and who.
    retriedById: uuid().references(() => users.id),
    retriedAt: at(),
    createdAt: createdAt(),
    updatedAt: at().notNull().defaultNow(),
    sentAt: at(),
  },
  (t) => [
    index('outbound_messages_company_created').on(t.companyId, t.createdAt.desc()),
    // The worker's scan: only unfinished jobs are in this index.
    index('outbound_messages_due').on(t.nextAttemptAt).where(sql`${t.status} in ('queued', 'sending')`),
    index('outbound_messages_vehicle').on(t.vehicleId),
    check('outbound_messages_sending_has_lease', sql`${t.status} <> 'sending' or (${t.leaseUntil} is not null and ${t.claimToken} is not null)`),
    check('outbound_messages_sent_at', sql`(${t.status} = 'sent') = (${t.sentAt} is not null)`),
    check('outbound_messages_attempts', sql`${t.attempts} >= 0`),
  ],
)

// An attachment is kept as bytes, or by reference to a stored file (a notice already filed on the vehicle).
export const outboundAttachments = pgTable(
  'outbound_attachments',
  {
    id: id(),
    messageId: uuid().notNull().references(() => outboundMessages.id, { onDelete: 'cascade' }),
    position: integer().notNull(),
    filename: text().notNull(),
    contentType: text().notNull(),
    bytes: integer().notNull(),
    sha256: text().notNull(),
    content: bytea(),
    fileId: uuid().references(() => files.id),
  },
  (t) => [
    index('outbound_attachments_message').on(t.messageId, t.position),
    check('outbound_attachments_one_source', sql`(${t.content} is null) <> (${t.fileId} is null)`),
  ],
)
