import { useMutation, useQuery, type QueryClient } from '@tanstack/vue-query'
import { computed, toValue, type MaybeRefOrGetter } from 'vue'
import { z } from 'zod'
import { chainCheckSchema } from '@shared/schemas/history'
import { searchResultSchema } from '@shared/schemas/search'
import type { CorrectVehicleInput } from '@shared/schemas/tow-in'
import { vehiclePageSchema } from '@shared/schemas/vehicle-page'
import { type VehicleValueInput, vehicleValueReplySchema } from '@shared/schemas/vehicles'
import { boardKeys } from './board'
import { request } from './http'

export const vehicleKeys = {
  all: ['vehicle'] as const,
  /** The vehicle page: the record, its tow, holds, files, bill and history. */
  detail: (vehicleId: string) => ['vehicle', vehicleId] as const,
  /** The check of the history's hash chain, asked for with a button. */
  historyCheck: (vehicleId: string) => ['vehicle', vehicleId, 'history-check'] as const,
}

/** What a change to one vehicle makes stale: its page and the board, which shows its card. */
export function vehicleChanged(client: QueryClient, vehicleId: string) {
  void client.invalidateQueries({ queryKey: vehicleKeys.detail(vehicleId) })
  void client.invalidateQueries({ queryKey: boardKeys.all })
}

export const fetchVehicle = (id: string) => request('GET', `/api/vehicles/${id}`, vehiclePageSchema)

export function useVehicleQuery(vehicleId: MaybeRefOrGetter<string>) {
  return useQuery({ queryKey: computed(() => vehicleKeys.detail(toValue(vehicleId))), queryFn: () => fetchVehicle(toValue(vehicleId)) })
}

export const correctVehicle = (id: string, input: CorrectVehicleInput) =>
  request('PATCH', `/api/vehicles/${id}`, z.object({ version: z.number() }), input)

export function useCorrectVehicleMutation() {
  return useMutation({
    mutationFn: ({ vehicleId, input }: { vehicleId: string; input: CorrectVehicleInput }) => correctVehicle(vehicleId, input),
    onSuccess: (_answer, { vehicleId }, _context, { client }) => vehicleChanged(client, vehicleId),
  })
}

export const recordVehicleValue = (id: string, input: VehicleValueInput) => request('PUT', `/api/vehicles/${id}/value`, vehicleValueReplySchema, input)

/** The value picks the lien clocks' branch: the page and the card's next date change with it. */
export function useRecordValueMutation() {
  return useMutation({
    mutationFn: ({ vehicleId, input }: { vehicleId: string; input: VehicleValueInput }) => recordVehicleValue(vehicleId, input),
    onSuccess: (_answer, { vehicleId }, _context, { client }) => vehicleChanged(client, vehicleId),
  })
}

/** Suggestions as the search box is typed in: asked for by the box itself, never cached. */
export const searchVehicles = (q: string) => request('GET', `/api/vehicles/search?q=${encodeURIComponent(q)}`, searchResultSchema)

export const verifyHistory = (id: string) => request('GET', `/api/vehicles/${id}/history/verify`, chainCheckSchema)

/**
 * The history's chain check, run when asked (`refetch()`), never kept once its page is left: an old
 * "intact" must not show beside entries added since.
 */
export function useHistoryCheckQuery(vehicleId: MaybeRefOrGetter<string>) {
  return useQuery({
    queryKey: computed(() => vehicleKeys.historyCheck(toValue(vehicleId))),
    queryFn: () => verifyHistory(toValue(vehicleId)),
    enabled: false,
    retry: false,
    gcTime: 0,
  })
}
