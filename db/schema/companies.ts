import { text, pgTable } from 'drizzle-orm/pg-core'
import { createdAt, id } from './columns'

export const companies = pgTable('companies', {
  id: id(),
  name: text().notNull(),
  phone: text(),
  address: text(),
  createdAt: createdAt(),
})
