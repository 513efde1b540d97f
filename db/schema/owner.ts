import { sql } from 'drizzle-orm'
import { check, index, pgTable, text, uuid } from 'drizzle-orm/pg-core'
import { OWNER_CHOICES, SIGN_OVER_TO } from '@shared/schemas/owner'
import { users } from './users'
import { vehicles } from './vehicles'
import { at, createdAt, id } from './columns'

// A link the office gives a vehicle's owner: it opens that one vehicle's owner page, nothing else.
// Neither the token nor the short code is stored: only their SHA-256, so a copy of the database
// opens no owner page (server/owner/owner-keys.ts).
export const ownerLinks = pgTable(
  'owner_links',
  {
    id: id(),
    vehicleId: uuid().notNull().references(() => vehicles.id),
    tokenHash: text().notNull().unique(),
    codeHash: text().notNull().unique(),
    createdById: uuid().notNull().references(() => users.id),
    createdAt: createdAt(),
    expiresAt: at().notNull(),
    revokedAt: at(),
    revokedById: uuid().references(() => users.id),
  },
  (t) => [index('owner_links_vehicle').on(t.vehicleId), check('owner_links_expires_after_created', sql`${t.expiresAt} > ${t.createdAt}`)],
)

// What an owner chose on their page, with who typed it and from where. The latest one stands; the
// vehicle row carries its choice and time for the board (vehicles.owner_choice).
export const ownerDecisions = pgTable(
  'owner_decisions',
  {
    id: id(),
    vehicleId: uuid().notNull().references(() => vehicles.id),
    linkId: uuid().notNull().references(() => ownerLinks.id),
    choice: text({ enum: OWNER_CHOICES }).notNull(),
    signOverTo: text({ enum: SIGN_OVER_TO }),
    fullName: text().notNull(),
    phone: text(),
    note: text(),
    ip: text().notNull(),
    userAgent: text(),
    at: createdAt(),
  },
  (t) => [index('owner_decisions_vehicle_at').on(t.vehicleId, t.at)],
)
