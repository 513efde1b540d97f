import { index, pgTable, text, uuid } from 'drizzle-orm/pg-core'
import { HOLD_KINDS } from '@shared/domain/lifecycle'
import { users } from './users'
import { vehicles } from './vehicles'
import { at, createdAt, id } from './columns'

export const holds = pgTable(
  'holds',
  {
    id: id(),
    vehicleId: uuid().notNull().references(() => vehicles.id),
    kind: text({ enum: HOLD_KINDS }).notNull(),
    agency: text(),
    caseNumber: text(),
    until: at(),
    note: text(),
    setById: uuid().references(() => users.id),
    setAt: createdAt(),
    liftedById: uuid().references(() => users.id),
    liftedAt: at(),
    liftReason: text(),
  },
  (t) => [index('holds_vehicle').on(t.vehicleId)],
)
