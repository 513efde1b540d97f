import type { Point, Street } from './orrin-flats'

// Flat-earth geometry is plenty inside one small town: longitude scaled by cos(latitude), in metres.
const M_PER_DEG = 111_320
const scale = (lat: number) => Math.cos((lat * Math.PI) / 180)

function metres(a: Point, b: Point): number {
  const k = scale((a[0] + b[0]) / 2)
  return Math.hypot((b[0] - a[0]) * M_PER_DEG, (b[1] - a[1]) * M_PER_DEG * k)
}

function lengths(points: Point[]): number[] {
  const out = [0]
  for (let i = 1; i < points.length; i++) out.push(out[i - 1]! + metres(points[i - 1]!, points[i]!))
  return out
}

/** Where house number n falls along the street, or null outside its numbers. */
export function pointForNumber(street: Street, n: number): Point | null {
  const [first, last] = street.numbers
  if (n < first || n > last) return null
  const cum = lengths(street.points)
  const target = ((n - first) / (last - first)) * cum[cum.length - 1]!
  for (let i = 1; i < cum.length; i++) {
    if (target <= cum[i]!) {
      const t = (target - cum[i - 1]!) / (cum[i]! - cum[i - 1]! || 1)
      const [a, b] = [street.points[i - 1]!, street.points[i]!]
      return [a[0] + (b[0] - a[0]) * t, a[1] + (b[1] - a[1]) * t]
    }
  }
  return street.points[street.points.length - 1]!
}

/** The nearest point of the street to p: how far it is, and the house number there. */
export function nearestOnStreet(street: Street, p: Point): { metres: number; number: number } {
  const cum = lengths(street.points)
  const k = scale(p[0])
  let best = { metres: Infinity, along: 0 }
  for (let i = 1; i < street.points.length; i++) {
    const [a, b] = [street.points[i - 1]!, street.points[i]!]
    const [ax, ay, bx, by, px, py] = [a[1] * k, a[0], b[1] * k, b[0], p[1] * k, p[0]]
    const len2 = (bx - ax) ** 2 + (by - ay) ** 2 || 1
    const t = Math.max(0, Math.min(1, ((px - ax) * (bx - ax) + (py - ay) * (by - ay)) / len2))
    const q: Point = [ay + (by - ay) * t, (ax + (bx - ax) * t) / k]
    const d = metres(p, q)
    if (d < best.metres) best = { metres: d, along: cum[i - 1]! + (cum[i]! - cum[i - 1]!) * t }
  }
  const [first, last] = street.numbers
  return { metres: best.metres, number: Math.round((first + (best.along / cum[cum.length - 1]!) * (last - first)) / 10) * 10 }
}

export { metres as metresBetween }
