import { tzOffset } from '@date-fns/tz'
import { MS_PER_DAY, assertTimeZone } from './local-time'

// What a person types into a date-and-time field is a wall-clock time in the yard's zone, whatever
// zone the browser is in: "14:05" at a Pacific yard is 14:05 Pacific from a laptop set to Eastern.

const pad = (n: number) => String(Math.abs(n)).padStart(2, '0')
const wallPattern = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})(?::(\d{2}))?$/

/** The zone's offset from UTC at an instant, in minutes (Pacific winter: -480). */
function offsetMinutes(zone: string, instant: number): number {
  return tzOffset(zone, new Date(instant))
}

/** The wall-clock reading in the zone at an instant: "2026-12-02T14:05:00" (whole seconds, no offset). */
export function wallClock(zone: string, instant: number): string {
  assertTimeZone(zone)
  const local = new Date(Math.floor(instant / 1000) * 1000 + offsetMinutes(zone, instant) * 60_000)
  return local.toISOString().slice(0, 19)
}

/**
 * The instant a wall-clock reading in the zone stands for. A time the clocks skip (spring forward:
 * 02:30 where 02:00 becomes 03:00) is read on the offset before the change, so it lands after it
 * (03:30); a time that happens twice (fall back) is its first happening, the earlier instant.
 */
export function instantFromWallClock(zone: string, wall: string): number {
  assertTimeZone(zone)
  const m = wallPattern.exec(wall)
  if (!m) throw new RangeError(`"${wall}" is not a wall-clock time such as 2026-12-02T14:05:00.`)
  const [, y, mo, d, h, mi, s] = m.map(Number) as number[]
  const asUtc = Date.UTC(y!, mo! - 1, d!, h!, mi!, s || 0)
  const before = offsetMinutes(zone, asUtc - MS_PER_DAY)
  const after = offsetMinutes(zone, asUtc + MS_PER_DAY)
  const fits = [...new Set([before, after])]
    .map((o) => asUtc - o * 60_000)
    .filter((instant) => instant + offsetMinutes(zone, instant) * 60_000 === asUtc)
  return fits.length > 0 ? Math.min(...fits) : asUtc - before * 60_000
}

/** An instant as ISO 8601 with the zone's offset at that instant: "2026-12-02T14:05:00-08:00". */
export function isoInZone(zone: string, instant: number): string {
  const offset = offsetMinutes(zone, instant)
  const sign = offset < 0 ? '-' : '+'
  return `${wallClock(zone, instant)}${sign}${pad(Math.floor(Math.abs(offset) / 60))}:${pad(Math.abs(offset) % 60)}`
}
