import { useMutation, useQuery } from '@tanstack/vue-query'
import { computed, toValue, type MaybeRefOrGetter } from 'vue'
import {
  claimantInputSchema,
  gatePassIssuedSchema,
  gateRecordedSchema,
  gateVehicleSchema,
  handoverInputSchema,
  releasePageSchema,
  signatureInputSchema,
  type Claimant,
  type HandoverInput,
  type ReleasePage,
  type SignatureInput,
} from '@shared/schemas/releases'
import { request } from './http'
import { vehicleChanged } from './vehicles'

const base = (vehicleId: string) => `/api/vehicles/${vehicleId}/release`

export const releaseKeys = {
  /** The release section of a vehicle's page: the record, the inventory, what is left, the gate pass. */
  detail: (vehicleId: string) => ['vehicle', vehicleId, 'release'] as const,
}

export const fetchRelease = (vehicleId: string) => request('GET', base(vehicleId), releasePageSchema)

export function useReleaseQuery(vehicleId: MaybeRefOrGetter<string>, enabled: MaybeRefOrGetter<boolean> = true) {
  return useQuery({
    queryKey: computed(() => releaseKeys.detail(toValue(vehicleId))),
    queryFn: () => fetchRelease(toValue(vehicleId)),
    enabled: computed(() => toValue(enabled)),
  })
}

function photoForm(files: File[]) {
  const form = new FormData()
  for (const f of files) form.append('files', f, f.name)
  return form
}

export type ReleaseStep =
  | { step: 'claimant'; input: Claimant }
  | { step: 'id-photo'; file: File }
  | { step: 'photos'; files: File[] }
  | { step: 'handover'; input: HandoverInput }
  | { step: 'signature'; input: SignatureInput }

/** One step at the counter, through the same route as the Release section's dialogs (the counter's one-screen release sends them in turn). */
export function sendReleaseStep(vehicleId: string, s: ReleaseStep): Promise<ReleasePage> {
  switch (s.step) {
    case 'claimant':
      return request('PUT', `${base(vehicleId)}/claimant`, releasePageSchema, claimantInputSchema.parse(s.input))
    case 'id-photo':
      return request('POST', `${base(vehicleId)}/id-photo`, releasePageSchema, photoForm([s.file]))
    case 'photos':
      return request('POST', `${base(vehicleId)}/photos`, releasePageSchema, photoForm(s.files))
    case 'handover':
      return request('PUT', `${base(vehicleId)}/handover`, releasePageSchema, handoverInputSchema.parse(s.input))
    case 'signature':
      return request('POST', `${base(vehicleId)}/signature`, releasePageSchema, signatureInputSchema.parse(s.input))
  }
}

/** Every step at the counter answers the whole release section, which replaces the cached one. */
export function useReleaseStepMutation(vehicleId: MaybeRefOrGetter<string>) {
  return useMutation({
    mutationFn: (s: ReleaseStep) => sendReleaseStep(toValue(vehicleId), s),
    onSuccess: (page, _s, _context, { client }) => {
      client.setQueryData(releaseKeys.detail(toValue(vehicleId)), page)
      vehicleChanged(client, toValue(vehicleId))
    },
  })
}

export const issueGatePass = (vehicleId: string, lang: string) => request('POST', `${base(vehicleId)}/gate-pass?lang=${lang}`, gatePassIssuedSchema)

/** A gate pass: its PDF and code are in this answer only (the server keeps hashes), so the caller opens it at once. */
export function useIssueGatePassMutation(vehicleId: MaybeRefOrGetter<string>) {
  return useMutation({
    mutationFn: (lang: string) => issueGatePass(toValue(vehicleId), lang),
    onSuccess: (_issued, _lang, _context, { client }) => {
      void client.invalidateQueries({ queryKey: releaseKeys.detail(toValue(vehicleId)) })
      vehicleChanged(client, toValue(vehicleId))
    },
  })
}

export const releaseFormUrl = (vehicleId: string, lang: string) => `${base(vehicleId)}/form?lang=${lang}`
export const pickupTicketUrl = (vehicleId: string, lang: string) => `/api/vehicles/${vehicleId}/documents/pickup-ticket?lang=${lang}`

// ---- the gate ----

/** What the gate read: asked once per scan, never cached (the pass is single-use). */
export const checkGatePass = (pass: string) => request('POST', '/api/gate/check', gateVehicleSchema, { pass })

export function useRecordOutMutation() {
  return useMutation({
    mutationFn: (pass: string) => request('POST', '/api/gate/record-out', gateRecordedSchema, { pass }),
    onSuccess: (out, _pass, _context, { client }) => vehicleChanged(client, out.vehicleId),
  })
}
