// @vitest-environment happy-dom
import { QueryClient, VueQueryPlugin } from '@tanstack/vue-query'
import { mount } from '@vue/test-utils'
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { defineComponent, nextTick, ref } from 'vue'
import type { VinDecode } from '@shared/schemas/vin-decode'
import { blankTowIn, type VehicleDraft } from '../../../src/composables/tow-in-form'
import { useVinFill } from '../../../src/composables/vin-fill'

const CLASSES = ['standard', 'heavy', 'motorcycle'].map((code) => ({ code, label: code }))
const ACCORD = '1HGCM82633A004352'
const CASCADIA = '1FUJGLDRXCLBP1234'
// What the server answers (its own values are checked in tests/reference/vin-decode.reference.test.ts).
const ANSWERS: Record<string, VinDecode> = {
  [ACCORD]: { vin: ACCORD, found: true, wmi: '1HG', manufacturer: 'AMERICAN HONDA MOTOR CO., INC.', make: 'Honda', model: 'Accord', modelYear: 2003, bodyClass: 'Coupe', body: 'Coupe', vehicleType: 'Passenger Car', gvwr: { class: '1C', fromLb: 4_001, toLb: 5_000 }, source: 'NHTSA vPIC' },
  [CASCADIA]: { vin: CASCADIA, found: true, wmi: '1FU', manufacturer: 'DAIMLER TRUCK NORTH AMERICA LLC', make: 'Freightliner', model: 'Cascadia', modelYear: 2012, bodyClass: 'Truck-Tractor', body: 'Truck', vehicleType: 'Truck', gvwr: { class: '8', fromLb: 33_001, toLb: null }, source: 'NHTSA vPIC' },
}

let asked: string[]
beforeEach(() => {
  asked = []
  vi.stubGlobal('fetch', async (url: string) => {
    asked.push(url)
    return new Response(JSON.stringify(ANSWERS[url.split('/').pop()!]), { status: 200, headers: { 'content-type': 'application/json' } })
  })
})
afterEach(() => vi.unstubAllGlobals())

function formWith(edit: (v: VehicleDraft) => void = () => {}) {
  const vehicle = ref(blankTowIn('00000000-0000-4000-8000-000000000000', 'standard').vehicle)
  edit(vehicle.value)
  let fill!: ReturnType<typeof useVinFill>
  const host = defineComponent({
    setup() {
      fill = useVinFill(vehicle, ref(CLASSES))
      return () => null
    },
  })
  mount(host, { global: { plugins: [[VueQueryPlugin, { queryClient: new QueryClient() }]] } })
  return { vehicle, fill }
}

describe('useVinFill', () => {
  it('useVinFill_vinWithAGoodCheckDigit_fillsTheEmptyFieldsAndTheClass', async () => {
    const { vehicle, fill } = formWith()
    vehicle.value.vin = ACCORD.toLowerCase()
    await vi.waitFor(() => expect(vehicle.value.make).toBe('Honda'))
    expect(vehicle.value).toMatchObject({ model: 'Accord', body: 'Coupe', vehicleClass: 'standard' })
    expect(fill.fromVpic('make')).toBe(true)
  })

  it('useVinFill_anotherVin_replacesOnlyWhatVpicHadFilledIn', async () => {
    const { vehicle, fill } = formWith()
    vehicle.value.vin = ACCORD
    await vi.waitFor(() => expect(vehicle.value.model).toBe('Accord'))
    vehicle.value.make = 'Halvard'
    vehicle.value.vin = CASCADIA
    await vi.waitFor(() => expect(vehicle.value.model).toBe('Cascadia'))
    expect(vehicle.value).toMatchObject({ make: 'Halvard', body: 'Truck', vehicleClass: 'heavy' })
    expect(fill.fromVpic('make')).toBe(false)
  })

  it('useVinFill_classChosenByHand_staysAndTheSuggestionWaitsBesideIt', async () => {
    const { vehicle, fill } = formWith()
    vehicle.value.vehicleClass = 'motorcycle'
    await nextTick()
    vehicle.value.vin = CASCADIA
    // The model is filled in the same step that would set the class.
    await vi.waitFor(() => expect(vehicle.value.model).toBe('Cascadia'))
    expect(vehicle.value.vehicleClass).toBe('motorcycle')
    expect(fill.suggestion.value?.code).toBe('heavy')
  })

  it('useVinFill_checkDigitFails_asksNothing', async () => {
    const { vehicle, fill } = formWith()
    vehicle.value.vin = '1FUJGLDR0CLBP1234'
    await nextTick()
    expect(fill.decodable.value).toBeNull()
    expect(asked).toEqual([])
  })

  it('useVinFill_recordsOwnVin_fillsNothing (a correction opens on it)', async () => {
    const { vehicle, fill } = formWith((v) => {
      v.vin = ACCORD
      v.make = 'Honda'
    })
    await vi.waitFor(() => expect(fill.decoded.value?.model).toBe('Accord'))
    expect(vehicle.value.model).toBe('')
  })
})
