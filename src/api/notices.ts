import { useMutation, useQuery, type QueryClient } from '@tanstack/vue-query'
import { computed, toValue, type MaybeRefOrGetter } from 'vue'
import { z } from 'zod'
import {
  bulkResultSchema,
  dueNoticesSchema,
  noticesPageSchema,
  type GenerateNotices,
  type NoticesPage,
  type ReturnedInput,
  type SendNotice,
} from '@shared/schemas/notices'
import { request } from './http'
import { vehicleChanged } from './vehicles'

export const noticeKeys = {
  /** One vehicle's planned notices and the letters made and sent. */
  vehicle: (vehicleId: string) => ['vehicle', vehicleId, 'notices'] as const,
  /** Every notice due now across the yard. */
  due: ['notices', 'due'] as const,
}

const base = (vehicleId: string) => `/api/vehicles/${vehicleId}/notices`

export const fetchNotices = (vehicleId: string) => request('GET', base(vehicleId), noticesPageSchema)

export function useNoticesQuery(vehicleId: MaybeRefOrGetter<string>) {
  return useQuery({ queryKey: computed(() => noticeKeys.vehicle(toValue(vehicleId))), queryFn: () => fetchNotices(toValue(vehicleId)) })
}

// A letter made or mailed changes the clocks (the card, the page, the due list) and the vehicle's files.
function noticesChanged(client: QueryClient, vehicleId: string, page?: NoticesPage) {
  if (page) client.setQueryData(noticeKeys.vehicle(vehicleId), page)
  else void client.invalidateQueries({ queryKey: noticeKeys.vehicle(vehicleId) })
  void client.invalidateQueries({ queryKey: noticeKeys.due })
  vehicleChanged(client, vehicleId)
}

export function useGenerateNoticesMutation(vehicleId: MaybeRefOrGetter<string>) {
  return useMutation({
    mutationFn: (input: GenerateNotices) => request('POST', base(toValue(vehicleId)), noticesPageSchema, input),
    onSuccess: (page, _input, _context, { client }) => noticesChanged(client, toValue(vehicleId), page),
  })
}

export function useSendNoticeMutation(vehicleId: MaybeRefOrGetter<string>) {
  return useMutation({
    mutationFn: ({ noticeId, input }: { noticeId: string; input: SendNotice }) => request('POST', `${base(toValue(vehicleId))}/${noticeId}/send`, noticesPageSchema, input),
    onSuccess: (page, _input, _context, { client }) => noticesChanged(client, toValue(vehicleId), page),
  })
}

export function useReturnedMutation(vehicleId: MaybeRefOrGetter<string>) {
  return useMutation({
    mutationFn: ({ noticeId, sendingId, input }: { noticeId: string; sendingId: string; input: ReturnedInput }) =>
      request('POST', `${base(toValue(vehicleId))}/${noticeId}/sendings/${sendingId}/returned`, noticesPageSchema, input),
    onSuccess: (page, _input, _context, { client }) => noticesChanged(client, toValue(vehicleId), page),
  })
}

export const fetchDueNotices = () => request('GET', '/api/notices/due', dueNoticesSchema)

export function useDueNoticesQuery(enabled: MaybeRefOrGetter<boolean>) {
  return useQuery({ queryKey: noticeKeys.due, queryFn: fetchDueNotices, enabled: computed(() => toValue(enabled)) })
}

const bulkAnswer = z.object({ results: z.array(bulkResultSchema) })

/** Makes and e-mails one vehicle's due notices; the bulk screen calls it vehicle by vehicle to show progress. */
export function useSendDueMutation() {
  return useMutation({
    mutationFn: (vehicleId: string) => request('POST', `${base(vehicleId)}/due`, bulkAnswer),
    onSuccess: (_answer, vehicleId, _context, { client }) => noticesChanged(client, vehicleId),
  })
}

/** Sends one letter again by e-mail (after its address was added): a failed bulk result's retry. */
export function useRetryEmailMutation() {
  return useMutation({
    mutationFn: ({ vehicleId, noticeId }: { vehicleId: string; noticeId: string }) =>
      request('POST', `${base(vehicleId)}/${noticeId}/send`, noticesPageSchema, { certifiedMail: false, email: true, trackingNumber: null, mailedOn: null }),
    onSuccess: (page, { vehicleId }, _context, { client }) => noticesChanged(client, vehicleId, page),
  })
}
