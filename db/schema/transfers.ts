import { sql } from 'drizzle-orm'
import { boolean, check, date, integer, pgTable, text, uniqueIndex, uuid } from 'drizzle-orm/pg-core'
import { ID_TYPES } from '@shared/schemas/releases'
import { BUYER_KINDS, TRANSFER_KINDS } from '@shared/schemas/transfers'
import { files } from './files'
import { users } from './users'
import { vehicles } from './vehicles'
import { at, createdAt, id } from './columns'

// The title transfer of one vehicle (issue 11): the bill of sale's parties, price and date, the
// odometer facts 49 CFR 580.17 reads, and for a lien sale how the price was applied to the charges.
// One per vehicle; the lifecycle's transfer guards read `signed_at` (server/board/handover.queries.ts).
export const titleTransfers = pgTable(
  'title_transfers',
  {
    id: id(),
    vehicleId: uuid().notNull().references(() => vehicles.id),
    kind: text({ enum: TRANSFER_KINDS }).notNull(),
    sellerName: text().notNull(),
    buyerKind: text({ enum: BUYER_KINDS }).notNull(),
    buyerName: text().notNull(),
    buyerAddress: text().notNull(),
    buyerIdType: text({ enum: ID_TYPES }),
    buyerIdNumber: text(),
    priceCents: integer().notNull(),
    saleDate: date({ mode: 'string' }).notNull(),
    odometer: integer(),
    odometerUnreadable: boolean().notNull().default(false),
    gvwrLb: integer(),
    selfPropelled: boolean().notNull().default(true),
    // A lien sale's proceeds, worked out when it is recorded (null for a sign-over).
    dueCents: integer(),
    appliedCents: integer(),
    surplusCents: integer(),
    shortfallCents: integer(),
    signatureFileId: uuid().references(() => files.id),
    signerName: text(),
    signedAt: at(),
    createdById: uuid().notNull().references(() => users.id),
    createdAt: createdAt(),
    updatedAt: createdAt(),
  },
  (t) => [
    uniqueIndex('title_transfers_vehicle').on(t.vehicleId),
    check('title_transfers_price', sql`${t.priceCents} >= 0`),
    check('title_transfers_signed_has_image', sql`(${t.signedAt} is null) = (${t.signatureFileId} is null)`),
  ],
)
