import { useQuery } from '@tanstack/vue-query'
import { geocoderReverseSchema, geocoderSearchSchema, mapSettingsSchema, type MapSettings, type Place } from '@shared/schemas/map'
import { request } from './http'

export const mapKeys = {
  /** The tile and geocoder addresses: set when the server starts, so fetched once a visit. */
  settings: ['map-settings'] as const,
}

export const fetchMapSettings = () => request('GET', '/api/map/settings', mapSettingsSchema)

export const useMapSettingsQuery = () => useQuery({ queryKey: mapKeys.settings, queryFn: fetchMapSettings, staleTime: Infinity })

// The geocoder is whatever the settings name (the built-in stand-in by default), spoken to in
// Nominatim's query shape; the answers are parsed before the form uses them. Asked as the address is
// typed or the pin dropped, never cached.
export async function findAddress(settings: MapSettings, q: string): Promise<Place[]> {
  const params = new URLSearchParams({ q, format: 'json', limit: '8' })
  return request('GET', `${settings.geocoderUrl}/search?${params}`, geocoderSearchSchema)
}

export async function addressAt(settings: MapSettings, lat: number, lng: number): Promise<Place | null> {
  const params = new URLSearchParams({ lat: String(lat), lon: String(lng), format: 'json' })
  const answer = await request('GET', `${settings.geocoderUrl}/reverse?${params}`, geocoderReverseSchema)
  return 'display_name' in answer ? answer : null
}
