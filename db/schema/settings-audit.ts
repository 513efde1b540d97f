import { index, jsonb, pgTable, text, uuid } from 'drizzle-orm/pg-core'
import { companies } from './companies'
import { users } from './users'
import { createdAt, id } from './columns'

/**
 * Every change to a company's settings — rule sets today, yards and staff later — with who made it,
 * when, what it was about, the values before and after, and why. Rows are only ever added.
 */
export const settingsChanges = pgTable(
  'settings_changes',
  {
    id: id(),
    companyId: uuid().notNull().references(() => companies.id),
    actorId: uuid().references(() => users.id),
    /** What kind of setting: 'rule-set', 'yard', … */
    area: text().notNull(),
    /** What was done: 'copied', 'saved', 'chosen-for-yard', … */
    action: text().notNull(),
    /** Which one (a rule set's slug, a yard's id) and how a person names it. */
    subjectId: text().notNull(),
    subjectLabel: text().notNull(),
    /** Only the values that changed, keyed by their path ("vehicleClasses.0.dailyRateCents"). */
    before: jsonb().$type<Record<string, unknown>>(),
    after: jsonb().$type<Record<string, unknown>>(),
    /** How a person names the list items those paths point into ("vehicleClasses.0" → "Car"), as they were then. */
    names: jsonb().$type<Record<string, string>>(),
    reason: text(),
    at: createdAt(),
  },
  (t) => [index('settings_changes_company_at').on(t.companyId, t.at)],
)
