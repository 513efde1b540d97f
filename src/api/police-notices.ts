import { useMutation } from '@tanstack/vue-query'
import { type PoliceNoticeInput, policeNoticeReplySchema } from '@shared/schemas/police-notices'
import { request } from './http'
import { vehicleChanged } from './vehicles'

export const recordPoliceNotice = (vehicleId: string, input: PoliceNoticeInput) =>
  request('POST', `/api/vehicles/${vehicleId}/police-notice`, policeNoticeReplySchema, input)

/** The police were told of the tow: the page and the card's police clock change with it. */
export function usePoliceNoticeMutation() {
  return useMutation({
    mutationFn: ({ vehicleId, input }: { vehicleId: string; input: PoliceNoticeInput }) => recordPoliceNotice(vehicleId, input),
    onSuccess: (_answer, { vehicleId }, _context, { client }) => vehicleChanged(client, vehicleId),
  })
}
