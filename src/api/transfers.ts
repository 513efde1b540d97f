import { useMutation, useQuery } from '@tanstack/vue-query'
import { computed, toValue, type MaybeRefOrGetter } from 'vue'
import { signatureInputSchema, type SignatureInput } from '@shared/schemas/releases'
import { transferInputSchema, transferPageSchema, type TransferInput } from '@shared/schemas/transfers'
import { request } from './http'
import { vehicleChanged } from './vehicles'

const base = (vehicleId: string) => `/api/vehicles/${vehicleId}/transfer`

export const transferKeys = {
  /** The title-transfer section of a vehicle's page: the record, the odometer rule, the lien-sale gate. */
  detail: (vehicleId: string) => ['vehicle', vehicleId, 'transfer'] as const,
}

export const fetchTransfer = (vehicleId: string) => request('GET', base(vehicleId), transferPageSchema)

export function useTransferQuery(vehicleId: MaybeRefOrGetter<string>) {
  return useQuery({ queryKey: computed(() => transferKeys.detail(toValue(vehicleId))), queryFn: () => fetchTransfer(toValue(vehicleId)) })
}

export type TransferStep = { step: 'record'; input: TransferInput } | { step: 'signature'; input: SignatureInput }

/** Recording and signing both answer the whole section, which replaces the cached one; the board's guards change with it. */
export function useTransferMutation(vehicleId: MaybeRefOrGetter<string>) {
  return useMutation({
    mutationFn: (s: TransferStep) =>
      s.step === 'record'
        ? request('PUT', base(toValue(vehicleId)), transferPageSchema, transferInputSchema.parse(s.input))
        : request('POST', `${base(toValue(vehicleId))}/signature`, transferPageSchema, signatureInputSchema.parse(s.input)),
    onSuccess: (page, _s, _context, { client }) => {
      client.setQueryData(transferKeys.detail(toValue(vehicleId)), page)
      vehicleChanged(client, toValue(vehicleId))
    },
  })
}

export const transferPacketUrl = (vehicleId: string, lang: string) => `${base(vehicleId)}/packet?lang=${lang}`
