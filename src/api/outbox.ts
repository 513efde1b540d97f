import { keepPreviousData, useMutation, useQuery } from '@tanstack/vue-query'
import { computed, toValue, type MaybeRefOrGetter } from 'vue'
import { outboxMessageSchema, outboxPageSchema, outboxQuerySchema, type OutboxQuery } from '@shared/schemas/outbox'
import { request } from './http'

export const outboxKeys = {
  all: ['outbox'] as const,
  page: (query: OutboxQuery) => ['outbox', 'page', query] as const,
  message: (messageId: string) => ['outbox', 'message', messageId] as const,
}

export function fetchOutbox(query: OutboxQuery) {
  const q = outboxQuerySchema.parse(query)
  const params = new URLSearchParams({ page: String(q.page), pageSize: String(q.pageSize) })
  if (q.status) params.set('status', q.status)
  return request('GET', `/api/outbox?${params}`, outboxPageSchema)
}

export const fetchOutboxMessage = (messageId: string) => request('GET', `/api/outbox/${messageId}`, outboxMessageSchema)

export const retryOutboxMessage = (messageId: string) => request('POST', `/api/outbox/${messageId}/retry`, outboxMessageSchema)

/** Where an attachment opens (a PDF in the browser, anything else as a download). */
export const outboxAttachmentUrl = (messageId: string, attachmentId: string) => `/api/outbox/${messageId}/attachments/${attachmentId}`

/** One page of the outbox; refreshed every 10 s while open, since the worker changes it behind the page. */
export function useOutboxQuery(query: MaybeRefOrGetter<OutboxQuery>) {
  return useQuery({
    queryKey: computed(() => outboxKeys.page(toValue(query))),
    queryFn: () => fetchOutbox(toValue(query)),
    placeholderData: keepPreviousData,
    refetchInterval: 10_000,
  })
}

export function useOutboxMessageQuery(messageId: MaybeRefOrGetter<string | null>) {
  return useQuery({
    queryKey: computed(() => outboxKeys.message(toValue(messageId) ?? '')),
    queryFn: () => fetchOutboxMessage(toValue(messageId)!),
    enabled: computed(() => Boolean(toValue(messageId))),
  })
}

/** A failed message goes back in the queue: the list and the message are stale. */
export function useRetryMessageMutation() {
  return useMutation({
    mutationFn: (messageId: string) => retryOutboxMessage(messageId),
    onSuccess: (message, _messageId, _context, { client }) => {
      client.setQueryData(outboxKeys.message(message.id), message)
      return client.invalidateQueries({ queryKey: outboxKeys.all })
    },
  })
}
