import { useMutation, useQuery } from '@tanstack/vue-query'
import { computed, toValue, type MaybeRefOrGetter } from 'vue'
import { z } from 'zod'
import {
  cardCheckoutInputSchema,
  cardCheckoutSchema,
  cardRefundAnswerSchema,
  cardRefundInputSchema,
  ownerCardCheckoutInputSchema,
  type CardRefundInput,
  type CardCheckoutInput,
  type OwnerCardCheckoutInput,
} from '@shared/schemas/card-payments'
import { ownerPageSchema } from '@shared/schemas/owner'
import { signatureInputSchema, type SignatureInput } from '@shared/schemas/releases'
import { billingKeys } from './billing'
import { request } from './http'
import { ownerKeys } from './owner'
import { vehicleChanged } from './vehicles'

export const cardPaymentKeys = {
  checkout: (vehicleId: string, checkoutId: string) => ['card-payments', vehicleId, checkoutId] as const,
}

const answer = z.object({ checkout: cardCheckoutSchema })

/** Where the counter and the owner's page keep the open card payment while the hosted page is shown (this tab only). */
const PENDING_COUNTER = 'holdfast.card-checkout'
const PENDING_OWNER = 'holdfast.owner-card-checkout'

/** The counter's card payment on the hosted page: opened here, then the browser goes to `checkout.url`. */
export const startCardCheckout = (vehicleId: string, input: CardCheckoutInput) =>
  request('POST', `/api/vehicles/${vehicleId}/card-checkouts`, answer, cardCheckoutInputSchema.parse(input)).then((a) => a.checkout)

export function useStartCardCheckoutMutation() {
  return useMutation({
    mutationFn: ({ vehicleId, input }: { vehicleId: string; input: CardCheckoutInput }) => startCardCheckout(vehicleId, input),
    onSuccess: (checkout, { vehicleId }) => sessionStorage.setItem(PENDING_COUNTER, JSON.stringify({ vehicleId, checkoutId: checkout.id })),
  })
}

/** The card payment the counter sent to the hosted page from this tab, for this vehicle, if any. */
export function pendingCounterCheckout(vehicleId: string): string | null {
  try {
    const p = JSON.parse(sessionStorage.getItem(PENDING_COUNTER) ?? 'null') as { vehicleId: string; checkoutId: string } | null
    return p && p.vehicleId === vehicleId ? p.checkoutId : null
  } catch {
    return null
  }
}

export const forgetCounterCheckout = () => sessionStorage.removeItem(PENDING_COUNTER)

export const fetchCardCheckout = (vehicleId: string, checkoutId: string) =>
  request('GET', `/api/vehicles/${vehicleId}/card-checkouts/${checkoutId}`, answer).then((a) => a.checkout)

/**
 * One card payment, asked again every 2 s while the service has not yet told Holdfast (its webhook);
 * once it is paid, the vehicle's page and its invoice are stale.
 */
export function useCardCheckoutQuery(vehicleId: MaybeRefOrGetter<string>, checkoutId: MaybeRefOrGetter<string | null>) {
  return useQuery({
    queryKey: computed(() => cardPaymentKeys.checkout(toValue(vehicleId), toValue(checkoutId) ?? '')),
    queryFn: async ({ client }) => {
      const c = await fetchCardCheckout(toValue(vehicleId), toValue(checkoutId)!)
      if (c.status === 'paid') {
        await client.invalidateQueries({ queryKey: billingKeys.invoices(toValue(vehicleId)) })
        await vehicleChanged(client, toValue(vehicleId))
      }
      return c
    },
    enabled: computed(() => Boolean(toValue(checkoutId))),
    refetchInterval: (q) => (q.state.data?.status === 'open' && q.state.dataUpdateCount < 30 ? 2_000 : false),
  })
}

/** The owner's "Pay by card": opens the hosted page for all that is due; the key stays in this tab for the way back. */
export function useOwnerCardCheckoutMutation(key: MaybeRefOrGetter<string>) {
  return useMutation({
    mutationFn: (input: OwnerCardCheckoutInput) =>
      request('POST', `/api/owner/${encodeURIComponent(toValue(key))}/card-checkout`, answer, ownerCardCheckoutInputSchema.parse(input)).then((a) => a.checkout),
    onSuccess: () => sessionStorage.setItem(PENDING_OWNER, toValue(key)),
  })
}

/** Back from the hosted page: the owner's key this tab kept, once (it is not kept afterwards). */
export function takeOwnerReturnKey(): string | null {
  const key = sessionStorage.getItem(PENDING_OWNER)
  sessionStorage.removeItem(PENDING_OWNER)
  return key
}


/** The owner signs the release from their page; the answer is the whole page again, which replaces the cached one. */
export function useOwnerReleaseSignatureMutation(key: MaybeRefOrGetter<string>) {
  return useMutation({
    mutationFn: (input: SignatureInput) => request('POST', `/api/owner/${encodeURIComponent(toValue(key))}/release-signature`, ownerPageSchema, signatureInputSchema.parse(input)),
    onSuccess: (page, _input, _context, { client }) => client.setQueryData(ownerKeys.page(toValue(key)), page),
  })
}

/** A manager gives back (all or part of) a card payment made on the hosted page, through the payment service. */
export const refundCardPayment = (vehicleId: string, input: CardRefundInput) =>
  request('POST', `/api/vehicles/${vehicleId}/card-refunds`, cardRefundAnswerSchema, cardRefundInputSchema.parse(input))

export function useCardRefundMutation() {
  return useMutation({
    mutationFn: ({ vehicleId, input }: { vehicleId: string; input: CardRefundInput }) => refundCardPayment(vehicleId, input),
    onSuccess: async (_a, { vehicleId }, _c, { client }) => {
      await client.invalidateQueries({ queryKey: billingKeys.invoices(vehicleId) })
      await vehicleChanged(client, vehicleId)
    },
  })
}
