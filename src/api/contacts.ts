import { useMutation, useQuery, type QueryClient } from '@tanstack/vue-query'
import { computed, toValue, type MaybeRefOrGetter } from 'vue'
import { contactsPageSchema, type Contact, type ContactsPage, type RecordsAnswer, type RecordsRequest } from '@shared/schemas/contacts'
import { request } from './http'
import { noticeKeys } from './notices'
import { vehicleChanged } from './vehicles'

export const contactKeys = {
  /** One vehicle's contacts, records requests and records deadline. */
  vehicle: (vehicleId: string) => ['vehicle', vehicleId, 'contacts'] as const,
}

const base = (vehicleId: string) => `/api/vehicles/${vehicleId}`

export const fetchContacts = (vehicleId: string) => request('GET', `${base(vehicleId)}/contacts`, contactsPageSchema)

export function useContactsQuery(vehicleId: MaybeRefOrGetter<string>) {
  return useQuery({ queryKey: computed(() => contactKeys.vehicle(toValue(vehicleId))), queryFn: () => fetchContacts(toValue(vehicleId)) })
}

// Every answer is the whole section again; a contact change also changes who the notices go to, and a
// records request meets a deadline on the card.
function contactsChanged(client: QueryClient, vehicleId: string, page: ContactsPage) {
  client.setQueryData(contactKeys.vehicle(vehicleId), page)
  void client.invalidateQueries({ queryKey: noticeKeys.vehicle(vehicleId) })
  vehicleChanged(client, vehicleId)
}

/** Add (no id) or change (with an id) a contact. */
export function useSaveContactMutation(vehicleId: MaybeRefOrGetter<string>) {
  return useMutation({
    mutationFn: ({ id, input }: { id: string | null; input: Contact }) =>
      id ? request('PUT', `${base(toValue(vehicleId))}/contacts/${id}`, contactsPageSchema, input) : request('POST', `${base(toValue(vehicleId))}/contacts`, contactsPageSchema, input),
    onSuccess: (page, _input, _context, { client }) => contactsChanged(client, toValue(vehicleId), page),
  })
}

export function useRemoveContactMutation(vehicleId: MaybeRefOrGetter<string>) {
  return useMutation({
    mutationFn: (contactId: string) => request('DELETE', `${base(toValue(vehicleId))}/contacts/${contactId}`, contactsPageSchema),
    onSuccess: (page, _input, _context, { client }) => contactsChanged(client, toValue(vehicleId), page),
  })
}

export function useRecordsRequestMutation(vehicleId: MaybeRefOrGetter<string>) {
  return useMutation({
    mutationFn: (input: RecordsRequest) => request('POST', `${base(toValue(vehicleId))}/records-requests`, contactsPageSchema, input),
    onSuccess: (page, _input, _context, { client }) => contactsChanged(client, toValue(vehicleId), page),
  })
}

export function useRecordsAnswerMutation(vehicleId: MaybeRefOrGetter<string>) {
  return useMutation({
    mutationFn: ({ requestId, input }: { requestId: string; input: RecordsAnswer }) =>
      request('PUT', `${base(toValue(vehicleId))}/records-requests/${requestId}/answer`, contactsPageSchema, input),
    onSuccess: (page, _input, _context, { client }) => contactsChanged(client, toValue(vehicleId), page),
  })
}
