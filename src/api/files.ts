import { filesAddedSchema, type FileKind } from '@shared/schemas/files'
import { request } from './http'

export function addFiles(vehicleId: string, files: File[], kind: FileKind, label: string | null) {
  const form = new FormData()
  form.append('kind', kind)
  if (label) form.append('label', label)
  for (const f of files) form.append('files', f, f.name)
  return request('POST', `/api/vehicles/${vehicleId}/files`, filesAddedSchema, form)
}
