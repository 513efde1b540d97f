import { pgTable, text, uuid } from 'drizzle-orm/pg-core'
import { users } from './users'
import { vehicles } from './vehicles'
import { at, createdAt, id } from './columns'

// Who at the police was told of a tow, when, and the report number they gave: it meets the rule set's
// police-notification clock (shared/domain/clocks/police-notice.ts). One per vehicle; the history
// event recorded with it is the chain of custody's copy.
export const policeNotices = pgTable('police_notices', {
  id: id(),
  vehicleId: uuid().notNull().unique().references(() => vehicles.id),
  agency: text().notNull(),
  person: text(),
  notifiedAt: at().notNull(),
  reportNumber: text(),
  recordedById: uuid().notNull().references(() => users.id),
  recordedAt: createdAt(),
})
