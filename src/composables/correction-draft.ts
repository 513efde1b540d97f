import type { VehiclePage } from '@shared/schemas/vehicle-page'
import type { TowDraft, VehicleDraft } from './tow-in-form'

/** The record as the tow-in form's fields, to correct it with the same fields and the same checks. */
export function correctionDraft(page: VehiclePage): { vehicle: VehicleDraft; tow: TowDraft | null; conditionNotes: string } {
  const v = page.vehicle
  const t = page.tow
  return {
    vehicle: {
      vin: v.vin ?? '',
      vinOverrideReason: v.vinOverrideReason,
      plate: v.plate ?? '',
      plateState: v.plateState ?? '',
      year: v.year,
      make: v.make ?? '',
      model: v.model ?? '',
      colour: v.colour ?? '',
      body: v.body ?? '',
      vehicleClass: v.vehicleClass,
      odometer: v.odometer,
      odometerUnreadable: v.odometerUnreadable,
      keys: v.keys,
      keysWhere: v.keysWhere ?? '',
      drivableAsFound: v.drivableAsFound,
      ownerName: v.ownerName ?? '',
    },
    tow: t && {
      pickup: t.pickupLat !== null && t.pickupLng !== null ? { lat: t.pickupLat, lng: t.pickupLng, address: t.pickupAddress } : null,
      roadMiles: t.roadMiles,
      winchingUnits: t.winchingUnits,
      dollies: t.dollies,
      afterHours: t.afterHours,
      calledAt: t.calledAt,
      hookedAt: t.hookedAt,
      arrivedAt: t.arrivedAt,
      reason: t.reason,
      reasonNote: t.reasonNote ?? '',
      requesterName: t.requesterName ?? '',
      requesterAgency: t.requesterAgency ?? '',
      requesterReference: t.requesterReference ?? '',
      truck: t.truck ?? '',
      driver: t.driver ?? '',
    },
    conditionNotes: v.conditionNotes ?? '',
  }
}
