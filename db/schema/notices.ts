import { date, index, pgTable, text, uuid } from 'drizzle-orm/pg-core'
import { CONTACT_LANGUAGES } from '@shared/schemas/contacts'
import { NOTICE_KINDS, SEND_METHODS } from '@shared/schemas/notices'
import { vehicleContacts } from './contacts'
import { files } from './files'
import { outboundMessages } from './outbox'
import { ownerLinks } from './owner'
import { users } from './users'
import { vehicles } from './vehicles'
import { createdAt, id } from './columns'

// A notice letter made for one recipient. Its PDF is kept as made, as one of the vehicle's files (in
// the file store, not the database: it carries the owner link's token, which the database holds only hashed).
export const notices = pgTable(
  'notices',
  {
    id: id(),
    vehicleId: uuid().notNull().references(() => vehicles.id),
    contactId: uuid().notNull().references(() => vehicleContacts.id),
    kind: text({ enum: NOTICE_KINDS }).notNull(),
    language: text({ enum: CONTACT_LANGUAGES }).notNull(),
    dueDate: date({ mode: 'string' }),
    nextDate: date({ mode: 'string' }),
    ownerLinkId: uuid().references(() => ownerLinks.id),
    fileId: uuid().notNull().references(() => files.id),
    createdById: uuid().references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [index('notices_vehicle').on(t.vehicleId)],
)

// Each time a notice went out: by certified mail (tracking number, mailing day) or by e-mail (the
// outbox message), and whether the letter came back.
export const noticeSendings = pgTable(
  'notice_sendings',
  {
    id: id(),
    noticeId: uuid().notNull().references(() => notices.id),
    method: text({ enum: SEND_METHODS }).notNull(),
    trackingNumber: text(),
    mailedOn: date({ mode: 'string' }),
    emailTo: text(),
    outboxMessageId: uuid().references(() => outboundMessages.id),
    returnedOn: date({ mode: 'string' }),
    returnNote: text(),
    createdById: uuid().references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [index('notice_sendings_notice').on(t.noticeId)],
)
