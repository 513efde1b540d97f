import { useMutation, useQuery } from '@tanstack/vue-query'
import { intakeOptionsSchema, towInCreatedSchema, type TowIn } from '@shared/schemas/tow-in'
import { boardKeys } from './board'
import { request } from './http'
import { spaceKeys, spaceRefused } from './spaces'

export const towInKeys = {
  /** What the tow-in form offers: the yard, billing classes, staff. */
  options: ['intake-options'] as const,
}

export const fetchIntakeOptions = () => request('GET', '/api/vehicles/intake-options', intakeOptionsSchema)

export const useIntakeOptionsQuery = () => useQuery({ queryKey: towInKeys.options, queryFn: fetchIntakeOptions })

/** The record as JSON in `data`, the photos beside it: one request, so it is saved whole or not at all. */
export function createTowIn(input: TowIn, photos: File[]) {
  const form = new FormData()
  form.append('data', JSON.stringify(input))
  for (const p of photos) form.append('photos', p, p.name)
  return request('POST', '/api/vehicles', towInCreatedSchema, form)
}

/**
 * Logs a tow-in. The new vehicle takes a space and lands in Arrival: it resolves once the board has
 * been told to look again, so the board opened next shows it.
 */
export function useCreateTowInMutation() {
  return useMutation({
    mutationFn: ({ input, photos }: { input: TowIn; photos: File[] }) => createTowIn(input, photos),
    onSuccess: (_created, _vars, _context, { client }) => {
      void client.invalidateQueries({ queryKey: spaceKeys.all })
      return client.invalidateQueries({ queryKey: boardKeys.all })
    },
    // Refused because the space was taken meanwhile: the list shows the yard as it is now.
    onError: (e, _vars, _context, { client }) => {
      if (spaceRefused(e)) void client.invalidateQueries({ queryKey: spaceKeys.all })
    },
  })
}
