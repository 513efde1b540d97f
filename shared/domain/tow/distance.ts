import { DomainError } from '../errors'

export type LatLng = { lat: number; lng: number }

/** The IUGG mean Earth radius R1 (6371.0088 km), the radius @turf/distance uses too. */
export const MEAN_EARTH_RADIUS_KM = 6371.0088
/** Exact by the international yard and pound agreement (1959). */
export const KM_PER_MILE = 1.609344

function assertPoint(point: LatLng, field: string): void {
  const ok =
    Number.isFinite(point.lat) && Number.isFinite(point.lng) && Math.abs(point.lat) <= 90 && Math.abs(point.lng) <= 180
  if (!ok) throw new DomainError('invalid-coordinates', `${field} needs a latitude (±90) and a longitude (±180).`, field)
}

const radians = (degrees: number) => (degrees * Math.PI) / 180

/**
 * Great-circle distance by the haversine formula. A sphere is off by up to about 0.3 % from
 * the real Earth, and roads are longer than great circles: miles the driver types in win.
 */
export function haversineKm(from: LatLng, to: LatLng, radiusKm = MEAN_EARTH_RADIUS_KM): number {
  assertPoint(from, 'pickup')
  assertPoint(to, 'yard')
  const dLat = radians(to.lat - from.lat)
  const dLon = radians(to.lng - from.lng)
  const a = Math.sin(dLat / 2) ** 2 + Math.cos(radians(from.lat)) * Math.cos(radians(to.lat)) * Math.sin(dLon / 2) ** 2
  return 2 * radiusKm * Math.asin(Math.min(1, Math.sqrt(a)))
}

export function haversineMiles(from: LatLng, to: LatLng): number {
  return haversineKm(from, to) / KM_PER_MILE
}
