import { z } from 'zod'

/** Where the map gets its tiles and addresses: a real service in production, the local stand-ins otherwise. */
export const mapSettingsSchema = z.object({
  tileUrl: z.string(),
  tileAttribution: z.string(),
  maxZoom: z.number(),
  /** A geocoder speaking the Nominatim JSON shape at `<url>/search` and `<url>/reverse`. */
  geocoderUrl: z.string(),
  yard: z.object({ name: z.string(), lat: z.number(), lng: z.number() }),
})
export type MapSettings = z.infer<typeof mapSettingsSchema>

// Nominatim's answer carries coordinates as strings and says `lon`; only the fields the form uses
// are read, and `lon` becomes `lng` here, the one name for longitude everywhere else.
const place = z
  .object({ display_name: z.string(), lat: z.coerce.number(), lon: z.coerce.number() })
  .transform(({ display_name, lat, lon }) => ({ display_name, lat, lng: lon }))
export const geocoderSearchSchema = z.array(place)
export const geocoderReverseSchema = z.union([place, z.object({ error: z.string() })])
export type Place = z.output<typeof place>
