import { sql } from 'drizzle-orm'
import { check, index, integer, pgTable, text, unique, uuid } from 'drizzle-orm/pg-core'
import { ADJUSTMENT_KINDS, ADJUSTMENT_STATUSES, PAYMENT_METHODS } from '@shared/domain/billing'
import { users } from './users'
import { vehicles } from './vehicles'
import { yards } from './yards'
import { at, createdAt, id } from './columns'

// Money taken at the counter and money given back, one row each; never edited. A refund is a row of
// kind "refund" with its reason. Amounts are positive integer cents; the kind says which way they went.
export const payments = pgTable(
  'payments',
  {
    id: id(),
    vehicleId: uuid().notNull().references(() => vehicles.id),
    kind: text({ enum: ['payment', 'refund'] }).notNull(),
    method: text({ enum: PAYMENT_METHODS }).notNull(),
    amountCents: integer().notNull(),
    // Cash only: what the customer handed over and the change given back.
    tenderedCents: integer(),
    changeCents: integer(),
    checkNumber: text(),
    terminalReference: text(),
    reason: text(),
    // Made by the client once per payment it means to take: a retry or a second tap sends the same key.
    idempotencyKey: text().notNull(),
    // SHA-256 of what the request asked for, so a key reused for a different payment is refused.
    requestHash: text().notNull(),
    dueBeforeCents: integer().notNull(),
    receiptEmail: text(),
    // The card payment service's reference (its payment id) for a card paid on its hosted page.
    providerReference: text(),
    // A refund through the payment service: the card payment (on its hosted page) it gives money back on.
    refundOfPaymentId: uuid(),
    // Null only for a payment the owner made from their page (card, through the payment service).
    takenById: uuid().references(() => users.id),
    takenAt: createdAt(),
  },
  (t) => [
    unique('payments_vehicle_key').on(t.vehicleId, t.idempotencyKey),
    index('payments_vehicle').on(t.vehicleId),
    index('payments_taken_at').on(t.takenAt),
    check('payments_amount_positive', sql`${t.amountCents} > 0`),
  ],
)

// A manager's waiver or discount, with its reason; above the company's limit it waits for a second
// manager (status "pending") and counts toward nothing until approved.
export const chargeAdjustments = pgTable(
  'charge_adjustments',
  {
    id: id(),
    vehicleId: uuid().notNull().references(() => vehicles.id),
    kind: text({ enum: ADJUSTMENT_KINDS }).notNull(),
    amountCents: integer().notNull(),
    reason: text().notNull(),
    status: text({ enum: ADJUSTMENT_STATUSES }).notNull(),
    requestedById: uuid().notNull().references(() => users.id),
    requestedAt: createdAt(),
    decidedById: uuid().references(() => users.id),
    decidedAt: at(),
    declineReason: text(),
  },
  (t) => [index('charge_adjustments_vehicle').on(t.vehicleId), check('charge_adjustments_amount_positive', sql`${t.amountCents} > 0`)],
)

// The cash drawer counted at the end of a yard's day: what was counted against what the payments say.
export const cashCloseouts = pgTable(
  'cash_closeouts',
  {
    id: id(),
    yardId: uuid().notNull().references(() => yards.id),
    // The yard's own calendar day, YYYY-MM-DD.
    businessDate: text().notNull(),
    openingFloatCents: integer().notNull(),
    recordedCents: integer().notNull(),
    countedCents: integer().notNull(),
    overShortCents: integer().notNull(),
    note: text(),
    closedById: uuid().notNull().references(() => users.id),
    closedAt: createdAt(),
  },
  (t) => [unique('cash_closeouts_yard_date').on(t.yardId, t.businessDate)],
)
