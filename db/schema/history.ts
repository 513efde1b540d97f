import { index, integer, jsonb, pgTable, text, unique, uuid } from 'drizzle-orm/pg-core'
import { HISTORY_KINDS } from '@shared/schemas/history'
import { users } from './users'
import { vehicles } from './vehicles'
import { createdAt, id } from './columns'

// The chain of custody. Append-only: a trigger in the migrations refuses UPDATE and DELETE,
// and each row carries the hash of the one before it for the same vehicle.
export const historyEvents = pgTable(
  'history_events',
  {
    id: id(),
    vehicleId: uuid().notNull().references(() => vehicles.id),
    seq: integer().notNull(),
    at: createdAt(),
    actorId: uuid().references(() => users.id),
    actorLabel: text().notNull(),
    // A type, not a constraint: the kinds grow in code and the stored text stays as it is.
    kind: text({ enum: HISTORY_KINDS }).notNull(),
    fromState: text(),
    toState: text(),
    reason: text(),
    before: jsonb().$type<Record<string, unknown>>(),
    after: jsonb().$type<Record<string, unknown>>(),
    prevHash: text().notNull(),
    hash: text().notNull(),
  },
  (t) => [unique('history_vehicle_seq').on(t.vehicleId, t.seq), index('history_vehicle_at').on(t.vehicleId, t.at)],
)

// Each vehicle's last event, sealed with the history key (which never enters the database): deleting
// the newest events, or a vehicle's whole history, leaves a head that no longer matches — and a head
// cannot be rewritten to match without the key.
export const historyHeads = pgTable('history_heads', {
  vehicleId: uuid().primaryKey().references(() => vehicles.id),
  seq: integer().notNull(),
  hash: text().notNull(),
  seal: text().notNull(),
})
