import { z } from 'zod'
import { DISPOSITIONS } from '../domain/lifecycle/columns'
import { vehicleIdentityShape } from './board'

export const ARCHIVE_PAGE_SIZES = [25, 50, 100] as const

export const archiveQuerySchema = z.object({
  q: z
    .string({ error: 'Type a stock number, plate, VIN, make, model or owner.' })
    .trim()
    .max(60, 'Keep the search under 60 characters.')
    .optional()
    .transform((v) => v || null),
  disposition: z
    .enum(DISPOSITIONS, { error: 'Choose one of the ways a vehicle leaves the yard.' })
    .optional()
    .transform((v) => v ?? null),
  page: z.coerce.number({ error: 'The page is a number.' }).int('The page is a whole number.').min(1, 'Pages start at 1.').max(100_000).default(1),
  pageSize: z.coerce
    .number({ error: 'The page size is a number.' })
    .int('The page size is a whole number.')
    .refine((n) => (ARCHIVE_PAGE_SIZES as readonly number[]).includes(n), `Show ${ARCHIVE_PAGE_SIZES.join(', ')} a page.`)
    .default(25),
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
