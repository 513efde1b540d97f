import { date, pgTable, text, uuid, index } from 'drizzle-orm/pg-core'
import { files } from './files'
import { users } from './users'
import { vehicles } from './vehicles'
import { createdAt, id } from './columns'

// A lien sale's newspaper publication (issue 10): the paper, the days it ran, and the publisher's
// affidavit or proof of publication. Its first day is the clock event `sale-advertised`.
export const publications = pgTable(
  'publications',
  {
    id: id(),
    vehicleId: uuid().notNull().references(() => vehicles.id),
    newspaper: text().notNull(),
    days: date({ mode: 'string' }).array().notNull(),
    proofFileId: uuid().references(() => files.id),
    createdById: uuid().notNull().references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [index('publications_vehicle').on(t.vehicleId)],
)
