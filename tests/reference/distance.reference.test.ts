import turfDistance from '@turf/distance'
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { haversineKm, haversineMiles, KM_PER_MILE } from '@shared/domain/tow'

const BNA = { lat: 36.12, lng: -86.67 }
const LAX = { lat: 33.94, lng: -118.4 }

describe('haversine — Rosetta Code task "Haversine formula" [V]', () => {
  it.each([
    { radiusKm: 6371.0, km: 2886.444442837983 },
    { radiusKm: 6372.8, km: 2887.259950607111 },
  ])('haversineKm_bnaToLaxWithR$radiusKm_is$km', ({ radiusKm, km }) => {
    expect(haversineKm(BNA, LAX, radiusKm)).toBeCloseTo(km, 9)
  })

  it('haversineMiles_bnaToLax_isKilometresOver1.609344 (international mile, exact)', () => {
    expect(KM_PER_MILE).toBe(1.609344)
    // @turf/distance's radius 6371.0088 km gives 2886.4484 km [C] → 1793.5627 mi.
    expect(haversineMiles(BNA, LAX)).toBeCloseTo(2886.4484 / 1.609344, 2)
  })
})

describe('haversine against @turf/distance (oracle library)', () => {
  const point = fc.record({
    lat: fc.double({ min: -89.9, max: 89.9, noNaN: true }),
    lng: fc.double({ min: -179.9, max: 179.9, noNaN: true }),
  })

  it('haversineKm_anyTwoPointsAtLeast100mApart_agreesWithTurfWithin0.01Percent', () => {
    fc.assert(
      fc.property(point, point, (a, b) => {
        const turf = turfDistance([a.lng, a.lat], [b.lng, b.lat], { units: 'kilometers' })
        fc.pre(turf > 0.1)
        expect(Math.abs(haversineKm(a, b) - turf) / turf).toBeLessThan(1e-4)
      }),
      { numRuns: 2000 },
    )
  })
})
