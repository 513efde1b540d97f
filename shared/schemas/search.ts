import { z } from 'zod'
import { VEHICLE_STATES } from '../domain/lifecycle/columns'
import { msg } from './field-messages'

export const searchQuerySchema = z.object({
  q: z.string({ error: msg('search.typeStockNumberPlate', 'Type a stock number, plate, VIN or owner name.') }).trim().min(2, msg('search.typeAtLeast2', 'Type at least 2 characters.')).max(60),
})

export const searchHitSchema = z.object({
  id: z.uuid(),
  stockNumber: z.string(),
  title: z.string(),
  plate: z.string().nullable(),
  vin: z.string().nullable(),
  ownerName: z.string().nullable(),
  state: z.enum(VEHICLE_STATES),
  /** Which field matched, so the list can say why a vehicle is shown. */
  matched: z.enum(['stock number', 'plate', 'VIN', 'vehicle', 'owner']),
})
export type SearchHit = z.infer<typeof searchHitSchema>

export const searchResultSchema = z.object({ hits: z.array(searchHitSchema) })
