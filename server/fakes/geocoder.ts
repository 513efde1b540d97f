import { PLACES, STREETS, TOWN, type Point } from './orrin-flats'
import { metresBetween, nearestOnStreet, pointForNumber } from './street-geometry'

/** One answer in the shape of Nominatim's JSON (coordinates as strings), which a real geocoder gives. */
export interface GeocoderPlace {
  place_id: number
  display_name: string
  lat: string
  lon: string
}

const WORDS: Record<string, string> = { road: 'rd', boulevard: 'blvd', avenue: 'ave', lane: 'ln', street: 'st', court: 'ct', and: '&' }
const IGNORED = new Set(['orrin', 'flats', 'ca', 'california', 'usa'])

const tokens = (text: string) =>
  text
    .toLowerCase()
    .replace(/[.,#()]/g, ' ')
    .split(/\s+/)
    .filter(Boolean)
    .map((w) => WORDS[w] ?? w)
    .filter((w) => !IGNORED.has(w))

/** Every word typed starts a word of the name, so "kett" finds Kettle Ave while typing. */
const matches = (query: string[], name: string) => {
  const have = tokens(name)
  return query.every((q) => have.some((h) => h.startsWith(q)))
}

let nextId = 1
const ids = new Map<string, number>()
function answer(name: string, [lat, lng]: Point): GeocoderPlace {
  const display = `${name}, ${TOWN}`
  if (!ids.has(display)) ids.set(display, nextId++)
  return { place_id: ids.get(display)!, display_name: display, lat: lat.toFixed(6), lon: lng.toFixed(6) }
}

export function search(q: string, limit = 8): GeocoderPlace[] {
  const query = tokens(q)
  if (query.length === 0) return []
  const found = new Map<string, GeocoderPlace>()
  // A numbered address a named place already gives exactly (the yard itself) is not guessed again.
  const add = (name: string, p: Point, unlessNamed = false) => {
    const named = unlessNamed && [...found.keys()].some((k) => k.startsWith(name))
    if (found.size < limit && !found.has(name) && !named) found.set(name, answer(name, p))
  }
  for (const place of PLACES) if (matches(query, place.name)) add(place.name, place.point)
  const [first, ...rest] = query
  const n = Number(first)
  for (const street of STREETS) {
    const names = [street.name, ...street.aliases]
    if (Number.isInteger(n) && rest.length > 0 && names.some((s) => matches(rest, s))) {
      const p = pointForNumber(street, n)
      if (p) add(`${n} ${street.name}`, p, true)
    } else if (names.some((s) => matches(query, s))) {
      add(street.name, street.points[Math.floor(street.points.length / 2)]!)
    }
  }
  return [...found.values()]
}

/** The nearest named place within 120 m, else the nearest house number within 250 m of a street. */
export function reverse(p: Point): GeocoderPlace | null {
  const place = PLACES.map((pl) => ({ pl, d: metresBetween(p, pl.point) })).sort((a, b) => a.d - b.d)[0]
  if (place && place.d <= 120) return answer(place.pl.name, place.pl.point)
  const street = STREETS.map((s) => ({ s, near: nearestOnStreet(s, p) })).sort((a, b) => a.near.metres - b.near.metres)[0]
  if (street && street.near.metres <= 250) return answer(`${street.near.number} ${street.s.name}`, p)
  return null
}
