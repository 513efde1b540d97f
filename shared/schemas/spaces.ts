import { z } from 'zod'
import { msg } from './field-messages'

export const spaceSchema = z.object({
  id: z.uuid(),
  row: z.string(),
  number: z.number(),
  size: z.enum(['standard', 'wide', 'motorcycle']),
  /** Retired: takes no vehicle; still listed where a vehicle sits in it. */
  retired: z.boolean(),
  label: z.string(),
  /** The vehicle in it now; null when free. */
  occupant: z.object({ id: z.uuid(), stockNumber: z.string() }).nullable(),
})
export type Space = z.infer<typeof spaceSchema>

export const spacesSchema = z.object({ spaces: z.array(spaceSchema) })

export const assignSpaceSchema = z.object({
  version: z.number().int().positive(),
  /** null takes the vehicle out of its space (say, moved to the wash bay for a day). */
  spaceId: z.uuid({ error: msg('common.chooseSpaceFromList', 'Choose a space from the list.') }).nullable(),
})
export type AssignSpace = z.infer<typeof assignSpaceSchema>

export const spaceLabel = (s: { row: string; number: number }) => `${s.row}-${s.number}`
