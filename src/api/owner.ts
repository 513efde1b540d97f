import { keepPreviousData, useMutation, useQuery } from '@tanstack/vue-query'
import { computed, toValue, type MaybeRefOrGetter } from 'vue'
import {
  lookupAnswerSchema,
  ownerDecisionInputSchema,
  ownerLinkCreatedSchema,
  ownerPageSchema,
  ownerQuoteSchema,
  vehicleOwnerSchema,
  type LookupInput,
  type OwnerDecisionInput,
} from '@shared/schemas/owner'
import { request } from './http'
import { vehicleChanged } from './vehicles'

// The owner's page (no account): every call carries the page's key — the link's token or its short code.
const base = (key: string) => `/api/owner/${encodeURIComponent(key)}`

export const ownerKeys = {
  /** One owner page, by its key. */
  page: (key: string) => ['owner', key] as const,
  /** What collecting on a date would cost. */
  quote: (key: string, date: string) => ['owner', key, 'quote', date] as const,
  /** The office's view of a vehicle's owner links and the owner's choices. */
  vehicle: (vehicleId: string) => ['vehicle', vehicleId, 'owner'] as const,
}

export const fetchOwnerPage = (key: string) => request('GET', base(key), ownerPageSchema)

export function useOwnerPageQuery(key: MaybeRefOrGetter<string>) {
  // A wrong, expired or withdrawn key is an answer, not a hiccup: asking again only spends the address's tries.
  return useQuery({ queryKey: computed(() => ownerKeys.page(toValue(key))), queryFn: () => fetchOwnerPage(toValue(key)), retry: false })
}

export const fetchOwnerQuote = (key: string, date: string) => request('GET', `${base(key)}/quote?date=${encodeURIComponent(date)}`, ownerQuoteSchema)

export function useOwnerQuoteQuery(key: MaybeRefOrGetter<string>, date: MaybeRefOrGetter<string | null>) {
  return useQuery({
    queryKey: computed(() => ownerKeys.quote(toValue(key), toValue(date) ?? '')),
    queryFn: () => fetchOwnerQuote(toValue(key), toValue(date)!),
    enabled: computed(() => Boolean(toValue(date))),
    placeholderData: keepPreviousData,
    retry: false,
  })
}

/** The owner's choice; the answer is the whole page again, which replaces the cached one. */
export function useOwnerDecisionMutation(key: MaybeRefOrGetter<string>) {
  return useMutation({
    mutationFn: (input: OwnerDecisionInput) => request('POST', `${base(toValue(key))}/decision`, ownerPageSchema, ownerDecisionInputSchema.parse(input)),
    onSuccess: (page, _input, _context, { client }) => client.setQueryData(ownerKeys.page(toValue(key)), page),
  })
}

/** "Is my vehicle here?": asked once per press, never cached. */
export const lookUpVehicle = (input: LookupInput) => request('POST', '/api/vehicle-lookup', lookupAnswerSchema, input)

// ---- the office's side ----

export const fetchVehicleOwner = (vehicleId: string) => request('GET', `/api/vehicles/${vehicleId}/owner-links`, vehicleOwnerSchema)

export function useVehicleOwnerQuery(vehicleId: MaybeRefOrGetter<string>) {
  return useQuery({ queryKey: computed(() => ownerKeys.vehicle(toValue(vehicleId))), queryFn: () => fetchVehicleOwner(toValue(vehicleId)) })
}

/** A new link: its token and code are in this answer only, so the caller shows them at once. */
export function useCreateOwnerLinkMutation(vehicleId: MaybeRefOrGetter<string>) {
  return useMutation({
    mutationFn: () => request('POST', `/api/vehicles/${toValue(vehicleId)}/owner-links`, ownerLinkCreatedSchema),
    onSuccess: (_created, _input, _context, { client }) => {
      void client.invalidateQueries({ queryKey: ownerKeys.vehicle(toValue(vehicleId)) })
      vehicleChanged(client, toValue(vehicleId))
    },
  })
}

export function useRevokeOwnerLinkMutation(vehicleId: MaybeRefOrGetter<string>) {
  return useMutation({
    mutationFn: (linkId: string) => request('POST', `/api/vehicles/${toValue(vehicleId)}/owner-links/${linkId}/revoke`, vehicleOwnerSchema),
    onSuccess: (answer, _linkId, _context, { client }) => {
      client.setQueryData(ownerKeys.vehicle(toValue(vehicleId)), answer)
      vehicleChanged(client, toValue(vehicleId))
    },
  })
}
