import { inspectionPageSchema, type EstimateLineInput, type ItemFinding, type RollAbilityInput, type ValuesInput } from '@shared/schemas/inspections'
import { request } from './http'

// Every call answers with the whole teardown page, as the server worked it out.
const base = (vehicleId: string) => `/api/vehicles/${encodeURIComponent(vehicleId)}/inspection`
const page = (method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE', url: string, body?: unknown) => request(method, url, inspectionPageSchema, body)

export const fetchInspection = (vehicleId: string) => page('GET', base(vehicleId))
export const startInspection = (vehicleId: string) => page('POST', base(vehicleId))
export const acknowledgeSafety = (vehicleId: string) => page('POST', `${base(vehicleId)}/safety`)
export const markItem = (vehicleId: string, code: string, finding: ItemFinding) => page('PUT', `${base(vehicleId)}/items/${code}`, finding)
export const addLine = (vehicleId: string, line: EstimateLineInput) => page('POST', `${base(vehicleId)}/lines`, line)
export const changeLine = (vehicleId: string, lineId: string, line: EstimateLineInput) => page('PUT', `${base(vehicleId)}/lines/${lineId}`, line)
export const removeLine = (vehicleId: string, lineId: string) => page('DELETE', `${base(vehicleId)}/lines/${lineId}`)
export const setValues = (vehicleId: string, values: ValuesInput) => page('PUT', `${base(vehicleId)}/values`, values)
export const markRollAbility = (vehicleId: string, marks: RollAbilityInput) => page('PATCH', `${base(vehicleId)}/roll-ability`, marks)
export const finishInspection = (vehicleId: string) => page('POST', `${base(vehicleId)}/finish`)

export function addItemPhotos(vehicleId: string, code: string, files: File[]) {
  const form = new FormData()
  for (const f of files) form.append('files', f, f.name)
  return page('POST', `${base(vehicleId)}/items/${code}/photos`, form)
}
