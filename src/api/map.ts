import { geocoderReverseSchema, geocoderSearchSchema, mapSettingsSchema, type MapSettings, type Place } from '@shared/schemas/map'
import { request } from './http'

export const fetchMapSettings = () => request('GET', '/api/map/settings', mapSettingsSchema)

// The geocoder is whatever the settings name (the built-in stand-in by default), spoken to in
// Nominatim's query shape; the answers are parsed before the form uses them.
export async function findAddress(settings: MapSettings, q: string): Promise<Place[]> {
  const params = new URLSearchParams({ q, format: 'json', limit: '8' })
  return request('GET', `${settings.geocoderUrl}/search?${params}`, geocoderSearchSchema)
}

export async function addressAt(settings: MapSettings, lat: number, lng: number): Promise<Place | null> {
  const params = new URLSearchParams({ lat: String(lat), lon: String(lng), format: 'json' })
  const answer = await request('GET', `${settings.geocoderUrl}/reverse?${params}`, geocoderReverseSchema)
  return 'display_name' in answer ? answer : null
}
