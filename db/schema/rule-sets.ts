import { integer, jsonb, pgTable, text, unique, uuid } from 'drizzle-orm/pg-core'
import { companies } from './companies'
import { users } from './users'
import { createdAt, id } from './columns'

// A rule set is data; every edit makes a new version, and a vehicle keeps the version it arrived under.
export const ruleSets = pgTable('rule_sets', {
  id: id(),
  companyId: uuid().references(() => companies.id),
  slug: text().notNull().unique(),
  name: text().notNull(),
  sample: text({ enum: ['sample', 'local'] }).notNull().default('local'),
  createdAt: createdAt(),
})

export const ruleSetVersions = pgTable(
  'rule_set_versions',
  {
    id: id(),
    ruleSetId: uuid().notNull().references(() => ruleSets.id),
    version: integer().notNull(),
    body: jsonb().$type<Record<string, unknown>>().notNull(),
    createdById: uuid().references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [unique('rule_set_versions_number').on(t.ruleSetId, t.version)],
)
