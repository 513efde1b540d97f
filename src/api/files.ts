import { useMutation } from '@tanstack/vue-query'
import { filesAddedSchema, type FileKind } from '@shared/schemas/files'
import { request } from './http'
import { vehicleChanged } from './vehicles'

export function addFiles(vehicleId: string, files: File[], kind: FileKind, label: string | null) {
  const form = new FormData()
  form.append('kind', kind)
  if (label) form.append('label', label)
  for (const f of files) form.append('files', f, f.name)
  return request('POST', `/api/vehicles/${vehicleId}/files`, filesAddedSchema, form)
}

/** Photos and papers for a vehicle: its page lists them, its board card counts the photos. */
export function useAddFilesMutation() {
  return useMutation({
    mutationFn: ({ vehicleId, files, kind, label }: { vehicleId: string; files: File[]; kind: FileKind; label: string | null }) =>
      addFiles(vehicleId, files, kind, label),
    onSuccess: (_answer, { vehicleId }, _context, { client }) => vehicleChanged(client, vehicleId),
  })
}
