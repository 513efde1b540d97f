import { useMutation, useQuery } from '@tanstack/vue-query'
import { computed, toValue, type MaybeRefOrGetter } from 'vue'
import { clockStepInputSchema, clockStepsPageSchema, type ClockStepInput } from '@shared/schemas/clock-steps'
import { request } from './http'
import { vehicleChanged } from './vehicles'

const base = (vehicleId: string) => `/api/vehicles/${vehicleId}/clock-events`

/** Under the vehicle's own key: a change to the vehicle refreshes it, and recording a step refreshes the vehicle. */
export const clockStepKeys = {
  /** The lien-sale steps only the office can witness, with the clock steps each starts or meets. */
  detail: (vehicleId: string) => ['vehicle', vehicleId, 'clock-steps'] as const,
}

export function useClockStepsQuery(vehicleId: MaybeRefOrGetter<string>) {
  return useQuery({
    queryKey: computed(() => clockStepKeys.detail(toValue(vehicleId))),
    queryFn: () => request('GET', base(toValue(vehicleId)), clockStepsPageSchema),
  })
}

/** Records (or re-records) one step; the deadlines, the sale date and the board move with it. */
export function useClockStepMutation(vehicleId: MaybeRefOrGetter<string>) {
  return useMutation({
    mutationFn: (input: ClockStepInput) => request('POST', base(toValue(vehicleId)), clockStepsPageSchema, clockStepInputSchema.parse(input)),
    onSuccess: (page, _input, _context, { client }) => {
      client.setQueryData(clockStepKeys.detail(toValue(vehicleId)), page)
      vehicleChanged(client, toValue(vehicleId))
    },
  })
}
