import { useMutation, useQuery, type QueryClient } from '@tanstack/vue-query'
import { calendarFeedSchema, deadlineListSchema } from '@shared/schemas/deadlines'
import { request, requestEmpty } from './http'

export const deadlineKeys = {
  all: ['deadlines'] as const,
  list: () => [...deadlineKeys.all, 'list'] as const,
  feed: () => [...deadlineKeys.all, 'feed'] as const,
}

/** Every open deadline across the yard; the page filters by kind itself, so one answer serves every filter. */
export const fetchDeadlines = () => request('GET', '/api/deadlines', deadlineListSchema)

/** The address the signed-in person downloads the calendar from (their session opens it). */
export const DEADLINES_ICS_URL = '/api/deadlines.ics'

/** Refetched every minute: a police clock counts in minutes. */
export const useDeadlinesQuery = () => useQuery({ queryKey: deadlineKeys.list(), queryFn: fetchDeadlines, refetchInterval: 60_000 })

export const fetchCalendarFeed = () => request('GET', '/api/deadlines/feed', calendarFeedSchema)
export const renewCalendarFeed = () => request('POST', '/api/deadlines/feed', calendarFeedSchema, {})
export const revokeCalendarFeed = () => requestEmpty('DELETE', '/api/deadlines/feed')

export const useCalendarFeedQuery = () => useQuery({ queryKey: deadlineKeys.feed(), queryFn: fetchCalendarFeed })

const feedChanged = (client: QueryClient) => client.invalidateQueries({ queryKey: deadlineKeys.feed() })

/** A new secret address (the old one stops working); its answer carries the URL, shown once. */
export const useRenewFeedMutation = () => useMutation({ mutationFn: renewCalendarFeed, onSuccess: (_a, _v, _c, { client }) => feedChanged(client) })

export const useRevokeFeedMutation = () => useMutation({ mutationFn: revokeCalendarFeed, onSuccess: (_a, _v, _c, { client }) => feedChanged(client) })
