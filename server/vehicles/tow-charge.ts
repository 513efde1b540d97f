import { haversineMiles, towCharge } from '@shared/domain/tow'
import type { Tow } from '@shared/schemas/tows'
import type { YardRow } from './vehicles.queries'
import { yardTowRates } from './rules'

/** The tow's columns as stored: miles and charge worked out here, never taken from the client. */
export function towColumns(tow: Tow, yard: YardRow) {
  const charge = towCharge(tow.pickup, yard, yardTowRates(yard).rates, {
    roadMiles: tow.roadMiles,
    winchingUnits: tow.winchingUnits,
    dollies: tow.dollies,
    afterHours: tow.afterHours,
  })
  return {
    pickupLat: tow.pickup.lat,
    pickupLng: tow.pickup.lng,
    pickupAddress: tow.pickup.address,
    reason: tow.reason,
    reasonNote: tow.reasonNote,
    requesterName: tow.requesterName,
    requesterAgency: tow.requesterAgency,
    requesterReference: tow.requesterReference,
    calledAt: tow.calledAt ? new Date(tow.calledAt) : null,
    hookedAt: tow.hookedAt ? new Date(tow.hookedAt) : null,
    arrivedAt: new Date(tow.arrivedAt),
    truck: tow.truck,
    driver: tow.driver,
    straightMiles: Math.round(haversineMiles(tow.pickup, yard) * 100) / 100,
    roadMiles: tow.roadMiles,
    winchingUnits: tow.winchingUnits,
    dollies: tow.dollies,
    afterHours: tow.afterHours,
    chargeCents: charge.totalCents,
    chargeLines: charge.lines,
  }
}
