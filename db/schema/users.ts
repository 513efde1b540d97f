import { sql } from 'drizzle-orm'
import { boolean, index, jsonb, pgTable, text, uniqueIndex, uuid } from 'drizzle-orm/pg-core'
import { ROLES } from '@shared/domain/access'
import { companies } from './companies'
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
    createdAt: createdAt(),
    updatedAt: at().notNull().defaultNow(),
  },
  (t) => [uniqueIndex('users_email_lower').on(sql`lower(${t.email})`)],
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

// Small key/value settings that must be shared by every app server (e.g. the session secret).
export const appSettings = pgTable('app_settings', {
  key: text().primaryKey(),
  value: text().notNull(),
})
