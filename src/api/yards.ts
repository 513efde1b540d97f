import { useQuery } from '@tanstack/vue-query'
import { computed, toValue, type MaybeRefOrGetter } from 'vue'
import { currentYardSchema } from '@shared/schemas/yards'
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
