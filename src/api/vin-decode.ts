import { useQuery } from '@tanstack/vue-query'
import { computed, type Ref } from 'vue'
import { vinDecodeSchema } from '@shared/schemas/vin-decode'
import { request } from './http'

/** One VIN's decoding: it never changes while this build's copy of vPIC is served. */
export const vinDecodeKey = (vin: string) => ['vin-decode', vin] as const

export const fetchVinDecode = (vin: string) => request('GET', `/api/vin-decode/${encodeURIComponent(vin)}`, vinDecodeSchema)

/** vPIC's reading of a VIN; asks nothing while `vin` is null (being typed, or failing its check digit). */
export function useVinDecode(vin: Ref<string | null>) {
  return useQuery({
    queryKey: computed(() => vinDecodeKey(vin.value ?? '')),
    queryFn: ({ queryKey }) => fetchVinDecode(queryKey[1]),
    enabled: computed(() => vin.value !== null),
    staleTime: Infinity,
    // A refusal will not change on a second try; the fields can always be filled by hand.
    retry: false,
  })
}
