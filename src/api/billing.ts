import { useMutation, useQuery, type QueryClient } from '@tanstack/vue-query'
import { computed, toValue, type MaybeRefOrGetter } from 'vue'
import { z } from 'zod'
import {
  adjustmentAnswerSchema,
  drawerSchema,
  invoiceSchema,
  paymentAnswerSchema,
  type Adjustment,
  type CloseoutInput,
  type Payment,
  type Refund,
} from '@shared/schemas/billing'
import { request } from './http'
import { vehicleChanged } from './vehicles'

export const billingKeys = {
  all: ['billing'] as const,
  /** A vehicle's invoice, to now or to a chosen "as of" instant. */
  invoice: (vehicleId: string, asOf: string | null) => ['billing', 'invoice', vehicleId, asOf] as const,
  invoices: (vehicleId: string) => ['billing', 'invoice', vehicleId] as const,
  drawer: (date: string | null) => ['billing', 'drawer', date] as const,
  drawers: ['billing', 'drawer'] as const,
}

/**
 * A new key for one payment the clerk means to take, made when its dialog opens and sent with every
 * try: a retry or a second tap is recorded once. From getRandomValues, which a yard's plain-HTTP LAN
 * allows (crypto.randomUUID needs a secure page).
 */
export function newIdempotencyKey(): string {
  const b = crypto.getRandomValues(new Uint8Array(16))
  b[6] = (b[6]! & 0x0f) | 0x40
  b[8] = (b[8]! & 0x3f) | 0x80
  const h = [...b].map((x) => x.toString(16).padStart(2, '0')).join('')
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20)}`
}

const invoiceAnswer = z.object({ invoice: invoiceSchema })
const drawerAnswer = z.object({ drawer: drawerSchema })

export const fetchInvoice = (vehicleId: string, asOf: string | null) =>
  request('GET', `/api/vehicles/${vehicleId}/invoice${asOf ? `?asOf=${encodeURIComponent(asOf)}` : ''}`, invoiceAnswer).then((a) => a.invoice)

export function useInvoiceQuery(vehicleId: MaybeRefOrGetter<string>, asOf: MaybeRefOrGetter<string | null> = null) {
  return useQuery({ queryKey: computed(() => billingKeys.invoice(toValue(vehicleId), toValue(asOf))), queryFn: () => fetchInvoice(toValue(vehicleId), toValue(asOf)) })
}

/** Where a payment's receipt opens, as a PDF in the reader's language. */
export const receiptUrl = (vehicleId: string, paymentId: string, lang: string) => `/api/vehicles/${vehicleId}/payments/${paymentId}/receipt?lang=${lang}`

/** Money moved: the invoice, the vehicle page (history), the board's card and the drawer are stale. */
function moneyMoved(client: QueryClient, vehicleId: string) {
  void client.invalidateQueries({ queryKey: billingKeys.invoices(vehicleId) })
  void client.invalidateQueries({ queryKey: billingKeys.drawers })
  vehicleChanged(client, vehicleId)
}

export const takePayment = (vehicleId: string, input: Payment) => request('POST', `/api/vehicles/${vehicleId}/payments`, paymentAnswerSchema, input)
export const giveRefund = (vehicleId: string, input: Refund) => request('POST', `/api/vehicles/${vehicleId}/refunds`, paymentAnswerSchema, input)
export const adjustCharges = (vehicleId: string, input: Adjustment) => request('POST', `/api/vehicles/${vehicleId}/adjustments`, adjustmentAnswerSchema, input)
export const decideAdjustment = (vehicleId: string, adjustmentId: string, decision: { approve: true } | { approve: false; reason: string }) =>
  decision.approve
    ? request('POST', `/api/vehicles/${vehicleId}/adjustments/${adjustmentId}/approve`, adjustmentAnswerSchema)
    : request('POST', `/api/vehicles/${vehicleId}/adjustments/${adjustmentId}/decline`, adjustmentAnswerSchema, { reason: decision.reason })

export function useTakePaymentMutation() {
  return useMutation({
    mutationFn: ({ vehicleId, input }: { vehicleId: string; input: Payment }) => takePayment(vehicleId, input),
    onSuccess: (_a, { vehicleId }, _c, { client }) => moneyMoved(client, vehicleId),
  })
}

export function useRefundMutation() {
  return useMutation({
    mutationFn: ({ vehicleId, input }: { vehicleId: string; input: Refund }) => giveRefund(vehicleId, input),
    onSuccess: (_a, { vehicleId }, _c, { client }) => moneyMoved(client, vehicleId),
  })
}

export function useAdjustMutation() {
  return useMutation({
    mutationFn: ({ vehicleId, input }: { vehicleId: string; input: Adjustment }) => adjustCharges(vehicleId, input),
    onSuccess: (_a, { vehicleId }, _c, { client }) => moneyMoved(client, vehicleId),
  })
}

export function useDecideAdjustmentMutation() {
  return useMutation({
    mutationFn: ({ vehicleId, adjustmentId, decision }: { vehicleId: string; adjustmentId: string; decision: { approve: true } | { approve: false; reason: string } }) =>
      decideAdjustment(vehicleId, adjustmentId, decision),
    onSuccess: (_a, { vehicleId }, _c, { client }) => moneyMoved(client, vehicleId),
  })
}

export const fetchDrawer = (date: string | null) => request('GET', `/api/cash-drawer${date ? `?date=${date}` : ''}`, drawerAnswer).then((a) => a.drawer)

export function useDrawerQuery(date: MaybeRefOrGetter<string | null>) {
  return useQuery({ queryKey: computed(() => billingKeys.drawer(toValue(date))), queryFn: () => fetchDrawer(toValue(date)) })
}

export function useCloseDrawerMutation() {
  return useMutation({
    mutationFn: (input: CloseoutInput) => request('POST', '/api/cash-drawer/closeout', drawerAnswer, input).then((a) => a.drawer),
    onSuccess: (_a, _i, _c, { client }) => void client.invalidateQueries({ queryKey: billingKeys.drawers }),
  })
}
