import { boolean, doublePrecision, integer, jsonb, pgTable, text, uuid } from 'drizzle-orm/pg-core'
import { TOW_REASONS } from '@shared/domain/tow'
import { vehicles } from './vehicles'
import { at, createdAt, id } from './columns'

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
  // The add-ons billed with the tow, kept apart from the charge so a correction can recompute it.
  winchingUnits: integer().notNull().default(0),
  dollies: boolean().notNull().default(false),
  afterHours: boolean().notNull().default(false),
  chargeCents: integer().notNull().default(0),
  chargeLines: jsonb().$type<unknown[]>().notNull().default([]),
  createdAt: createdAt(),
})
