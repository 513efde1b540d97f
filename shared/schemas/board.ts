import { z } from 'zod'
import { BOARD_COLUMNS, VEHICLE_STATES } from '../domain/columns'
import { vehicleSummarySchema } from './charges'

export const boardCardSchema = z.object({
  id: z.uuid(),
  stockNumber: z.string(),
  year: z.number().nullable(),
  make: z.string().nullable(),
  model: z.string().nullable(),
  colour: z.string().nullable(),
  plate: z.string().nullable(),
  plateState: z.string().nullable(),
  state: z.enum(VEHICLE_STATES),
  version: z.number(),
  arrivedAt: z.string(),
  space: z.string().nullable(),
  rolls: z.boolean().nullable(),
  holds: z.array(z.object({ kind: z.string(), until: z.string().nullable() })),
  photoCount: z.number(),
  /** Null when the vehicle has no rule set to bill it by (shown as "no rule set"). */
  summary: vehicleSummarySchema.nullable(),
})
export type BoardCard = z.infer<typeof boardCardSchema>

export const boardSchema = z.object({
  yard: z.object({ id: z.uuid(), name: z.string(), timeZone: z.string() }),
  asOf: z.string(),
  columns: z.array(z.object({ column: z.enum(BOARD_COLUMNS), cards: z.array(boardCardSchema) })),
})
export type Board = z.infer<typeof boardSchema>
