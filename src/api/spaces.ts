import { useMutation, useQuery, useQueryClient } from '@tanstack/vue-query'
import { z } from 'zod'
import { spacesSchema, type AssignSpace } from '@shared/schemas/spaces'
import { ApiError, request } from './http'
import { vehicleChanged } from './vehicles'

/** The yard's spaces: whatever places or moves a vehicle marks them stale. */
export const spaceKeys = {
  all: ['spaces'] as const,
}

export const fetchSpaces = () => request('GET', '/api/spaces', spacesSchema)

export const useSpacesQuery = () => useQuery({ queryKey: spaceKeys.all, queryFn: fetchSpaces })

/** Looks at the yard's spaces again, e.g. as a form to choose one opens. */
export function useSpacesRefresh() {
  const client = useQueryClient()
  return () => void client.invalidateQueries({ queryKey: spaceKeys.all })
}

/** A refusal that names the space: someone else took it meanwhile. */
export const spaceRefused = (e: unknown) => e instanceof ApiError && e.issues.some((i) => i.path === 'spaceId')

export const assignSpace = (vehicleId: string, input: AssignSpace) =>
  request('PUT', `/api/vehicles/${vehicleId}/space`, z.object({ version: z.number(), space: z.string().nullable() }), input)

export function useAssignSpaceMutation() {
  return useMutation({
    mutationFn: ({ vehicleId, input }: { vehicleId: string; input: AssignSpace }) => assignSpace(vehicleId, input),
    onSuccess: (_answer, { vehicleId }, _context, { client }) => {
      vehicleChanged(client, vehicleId)
      void client.invalidateQueries({ queryKey: spaceKeys.all })
    },
    onError: (e, _vars, _context, { client }) => {
      if (spaceRefused(e)) void client.invalidateQueries({ queryKey: spaceKeys.all })
    },
  })
}
