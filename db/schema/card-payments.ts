import { sql } from 'drizzle-orm'
import { check, index, integer, pgTable, text, unique, uuid } from 'drizzle-orm/pg-core'
import { CARD_CHECKOUT_STATUSES } from '@shared/schemas/card-payments'
import { payments } from './billing'
import { ownerLinks } from './owner'
import { users } from './users'
import { vehicles } from './vehicles'
import { at, createdAt, id } from './columns'


// A card payment started on the payment service's hosted page (server/card-payments/), at the counter
// (started_by_id) or from the owner's page (owner_link_id). The payment itself is written only when the
// service's signed webhook says the session was paid; until then this row is all there is.
export const cardCheckouts = pgTable(
  'card_checkouts',
  {
    id: id(),
    vehicleId: uuid().notNull().references(() => vehicles.id),
    // The payment service's own id for the hosted checkout (cs_…).
    sessionId: text().notNull().unique(),
    amountCents: integer().notNull(),
    // Made by the client once per attempt: a retry or a double click opens the same hosted page.
    idempotencyKey: text().notNull(),
    requestHash: text().notNull(),
    startedById: uuid().references(() => users.id),
    ownerLinkId: uuid().references(() => ownerLinks.id),
    receiptEmail: text(),
    receiptLanguage: text({ enum: ['en', 'es'] }).notNull(),
    status: text({ enum: CARD_CHECKOUT_STATUSES }).notNull().default('open'),
    // Why a paid session was not recorded against the bill (the vehicle left, more than was due): refund it.
    refusal: text(),
    paymentId: uuid().references(() => payments.id),
    url: text().notNull(),
    expiresAt: at().notNull(),
    createdAt: createdAt(),
    completedAt: at(),
  },
  (t) => [
    unique('card_checkouts_vehicle_key').on(t.vehicleId, t.idempotencyKey),
    index('card_checkouts_vehicle').on(t.vehicleId),
    check('card_checkouts_amount_positive', sql`${t.amountCents} > 0`),
    check('card_checkouts_started_by_someone', sql`(${t.startedById} is null) <> (${t.ownerLinkId} is null)`),
  ],
)

// Every webhook event the app acted on, by the service's event id: a replayed event is answered, never acted on twice.
export const cardWebhookEvents = pgTable('card_webhook_events', {
  eventId: text().primaryKey(),
  type: text().notNull(),
  sessionId: text(),
  outcome: text().notNull(),
  receivedAt: createdAt(),
})
