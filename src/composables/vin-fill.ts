import { computed, reactive, watch, type Ref } from 'vue'
import { normalizeVin, suggestVehicleClass } from '@shared/domain/vehicle'
import { vinDecodeParamsSchema } from '@shared/schemas/vin-decode'
import { useVinDecode } from '@/api/vin-decode'
import type { VehicleDraft } from './tow-in-form'

type TextField = 'make' | 'model' | 'body'

/**
 * Fills the vehicle from NHTSA vPIC once its VIN passes the check digit: make, model and body where
 * the field is empty or still holds vPIC's last answer, and the billing class while the dispatcher
 * has not chosen one. Whatever the dispatcher types or chooses stays theirs.
 */
export function useVinFill(vehicle: Ref<VehicleDraft>, classes: Ref<{ code: string; label: string }[]>) {
  // A correction opens on the record's own VIN: that fills nothing, only a changed VIN does.
  const startVin = normalizeVin(vehicle.value.vin ?? '')
  const decodable = computed(() => {
    const parsed = vinDecodeParamsSchema.safeParse({ vin: vehicle.value.vin ?? '' })
    return parsed.success ? parsed.data.vin : null
  })
  const query = useVinDecode(decodable)
  /** vPIC's answer for the VIN now in the field, never for one typed before it. */
  const decoded = computed(() => {
    const d = query.data.value
    return d && d.vin === decodable.value ? d : null
  })
  const suggestion = computed(() => (decoded.value ? suggestVehicleClass(decoded.value, classes.value.map((c) => c.code)) : null))

  const filled = reactive<Partial<Record<TextField | 'vehicleClass', string>>>({})
  let classChosen = false
  watch(
    () => vehicle.value.vehicleClass,
    (code) => {
      if (code !== filled.vehicleClass) classChosen = true
    },
  )

  function fill(field: TextField, value: string | null) {
    const now = vehicle.value[field] ?? ''
    if (now.trim() !== '' && now !== filled[field]) return
    vehicle.value[field] = value ?? ''
    filled[field] = value ?? undefined
  }

  watch(decoded, (d) => {
    if (!d || d.vin === startVin) return
    fill('make', d.make)
    fill('model', d.model)
    fill('body', d.body)
    if (suggestion.value && !classChosen) {
      filled.vehicleClass = suggestion.value.code
      vehicle.value.vehicleClass = suggestion.value.code
    }
  })

  /** Whether a field still shows what vPIC gave for this VIN. */
  const fromVpic = (field: TextField) =>
    decoded.value !== null && filled[field] !== undefined && vehicle.value[field] === filled[field]

  return { decodable, query, decoded, suggestion, fromVpic }
}
