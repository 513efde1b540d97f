import { sql } from 'drizzle-orm'
import { check, pgTable, text, uuid } from 'drizzle-orm/pg-core'
import { users } from './users'
import { at, createdAt, id } from './columns'

// A staff member's secret calendar address for the Deadlines feed: one per person, renewed or withdrawn
// by that person. Only the token's SHA-256 is stored, so a copy of the database opens no feed.
export const calendarFeeds = pgTable(
  'calendar_feeds',
  {
    id: id(),
    userId: uuid().notNull().unique().references(() => users.id),
    tokenHash: text().notNull().unique(),
    createdAt: createdAt(),
    expiresAt: at().notNull(),
  },
  (t) => [check('calendar_feeds_expires_after_created', sql`${t.expiresAt} > ${t.createdAt}`)],
)
