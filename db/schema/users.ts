import { sql } from 'drizzle-orm'
import { boolean, index, integer, jsonb, pgTable, text, uniqueIndex, uuid } from 'drizzle-orm/pg-core'
import { ROLES } from '@shared/domain/access'
import { LOCALES } from '@shared/messages/locales'
import { companies } from './companies'
import { yards } from './yards'
import { at, createdAt, id } from './columns'

export const users = pgTable(
  'users',
  {
    id: id(),
    companyId: uuid().notNull().references(() => companies.id),
    email: text().notNull(),
    name: text().notNull(),
    role: text({ enum: ROLES }).notNull(),
    passwordHash: text().notNull(),
    active: boolean().notNull().default(true),
    /** The language they chose to work in; null: their browser's. */
    locale: text({ enum: LOCALES }),
    /** Belongs to every yard of the company (a single-yard company's staff); false: the yards in user_yards. */
    allYards: boolean().notNull().default(true),
    /** The yard chosen in the top bar, remembered per person; null or no longer theirs: their first yard. */
    currentYardId: uuid().references(() => yards.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    updatedAt: at().notNull().defaultNow(),
  },
  // An address is unique within a company, not across them: refusing one another company uses would
  // tell a manager that it does. Sign-in tries the password on each account with the address.
  (t) => [uniqueIndex('users_company_email_lower').on(t.companyId, sql`lower(${t.email})`), index('users_email_lower').on(sql`lower(${t.email})`)],
)

// express-session rows; user_id lets a deactivation end every session of that user at once.
export const sessions = pgTable(
  'sessions',
  {
    sid: text().primaryKey(),
    userId: uuid().references(() => users.id, { onDelete: 'cascade' }),
    data: jsonb().$type<Record<string, unknown>>().notNull(),
    expiresAt: at().notNull(),
  },
  (t) => [index('sessions_expires_at').on(t.expiresAt), index('sessions_user_id').on(t.userId)],
)

// Failed sign-ins per key (an account at an address, an address, an account, a known device), in the
// database so that every app server counts the same ones (server/session/sign-in-throttle.ts).
export const signInFailures = pgTable(
  'sign_in_failures',
  {
    /** The kind and a hash of what it counts: no e-mail address or IP address in clear. */
    key: text().primaryKey(),
    failures: integer().notNull(),
    lastFailureAt: at().notNull(),
    /** Attempts without a known device wait until then. */
    blockedUntil: at(),
  },
  (t) => [index('sign_in_failures_last_failure_at').on(t.lastFailureAt)],
)

// Small key/value settings that must be shared by every app server (e.g. the session secret).
export const appSettings = pgTable('app_settings', {
  key: text().primaryKey(),
  value: text().notNull(),
})
