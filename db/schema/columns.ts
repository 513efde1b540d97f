import { sql } from 'drizzle-orm'
import { timestamp, uuid } from 'drizzle-orm/pg-core'

export const id = () => uuid().primaryKey().default(sql`gen_random_uuid()`)
export const at = () => timestamp({ withTimezone: true, mode: 'date' })
export const createdAt = () => at().notNull().defaultNow()
