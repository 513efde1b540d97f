import { useMutation, useQuery } from '@tanstack/vue-query'
import { computed, toValue, type MaybeRefOrGetter } from 'vue'
import { z } from 'zod'
import { chooseYardSchema, currentYardSchema, myYardsSchema, type ChooseYard } from '@shared/schemas/yards'
import { request } from './http'

export const yardKeys = {
  /** The yard a staff member works in; per user, so signing in as someone else never shows the last one's. */
  current: (userId: string) => ['yard', 'current', userId] as const,
}

export const fetchCurrentYard = () => request('GET', '/api/yards/current', currentYardSchema).then((r) => r.yard)

/** The signed-in user's yard (its name, code and time zone), fetched once a visit. */
export function useCurrentYardQuery(userId: MaybeRefOrGetter<string | undefined>) {
  return useQuery({
    queryKey: computed(() => yardKeys.current(toValue(userId) ?? '')),
    queryFn: fetchCurrentYard,
    enabled: computed(() => Boolean(toValue(userId))),
    staleTime: Infinity,
  })
}

export const myYardsKeys = {
  /** The yards a person belongs to (the top bar's chooser), per user. */
  mine: (userId: string) => ['yard', 'mine', userId] as const,
}

export const fetchMyYards = () => request('GET', '/api/yards/mine', myYardsSchema)

export function useMyYardsQuery(userId: MaybeRefOrGetter<string | undefined>) {
  return useQuery({
    queryKey: computed(() => myYardsKeys.mine(toValue(userId) ?? '')),
    queryFn: fetchMyYards,
    enabled: computed(() => Boolean(toValue(userId))),
    staleTime: Infinity,
  })
}

/**
 * Work in another of one's yards. Everything on screen belongs to the old yard (the board's live
 * stream included), so the page loads afresh once the server has the choice.
 */
export function useChooseYardMutation() {
  return useMutation({
    mutationFn: (input: ChooseYard) => request('PUT', '/api/yards/current', z.object({ yard: z.object({ id: z.uuid() }) }), chooseYardSchema.parse(input)),
    onSuccess: () => window.location.reload(),
  })
}
