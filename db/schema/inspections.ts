import { sql } from 'drizzle-orm'
import { boolean, check, index, integer, pgTable, primaryKey, text, unique, uniqueIndex, uuid } from 'drizzle-orm/pg-core'
import { FINDING_STATUSES, LIMITS } from '@shared/domain/inspection'
import { files } from './files'
import { users } from './users'
import { vehicles } from './vehicles'
import { at, createdAt, id } from './columns'

// One teardown of one vehicle. A re-inspection is a new row; the old one stays as it was finished.
export const inspections = pgTable(
  'inspections',
  {
    id: id(),
    vehicleId: uuid().notNull().references(() => vehicles.id),
    startedById: uuid().notNull().references(() => users.id),
    startedAt: createdAt(),
    safetyAcknowledgedById: uuid().references(() => users.id),
    safetyAcknowledgedAt: at(),
    // A wheel put back on for the pickup, and the maker's lug-nut torque it was tightened to.
    wheelRefitted: boolean(),
    lugTorqueFtLbf: integer(),
    actualCashValueCents: integer(),
    actualCashValueSource: text(),
    salvageValueCents: integer(),
    salvageValueSource: text(),
    valuesEnteredById: uuid().references(() => users.id),
    valuesEnteredAt: at(),
    finishedById: uuid().references(() => users.id),
    finishedAt: at(),
  },
  (t) => [
    // At most one inspection under way per vehicle.
    uniqueIndex('inspections_one_open').on(t.vehicleId).where(sql`${t.finishedAt} is null`),
    index('inspections_vehicle').on(t.vehicleId, t.startedAt),
    check('inspections_acv_range', sql`${t.actualCashValueCents} is null or ${t.actualCashValueCents} between 1 and ${sql.raw(String(LIMITS.maxValueCents))}`),
    check('inspections_salvage_range', sql`${t.salvageValueCents} is null or ${t.salvageValueCents} between 0 and ${t.actualCashValueCents}`),
    check('inspections_values_sourced', sql`(${t.actualCashValueCents} is null) = (${t.actualCashValueSource} is null)`),
    check('inspections_salvage_sourced', sql`(${t.salvageValueCents} is null) = (${t.salvageValueSource} is null)`),
    check('inspections_values_together', sql`(${t.actualCashValueCents} is null) = (${t.salvageValueCents} is null)`),
    check('inspections_torque_range', sql`${t.lugTorqueFtLbf} is null or ${t.lugTorqueFtLbf} between ${sql.raw(String(LIMITS.minLugTorqueFtLbf))} and ${sql.raw(String(LIMITS.maxLugTorqueFtLbf))}`),
    check('inspections_finished_by', sql`(${t.finishedAt} is null) = (${t.finishedById} is null)`),
  ],
)

// What was found on one checklist item; items never touched have no row and read as "not checked".
export const inspectionItems = pgTable(
  'inspection_items',
  {
    id: id(),
    inspectionId: uuid().notNull().references(() => inspections.id),
    itemCode: text().notNull(),
    status: text({ enum: FINDING_STATUSES }).notNull(),
    note: text(),
    updatedById: uuid().notNull().references(() => users.id),
    updatedAt: at().notNull().defaultNow(),
  },
  (t) => [
    unique('inspection_items_one_per_code').on(t.inspectionId, t.itemCode),
    check('inspection_items_status', sql`${t.status} in (${sql.raw(FINDING_STATUSES.map((s) => `'${s}'`).join(', '))})`),
  ],
)

// One estimate line. The yard's labour rate is copied in, so a later rate change never reprices it.
export const inspectionLines = pgTable(
  'inspection_lines',
  {
    id: id(),
    inspectionId: uuid().notNull().references(() => inspections.id),
    itemCode: text(),
    part: text().notNull(),
    quantity: integer().notNull(),
    unitPriceCents: integer().notNull(),
    labourHundredths: integer().notNull(),
    labourRateCents: integer().notNull(),
    createdById: uuid().notNull().references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [
    index('inspection_lines_inspection').on(t.inspectionId, t.createdAt),
    check('inspection_lines_part', sql`length(btrim(${t.part})) between 1 and 120`),
    check('inspection_lines_quantity', sql`${t.quantity} between 1 and ${sql.raw(String(LIMITS.maxQuantity))}`),
    check('inspection_lines_price', sql`${t.unitPriceCents} between 0 and ${sql.raw(String(LIMITS.maxUnitPriceCents))}`),
    check('inspection_lines_hours', sql`${t.labourHundredths} between 0 and ${sql.raw(String(LIMITS.maxLabourHours * 100))}`),
    check('inspection_lines_rate', sql`${t.labourRateCents} >= 0`),
  ],
)

// Photos of a finding: the files themselves are the vehicle's (server/files); this says which item they show.
export const inspectionPhotos = pgTable(
  'inspection_photos',
  {
    fileId: uuid().notNull().references(() => files.id),
    inspectionId: uuid().notNull().references(() => inspections.id),
    itemCode: text().notNull(),
  },
  (t) => [primaryKey({ columns: [t.fileId] }), index('inspection_photos_item').on(t.inspectionId, t.itemCode)],
)
