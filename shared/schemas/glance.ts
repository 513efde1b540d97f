import { z } from 'zod'
import { BOARD_COLUMNS } from '../domain/lifecycle/columns'
import { msg } from './field-messages'

/** The manager's yard at a glance (issue 12): the plan of spaces and the figures behind the charts. */

export const glanceQuerySchema = z.object({
  /** How many weeks of the yard's calendar the revenue chart and the release figures cover, this week included. */
  weeks: z.coerce
    .number({ error: msg('glance.giveWeeksAsWhole', 'Give the weeks as a whole number from 4 to 52.') })
    .int({ error: msg('glance.giveWeeksAsWhole', 'Give the weeks as a whole number from 4 to 52.') })
    .min(4, { error: msg('glance.giveWeeksAsWhole', 'Give the weeks as a whole number from 4 to 52.') })
    .max(52, { error: msg('glance.giveWeeksAsWhole', 'Give the weeks as a whole number from 4 to 52.') })
    .default(12),
})
export type GlanceQuery = z.infer<typeof glanceQuerySchema>

/** A space is free, holds a vehicle (in a column of the board), or holds a vehicle under a hold. */
export const SPACE_STATES = ['free', 'occupied', 'held'] as const
export type SpaceState = (typeof SPACE_STATES)[number]

/** Days on the lot, on the yard's calendar from the arrival day: the bands the age chart counts. */
export const AGE_BANDS = [
  { band: '0-7', max: 7 },
  { band: '8-30', max: 30 },
  { band: '31-60', max: 60 },
  { band: '61-90', max: 90 },
  { band: 'over-90', max: Infinity },
] as const
export type AgeBand = (typeof AGE_BANDS)[number]['band']

export const glanceSpaceSchema = z.object({
  id: z.uuid(),
  row: z.string(),
  number: z.number().int(),
  label: z.string(),
  size: z.enum(['standard', 'wide', 'motorcycle']),
  state: z.enum(SPACE_STATES),
  /** The occupant's column and stock number; null when free. */
  column: z.enum(BOARD_COLUMNS).nullable(),
  vehicleId: z.uuid().nullable(),
  stockNumber: z.string().nullable(),
  days: z.number().int().nullable(),
})
export type GlanceSpace = z.infer<typeof glanceSpaceSchema>

export const glanceSchema = z.object({
  asOf: z.string(),
  timeZone: z.string(),
  today: z.string(),
  spaces: z.array(glanceSpaceSchema),
  /** Vehicles on the lot with no space. */
  unplaced: z.number().int(),
  columns: z.array(z.object({ column: z.enum(BOARD_COLUMNS), count: z.number().int() })),
  ages: z.array(z.object({ band: z.enum(AGE_BANDS.map((b) => b.band) as [AgeBand, ...AgeBand[]]), count: z.number().int() })),
  /**
   * What the bills grew by in each week (Monday to Sunday on the yard's calendar): storage, the rule
   * set's fees and their tax — the daily report's "storage earned", summed over the week.
   */
  weeks: z.array(z.object({ start: z.string(), storageCents: z.number().int() })),
  /** Vehicles that left the board (closed) from `from` to now, however they left. */
  closed: z.object({
    from: z.string(),
    count: z.number().int(),
    /** Mean of (closed − arrived) in 24-hour days, to one decimal; null when none closed. */
    averageDays: z.number().nullable(),
    lienSales: z.number().int(),
    /** lienSales / count, 0–1; null when none closed. */
    lienSaleShare: z.number().nullable(),
  }),
})
export type Glance = z.infer<typeof glanceSchema>
