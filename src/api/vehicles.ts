import { z } from 'zod'
import { chainCheckSchema } from '@shared/schemas/history'
import { searchResultSchema } from '@shared/schemas/search'
import { intakeOptionsSchema, towInCreatedSchema, type CorrectVehicleInput, type TowIn } from '@shared/schemas/tow-in'
import { vehiclePageSchema } from '@shared/schemas/vehicle-page'
import { request } from './http'

export const fetchIntakeOptions = () => request('GET', '/api/vehicles/intake-options', intakeOptionsSchema)

/** The record as JSON in `data`, the photos beside it: one request, so it is saved whole or not at all. */
export function createTowIn(input: TowIn, photos: File[]) {
  const form = new FormData()
  form.append('data', JSON.stringify(input))
  for (const p of photos) form.append('photos', p, p.name)
  return request('POST', '/api/vehicles', towInCreatedSchema, form)
}

export const fetchVehicle = (id: string) => request('GET', `/api/vehicles/${id}`, vehiclePageSchema)

export const correctVehicle = (id: string, input: CorrectVehicleInput) =>
  request('PATCH', `/api/vehicles/${id}`, z.object({ version: z.number() }), input)

export const searchVehicles = (q: string) => request('GET', `/api/vehicles/search?q=${encodeURIComponent(q)}`, searchResultSchema)

export const verifyHistory = (id: string) => request('GET', `/api/vehicles/${id}/history/verify`, chainCheckSchema)
