import { useMutation, useQuery } from '@tanstack/vue-query'
import { computed, toValue, type MaybeRefOrGetter } from 'vue'
import {
  publicationInputSchema,
  publicationsPageSchema,
  saleDateInputSchema,
  saleDatePageSchema,
  type PublicationInput,
  type SaleDateInput,
} from '@shared/schemas/publications'
import { ApiError, request } from './http'
import { vehicleChanged } from './vehicles'

const base = (vehicleId: string) => `/api/vehicles/${vehicleId}/publications`
const saleBase = (vehicleId: string) => `/api/vehicles/${vehicleId}/sale-date`

// Under the vehicle's own key: a change to the vehicle (vehicleChanged) refreshes both, and each
// refreshes the other (a sale date moves the publication's window; a publication the earliest sale).
export const publicationKeys = {
  /** The newspaper publication section: what the rule set asks, what ran, the affidavits. */
  detail: (vehicleId: string) => ['vehicle', vehicleId, 'publications'] as const,
  /** The text for the newspaper, per language. */
  text: (vehicleId: string, lang: string) => ['vehicle', vehicleId, 'publications', 'text', lang] as const,
  /** The lien sale's day on record and the earliest the law allows. */
  saleDate: (vehicleId: string) => ['vehicle', vehicleId, 'sale-date'] as const,
}

export function usePublicationsQuery(vehicleId: MaybeRefOrGetter<string>, enabled: MaybeRefOrGetter<boolean> = true) {
  return useQuery({
    queryKey: computed(() => publicationKeys.detail(toValue(vehicleId))),
    queryFn: () => request('GET', base(toValue(vehicleId)), publicationsPageSchema),
    enabled: computed(() => toValue(enabled)),
  })
}

async function fetchText(vehicleId: string, lang: string): Promise<string> {
  const res = await fetch(`${base(vehicleId)}/text?lang=${lang}`, { credentials: 'same-origin', headers: { accept: 'text/plain' } })
  if (!res.ok) {
    const data = (await res.json().catch(() => ({}))) as { error?: string }
    throw new ApiError(res.status, data.error ?? `The server answered ${res.status}.`)
  }
  return res.text()
}

export function usePublicationTextQuery(vehicleId: MaybeRefOrGetter<string>, lang: MaybeRefOrGetter<string>, enabled: MaybeRefOrGetter<boolean>) {
  return useQuery({
    queryKey: computed(() => publicationKeys.text(toValue(vehicleId), toValue(lang))),
    queryFn: () => fetchText(toValue(vehicleId), toValue(lang)),
    enabled: computed(() => toValue(enabled)),
  })
}

export type PublicationStep = { step: 'record'; input: PublicationInput } | { step: 'proof'; publicationId: string; file: File }

function send(vehicleId: string, s: PublicationStep) {
  if (s.step === 'record') return request('POST', base(vehicleId), publicationsPageSchema, publicationInputSchema.parse(s.input))
  const form = new FormData()
  form.append('files', s.file, s.file.name)
  return request('POST', `${base(vehicleId)}/${s.publicationId}/proof`, publicationsPageSchema, form)
}

/** Recording a publication or its affidavit answers the whole section; the vehicle's clocks change with it. */
export function usePublicationMutation(vehicleId: MaybeRefOrGetter<string>) {
  return useMutation({
    mutationFn: (s: PublicationStep) => send(toValue(vehicleId), s),
    onSuccess: (page, _s, _context, { client }) => {
      client.setQueryData(publicationKeys.detail(toValue(vehicleId)), page)
      vehicleChanged(client, toValue(vehicleId))
    },
  })
}

export function useSaleDateQuery(vehicleId: MaybeRefOrGetter<string>, enabled: MaybeRefOrGetter<boolean> = true) {
  return useQuery({
    queryKey: computed(() => publicationKeys.saleDate(toValue(vehicleId))),
    queryFn: () => request('GET', saleBase(toValue(vehicleId)), saleDatePageSchema),
    enabled: computed(() => toValue(enabled)),
  })
}

/**
 * Sets the sale day. A day earlier than the law allows comes back on the `day` field in the reader's
 * language (the refusal's code and its earliest date), not only in the server's English.
 */
export function useSaleDateMutation(vehicleId: MaybeRefOrGetter<string>) {
  return useMutation({
    mutationFn: async (input: SaleDateInput) => {
      try {
        return await request('PUT', saleBase(toValue(vehicleId)), saleDatePageSchema, saleDateInputSchema.parse(input))
      } catch (e) {
        if (e instanceof ApiError && e.body.code === 'saleTooEarly') throw new ApiError(e.status, e.message, [{ path: 'day', message: e.message }], e.body)
        throw e
      }
    },
    onSuccess: (page, _input, _context, { client }) => {
      client.setQueryData(publicationKeys.saleDate(toValue(vehicleId)), page)
      vehicleChanged(client, toValue(vehicleId))
    },
  })
}
