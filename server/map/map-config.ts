/** Where the map's tiles and addresses come from; by default the app's own stand-ins (server/fakes). */
export interface MapConfig {
  tileUrl: string
  tileAttribution: string
  maxZoom: number
  geocoderUrl: string
}

export const LOCAL_MAP: MapConfig = {
  tileUrl: '/api/fakes/tiles/{z}/{x}/{y}.png',
  // The stand-in's own words are the reader's (map.localTiles in the catalogs): none are sent from here.
  tileAttribution: '',
  maxZoom: 19,
  geocoderUrl: '/api/fakes/geocoder',
}

/** True when the settings point at the built-in stand-ins, which are then mounted. */
export const usesLocalFakes = (map: MapConfig) => map.tileUrl.startsWith('/api/fakes/') || map.geocoderUrl.startsWith('/api/fakes/')

/**
 * The CSP sources a service URL needs besides 'self': none when it is on this server. A `{s}`
 * subdomain in a tile template becomes a wildcard: https://{s}.tiles.example/… → https://*.tiles.example
 */
export function cspSources(url: string): string[] {
  const m = /^(https?:\/\/)([^/]+)/.exec(url)
  if (!m) return []
  const host = m[2]!.includes('{') ? m[2]!.replace(/^[^.]*\{[^}]*\}[^.]*\./, '*.') : m[2]!
  return [`${m[1]}${host}`]
}
