import { index, integer, pgTable, text, uuid } from 'drizzle-orm/pg-core'
import { users } from './users'
import { vehicles } from './vehicles'
import { createdAt, id } from './columns'

export const files = pgTable(
  'files',
  {
    id: id(),
    vehicleId: uuid().notNull().references(() => vehicles.id),
    kind: text({ enum: ['photo', 'id', 'document'] }).notNull(),
    // Keys are made by the server; the name a browser sent is kept only as a label.
    storageKey: text().notNull().unique(),
    thumbKey: text(),
    mime: text().notNull(),
    bytes: integer().notNull(),
    // SHA-256 of the stored bytes, also written into the history event: a swapped file is detectable.
    sha256: text().notNull(),
    width: integer(),
    height: integer(),
    label: text(),
    uploadedById: uuid().references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [index('files_vehicle').on(t.vehicleId)],
)

export const propertyItems = pgTable(
  'property_items',
  {
    id: id(),
    vehicleId: uuid().notNull().references(() => vehicles.id),
    item: text().notNull(),
    location: text(),
    count: integer().notNull().default(1),
    createdAt: createdAt(),
  },
  (t) => [index('property_items_vehicle').on(t.vehicleId)],
)
