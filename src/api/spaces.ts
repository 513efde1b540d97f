import { z } from 'zod'
import { spacesSchema, type AssignSpace } from '@shared/schemas/spaces'
import { request } from './http'

/** The cache key of the yard's spaces: whatever places or moves a vehicle marks it stale. */
export const spacesKey = ['spaces'] as const

export const fetchSpaces = () => request('GET', '/api/spaces', spacesSchema)

export const assignSpace = (vehicleId: string, input: AssignSpace) =>
  request('PUT', `/api/vehicles/${vehicleId}/space`, z.object({ version: z.number(), space: z.string().nullable() }), input)
