import { archivePageSchema, archiveQuerySchema, type ArchiveQuery } from '@shared/schemas/archive'
import { request } from './http'

export function fetchArchive(query: ArchiveQuery) {
  const q = archiveQuerySchema.parse(query)
  const params = new URLSearchParams({ page: String(q.page), pageSize: String(q.pageSize) })
  if (q.q) params.set('q', q.q)
  if (q.disposition) params.set('disposition', q.disposition)
  return request('GET', `/api/vehicles/closed?${params}`, archivePageSchema)
}
