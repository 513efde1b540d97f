import { useMutation, useQuery } from '@tanstack/vue-query'
import { computed, toValue, type MaybeRefOrGetter } from 'vue'
import {
  inspectionPageSchema,
  type EstimateLineInput,
  type InspectionPage,
  type ItemFinding,
  type RollAbilityInput,
  type ValuesInput,
} from '@shared/schemas/inspections'
import { boardKeys } from './board'
import { ApiError, request } from './http'
import { vehicleChanged, vehicleKeys } from './vehicles'

export const inspectionKeys = {
  all: ['inspection'] as const,
  /** The teardown page of one vehicle. */
  detail: (vehicleId: string) => ['inspection', vehicleId] as const,
}

// Every call answers with the whole teardown page, as the server worked it out.
const base = (vehicleId: string) => `/api/vehicles/${encodeURIComponent(vehicleId)}/inspection`
const page = (method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE', url: string, body?: unknown) => request(method, url, inspectionPageSchema, body)

export const fetchInspection = (vehicleId: string) => page('GET', base(vehicleId))
export const startInspection = (vehicleId: string) => page('POST', base(vehicleId))
export const acknowledgeSafety = (vehicleId: string) => page('POST', `${base(vehicleId)}/safety`)
export const markItem = (vehicleId: string, code: string, finding: ItemFinding) => page('PUT', `${base(vehicleId)}/items/${code}`, finding)
export const addLine = (vehicleId: string, line: EstimateLineInput) => page('POST', `${base(vehicleId)}/lines`, line)
export const changeLine = (vehicleId: string, lineId: string, line: EstimateLineInput) => page('PUT', `${base(vehicleId)}/lines/${lineId}`, line)
export const removeLine = (vehicleId: string, lineId: string) => page('DELETE', `${base(vehicleId)}/lines/${lineId}`)
export const setValues = (vehicleId: string, values: ValuesInput) => page('PUT', `${base(vehicleId)}/values`, values)
export const markRollAbility = (vehicleId: string, marks: RollAbilityInput) => page('PATCH', `${base(vehicleId)}/roll-ability`, marks)
export const finishInspection = (vehicleId: string) => page('POST', `${base(vehicleId)}/finish`)

export function addItemPhotos(vehicleId: string, code: string, files: File[]) {
  const form = new FormData()
  for (const f of files) form.append('files', f, f.name)
  return page('POST', `${base(vehicleId)}/items/${code}/photos`, form)
}

export function useInspectionQuery(vehicleId: MaybeRefOrGetter<string>) {
  return useQuery({ queryKey: computed(() => inspectionKeys.detail(toValue(vehicleId))), queryFn: () => fetchInspection(toValue(vehicleId)) })
}

/**
 * One change to the teardown: `mutate(() => markItem(…))`, any of the calls above (a move first, if it
 * must). Each answers with the whole page, which replaces the cached one; the board and the vehicle
 * page look again. Refused because someone else changed the vehicle (409), all three are fetched
 * again before the refusal shows, so the next tap is made against the vehicle as it is.
 */
export function useInspectionMutation(vehicleId: MaybeRefOrGetter<string>) {
  return useMutation({
    mutationFn: (send: () => Promise<InspectionPage>) => send(),
    onSuccess: (page, _send, _context, { client }) => {
      client.setQueryData(inspectionKeys.detail(toValue(vehicleId)), page)
      vehicleChanged(client, toValue(vehicleId))
    },
    onError: async (e, _send, _context, { client }) => {
      if (!(e instanceof ApiError && e.status === 409)) return
      const id = toValue(vehicleId)
      await Promise.all([inspectionKeys.detail(id), boardKeys.all, vehicleKeys.detail(id)].map((queryKey) => client.invalidateQueries({ queryKey })))
    },
  })
}
