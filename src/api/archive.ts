import { keepPreviousData, useQuery } from '@tanstack/vue-query'
import { computed, toValue, type MaybeRefOrGetter } from 'vue'
import { archivePageSchema, archiveQuerySchema, type ArchiveQuery } from '@shared/schemas/archive'
import { request } from './http'

export const archiveKeys = {
  all: ['archive'] as const,
  /** One page of one search. */
  page: (query: ArchiveQuery) => ['archive', query] as const,
}

export function fetchArchive(query: ArchiveQuery) {
  const q = archiveQuerySchema.parse(query)
  const params = new URLSearchParams({ page: String(q.page), pageSize: String(q.pageSize) })
  if (q.q) params.set('q', q.q)
  if (q.disposition) params.set('disposition', q.disposition)
  return request('GET', `/api/vehicles/closed?${params}`, archivePageSchema)
}

/** The closed vehicles a search finds, a page at a time; the last page stays shown while the next loads. */
export function useArchiveQuery(query: MaybeRefOrGetter<ArchiveQuery>) {
  return useQuery({
    queryKey: computed(() => archiveKeys.page(toValue(query))),
    queryFn: () => fetchArchive(toValue(query)),
    placeholderData: keepPreviousData,
  })
}
