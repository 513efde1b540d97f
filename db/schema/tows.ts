import { doublePrecision, integer, jsonb, pgTable, text, uuid } from 'drizzle-orm/pg-core'
import { vehicles } from './vehicles'
import { at, createdAt, id } from './columns'

export const TOW_REASONS = [
  'breakdown',
  'accident',
  'private_property',
  'law_enforcement',
  'owner_request',
  'repossession',
  'other',
] as const

export const tows = pgTable('tows', {
  id: id(),
  vehicleId: uuid().notNull().unique().references(() => vehicles.id),
  pickupLat: doublePrecision(),
  pickupLng: doublePrecision(),
  pickupAddress: text(),
  reason: text({ enum: TOW_REASONS }).notNull(),
  reasonNote: text(),
  requesterName: text(),
  requesterAgency: text(),
  requesterReference: text(),
  calledAt: at(),
  hookedAt: at(),
  arrivedAt: at().notNull(),
  truck: text(),
  driver: text(),
  // Great-circle miles from the pin; road miles typed in by the driver win when present.
  straightMiles: doublePrecision(),
  roadMiles: doublePrecision(),
  chargeCents: integer().notNull().default(0),
  chargeLines: jsonb().$type<unknown[]>().notNull().default([]),
  createdAt: createdAt(),
})
