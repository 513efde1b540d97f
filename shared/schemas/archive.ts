import { z } from 'zod'
import { pagingShape } from './fields'
import { DISPOSITIONS } from '../domain/lifecycle/columns'
import { vehicleIdentityShape } from './board'
import { msg } from './field-messages'

export const archiveQuerySchema = z.object({
  q: z
    .string({ error: msg('archive.typeStockNumberPlate', 'Type a stock number, plate, VIN, make, model or owner.') })
    .trim()
    .max(60, msg('archive.keepSearchUnder60', 'Keep the search under 60 characters.'))
    .optional()
    .transform((v) => v || null),
  disposition: z
    .enum(DISPOSITIONS, { error: msg('archive.chooseOneWaysVehicle', 'Choose one of the ways a vehicle leaves the yard.') })
    .optional()
    .transform((v) => v ?? null),
  ...pagingShape,
})
export type ArchiveQuery = z.input<typeof archiveQuerySchema>

export const archiveRowSchema = z.object({
  ...vehicleIdentityShape,
  vin: z.string().nullable(),
  ownerName: z.string().nullable(),
  disposition: z.enum(DISPOSITIONS),
  arrivedAt: z.string(),
  closedAt: z.string(),
})
export type ArchiveRow = z.infer<typeof archiveRowSchema>

export const archivePageSchema = z.object({
  rows: z.array(archiveRowSchema),
  total: z.number(),
  page: z.number(),
  pageSize: z.number(),
})
export type ArchivePage = z.infer<typeof archivePageSchema>
