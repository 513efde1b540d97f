import { useQuery } from '@tanstack/vue-query'
import { glanceSchema } from '@shared/schemas/glance'
import { request } from './http'

export const glanceKeys = {
  all: ['glance'] as const,
}

export const fetchGlance = () => request('GET', '/api/glance', glanceSchema)

/** The manager's yard at a glance; refetched every minute, as the board's snapshot moves on. */
export const useGlanceQuery = () => useQuery({ queryKey: glanceKeys.all, queryFn: fetchGlance, refetchInterval: 60_000 })
