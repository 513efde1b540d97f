import { check, date, index, pgTable, text, uuid } from 'drizzle-orm/pg-core'
import { sql } from 'drizzle-orm'
import { CONTACT_LANGUAGES, CONTACT_ROLES, CONTACT_SOURCES, RECORDS_OUTCOMES } from '@shared/schemas/contacts'
import { users } from './users'
import { vehicles } from './vehicles'
import { at, createdAt, id } from './columns'

// Who has to be told about a vehicle, and where the office found them. A removed contact is kept
// (removedAt) because the notices sent to them name them.
export const vehicleContacts = pgTable(
  'vehicle_contacts',
  {
    id: id(),
    vehicleId: uuid().notNull().references(() => vehicles.id),
    role: text({ enum: CONTACT_ROLES }).notNull(),
    name: text().notNull(),
    street: text(),
    city: text(),
    state: text(),
    zip: text(),
    phone: text(),
    email: text(),
    language: text({ enum: CONTACT_LANGUAGES }).notNull().default('en'),
    source: text({ enum: CONTACT_SOURCES }).notNull(),
    sourceDate: date({ mode: 'string' }),
    sourceNote: text(),
    createdById: uuid().references(() => users.id),
    createdAt: createdAt(),
    updatedAt: at().notNull().defaultNow(),
    removedAt: at(),
    removedById: uuid().references(() => users.id),
  },
  (t) => [index('vehicle_contacts_vehicle').on(t.vehicleId)],
)

// A state records request for the owners and lienholders: sending it meets the rule set's deadline
// (the clock event "owner-records-requested" is written with it, in clock_events).
export const recordsRequests = pgTable(
  'records_requests',
  {
    id: id(),
    vehicleId: uuid().notNull().references(() => vehicles.id),
    agency: text(),
    sentOn: date({ mode: 'string' }).notNull(),
    answeredOn: date({ mode: 'string' }),
    outcome: text({ enum: RECORDS_OUTCOMES }),
    createdById: uuid().references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [
    index('records_requests_vehicle').on(t.vehicleId),
    check('records_requests_answer', sql`(${t.answeredOn} is null) = (${t.outcome} is null)`),
  ],
)
