import { sql } from 'drizzle-orm'
import { check, doublePrecision, integer, jsonb, pgTable, text, timestamp, unique, uuid } from 'drizzle-orm/pg-core'
import { companies } from './companies'
import { createdAt, id } from './columns'

export const yards = pgTable(
  'yards',
  {
    id: id(),
    companyId: uuid().notNull().references(() => companies.id),
    name: text().notNull(),
    // Prefix of every stock number issued at this yard, e.g. "TC" → TC-2026-00041.
    code: text().notNull().unique(),
    address: text().notNull(),
    phone: text(),
    // Opening hours as the yard writes them ("Mon–Fri 8:00–17:00, Sat 9:00–12:00"), shown to owners.
    hours: text(),
    lat: doublePrecision().notNull(),
    lng: doublePrecision().notNull(),
    timeZone: text().notNull(),
    ruleSetId: uuid(),
    labourRateCents: integer().notNull().default(0),
    towRates: jsonb().$type<Record<string, unknown>>().notNull().default({}),
    createdAt: createdAt(),
  },
  (t) => [check('yards_code_format', sql`${t.code} ~ '^[A-Z]{2,4}$'`)],
)

export const yardSpaces = pgTable(
  'yard_spaces',
  {
    id: id(),
    yardId: uuid().notNull().references(() => yards.id),
    row: text().notNull(),
    number: integer().notNull(),
    // Wide spaces take trucks over 25 ft and trailers.
    size: text({ enum: ['standard', 'wide', 'motorcycle'] }).notNull().default('standard'),
    // A retired space takes no vehicle and leaves the picker; its row stays for the history's labels.
    retiredAt: timestamp({ withTimezone: true, mode: 'date' }),
  },
  (t) => [unique('yard_spaces_position').on(t.yardId, t.row, t.number)],
)

// One row per yard and year; the sequence only ever moves forward, so a stock number is never reused.
export const stockCounters = pgTable(
  'stock_counters',
  {
    yardId: uuid().notNull().references(() => yards.id),
    year: integer().notNull(),
    last: integer().notNull().default(0),
  },
  (t) => [unique('stock_counters_yard_year').on(t.yardId, t.year)],
)
