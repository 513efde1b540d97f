import { computed, type Ref } from 'vue'
import { haversineMiles, towCharge } from '@shared/domain/tow'
import type { HoldInput } from '@shared/schemas/holds'
import type { IntakeOptions, TowInInput } from '@shared/schemas/tow-in'
import type { TowInput } from '@shared/schemas/tows'
import type { VehicleInput } from '@shared/schemas/vehicles'

/** The tow while it is being filled in: the pin and the reason may still be missing. */
export type TowDraft = Omit<TowInput, 'pickup' | 'reason'> & { pickup: TowInput['pickup'] | null; reason: TowInput['reason'] | undefined }
export type VehicleDraft = Omit<VehicleInput, 'keys'> & { keys: VehicleInput['keys'] | undefined }
/** The whole form; the shared schema, not the type, says what is still wrong with it. */
export type TowInDraft = Omit<TowInInput, 'tow' | 'vehicle'> & { tow: TowDraft; vehicle: VehicleDraft }

/** A fresh tow-in: arrival now, checked by whoever is logging it, everything else still to say. */
export function blankTowIn(checkedById: string, vehicleClass: string): TowInDraft {
  return {
    tow: {
      pickup: null,
      roadMiles: null,
      winchingUnits: 0,
      dollies: false,
      afterHours: false,
      calledAt: null,
      hookedAt: null,
      arrivedAt: new Date().toISOString(),
      reason: undefined,
      reasonNote: '',
      requesterName: '',
      requesterAgency: '',
      requesterReference: '',
      truck: '',
      driver: '',
    },
    vehicle: {
      vin: '',
      vinOverrideReason: null,
      plate: '',
      plateState: '',
      year: null,
      make: '',
      model: '',
      colour: '',
      body: '',
      vehicleClass,
      odometer: null,
      odometerUnreadable: false,
      keys: undefined,
      keysWhere: '',
      drivableAsFound: null,
      ownerName: '',
    },
    holds: [],
    condition: { damageNotes: '', checkedById, property: [] },
    spaceId: null,
  }
}

export const blankHold = (): HoldInput => ({ kind: 'law_enforcement', agency: '', caseNumber: '', until: null, note: '' })

/**
 * The distance and the tow charge as the pin moves, with the core's own function: the server works
 * the stored charge out again from the same inputs, so what the dispatcher sees is what is billed.
 */
export function useTowQuote(tow: Ref<TowDraft | null>, options: Ref<IntakeOptions | undefined>) {
  return computed(() => {
    const o = options.value
    const t = tow.value
    const pickup = t?.pickup
    if (!o || !t || !pickup || !Number.isFinite(pickup.lat) || !Number.isFinite(pickup.lng)) return null
    try {
      const charge = towCharge(pickup, o.yard, o.yard.towRates, {
        roadMiles: t.roadMiles ?? null,
        winchingUnits: t.winchingUnits ?? 0,
        dollies: t.dollies,
        afterHours: t.afterHours,
      })
      return { straightMiles: haversineMiles(pickup, o.yard), charge, ratesSet: o.yard.ratesSet }
    } catch {
      // A half-typed number (negative miles, a fraction of a winching unit) shows no quote until fixed.
      return null
    }
  })
}
