import { integer, text, pgTable } from 'drizzle-orm/pg-core'
import { createdAt, id } from './columns'

export const companies = pgTable('companies', {
  id: id(),
  name: text().notNull(),
  phone: text(),
  address: text(),
  // A waiver or discount above this needs a second manager's approval (issue 11). No settings page
  // sets it yet: $100.00 until one does (UPDATE companies SET waiver_approval_limit_cents = …).
  waiverApprovalLimitCents: integer().notNull().default(10_000),
  createdAt: createdAt(),
})
