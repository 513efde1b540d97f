import { index, pgTable, text, uuid } from 'drizzle-orm/pg-core'
import type { ClockEventKind } from '@shared/schemas/rule-sets'
import { users } from './users'
import { vehicles } from './vehicles'
import { at, createdAt, id } from './columns'

// What the office recorded that a legal clock starts from or is answered by (a records request sent,
// a notice mailed), beyond the arrival itself; read by every bill and deadline (server/charges).
// Each is written in the same change as the record it comes from (`sourceId`) and its history event.
export const clockEvents = pgTable(
  'clock_events',
  {
    id: id(),
    vehicleId: uuid().notNull().references(() => vehicles.id),
    kind: text().$type<ClockEventKind>().notNull(),
    at: at().notNull(),
    // What recorded it: "records-request" or "notice-sending", and that row's id.
    source: text().notNull(),
    sourceId: uuid(),
    recordedById: uuid().references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [index('clock_events_vehicle').on(t.vehicleId, t.at)],
)
