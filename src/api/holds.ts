import { useMutation } from '@tanstack/vue-query'
import { z } from 'zod'
import { holdRecordSchema, type Hold, type LiftHold } from '@shared/schemas/holds'
import { request } from './http'
import { vehicleChanged } from './vehicles'

// A vehicle's holds are part of its page (vehicleKeys.detail): they have no cache of their own.
const holdsAnswer = z.object({ holds: z.array(holdRecordSchema) })

export const setHold = (vehicleId: string, input: Hold) => request('POST', `/api/vehicles/${vehicleId}/holds`, holdsAnswer, input)

export const liftHold = (vehicleId: string, holdId: string, input: LiftHold) =>
  request('POST', `/api/vehicles/${vehicleId}/holds/${holdId}/lift`, holdsAnswer, input)

export function useSetHoldMutation() {
  return useMutation({
    mutationFn: ({ vehicleId, input }: { vehicleId: string; input: Hold }) => setHold(vehicleId, input),
    onSuccess: (_answer, { vehicleId }, _context, { client }) => vehicleChanged(client, vehicleId),
  })
}

export function useLiftHoldMutation() {
  return useMutation({
    mutationFn: ({ vehicleId, holdId, input }: { vehicleId: string; holdId: string; input: LiftHold }) => liftHold(vehicleId, holdId, input),
    onSuccess: (_answer, { vehicleId }, _context, { client }) => vehicleChanged(client, vehicleId),
  })
}
