import { pgTable, primaryKey, uuid } from 'drizzle-orm/pg-core'
import { users } from './users'
import { yards } from './yards'

// The yards a staff member belongs to, when the manager chose them (users.all_yards false).
// A person with all_yards belongs to every yard of their company, present and future.
export const userYards = pgTable(
  'user_yards',
  {
    userId: uuid()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    yardId: uuid()
      .notNull()
      .references(() => yards.id),
  },
  (t) => [primaryKey({ columns: [t.userId, t.yardId] })],
)
