import { useQuery } from '@tanstack/vue-query'
import { todaySchema } from '@shared/schemas/today'
import { request } from './http'

export const todayKeys = {
  all: ['today'] as const,
}

/** The signed-in person's work for today and this week; what it lists follows their role. */
export const fetchToday = () => request('GET', '/api/today', todaySchema)

/** Refetched every minute, as the Deadlines page is: a police clock counts in minutes. */
export const useTodayQuery = () => useQuery({ queryKey: todayKeys.all, queryFn: fetchToday, refetchInterval: 60_000 })
