import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/vue-query'
import { z } from 'zod'
import { editYardSchema, newYardSchema, spaceBlockSchema, yardSettingsListSchema, type EditYard, type NewYard, type SpaceBlock } from '@shared/schemas/yard-settings'
import { request } from './http'
import { spaceKeys } from './spaces'

export const yardSettingsKeys = {
  all: ['settings', 'yards'] as const,
}

const base = '/api/settings/yards'
export const fetchYardSettings = () => request('GET', base, yardSettingsListSchema).then((r) => r.yards)
export const addYard = (input: NewYard) => request('POST', base, z.object({ id: z.uuid() }), newYardSchema.parse(input))
export const editYard = (yardId: string, input: EditYard) => request('PATCH', `${base}/${yardId}`, yardSettingsListSchema, editYardSchema.parse(input))
export const addSpaces = (yardId: string, input: SpaceBlock) => request('POST', `${base}/${yardId}/spaces`, yardSettingsListSchema, spaceBlockSchema.parse(input))
export const retireSpace = (yardId: string, spaceId: string) => request('POST', `${base}/${yardId}/spaces/${spaceId}/retire`, yardSettingsListSchema, {})

export function useYardSettingsQuery() {
  return useQuery({ queryKey: yardSettingsKeys.all, queryFn: fetchYardSettings })
}

// A yard's details reach the top bar's chooser and the picker of spaces: both are marked stale.
function changed(client: QueryClient) {
  void client.invalidateQueries({ queryKey: yardSettingsKeys.all })
  void client.invalidateQueries({ queryKey: ['yard'] })
  void client.invalidateQueries({ queryKey: spaceKeys.all })
}

export function useAddYardMutation() {
  const client = useQueryClient()
  return useMutation({ mutationFn: addYard, onSuccess: () => changed(client) })
}
export function useEditYardMutation() {
  const client = useQueryClient()
  return useMutation({ mutationFn: (v: { yardId: string; input: EditYard }) => editYard(v.yardId, v.input), onSuccess: () => changed(client) })
}
export function useAddSpacesMutation() {
  const client = useQueryClient()
  return useMutation({ mutationFn: (v: { yardId: string; input: SpaceBlock }) => addSpaces(v.yardId, v.input), onSuccess: () => changed(client) })
}
export function useRetireSpaceMutation() {
  const client = useQueryClient()
  return useMutation({ mutationFn: (v: { yardId: string; spaceId: string }) => retireSpace(v.yardId, v.spaceId), onSuccess: () => changed(client) })
}
