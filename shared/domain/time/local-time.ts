import { tzOffset } from '@date-fns/tz'
import { CACHED_DAYS, cacheSlot, type DayNumber } from './calendar-dates'
import { DomainError } from '../errors'

export const MS_PER_HOUR = 3_600_000
export const MS_PER_DAY = 86_400_000

/** A UTC day whose offset changes part-way: before `at` the offset is `before`, from it `after`. */
type Change = { at: number; before: number; after: number }

/** Marks a UTC day whose offset changes: look the change up. */
const CHANGES = Number.POSITIVE_INFINITY

/**
 * UTC offsets of one IANA zone, learned once per UTC day and kept. Asking Intl costs a few
 * microseconds; a billing run asks millions of times about a few hundred distinct days, so
 * the answer per day is cached, and a day whose two ends disagree is searched for the exact
 * instant of the change. (Two changes within one UTC day would be missed; no zone does that.)
 */
class ZoneOffsets {
  private readonly perDay = new Float64Array(CACHED_DAYS).fill(Number.NaN)
  private readonly changes = new Map<number, Change>()
  private readonly midnights = new Float64Array(CACHED_DAYS).fill(Number.NaN)

  constructor(private readonly zone: string) {}

  offset(instant: number): number {
    const utcDay = Math.floor(instant / MS_PER_DAY)
    const slot = cacheSlot(utcDay)
    if (slot < 0) return this.ask(instant)
    let entry = this.perDay[slot] as number
    if (Number.isNaN(entry)) {
      entry = this.learn(utcDay)
      this.perDay[slot] = entry
    }
    if (entry !== CHANGES) return entry
    const change = this.changes.get(utcDay) as Change
    return instant < change.at ? change.before : change.after
  }

  /** The first instant of a local date (see startOfLocalDay), cached per date. */
  midnight(day: DayNumber): number {
    const slot = cacheSlot(day)
    let known = slot < 0 ? Number.NaN : (this.midnights[slot] as number)
    if (Number.isNaN(known)) {
      known = this.findMidnight(day)
      if (slot >= 0) this.midnights[slot] = known
    }
    return known
  }

  private findMidnight(day: DayNumber): number {
    const wall = day * MS_PER_DAY
    const guess = wall - this.offset(wall - this.offset(wall))
    const offsetAtGuess = this.offset(guess)
    if (guess + offsetAtGuess === wall) return guess
    const retry = wall - offsetAtGuess
    if (retry + this.offset(retry) === wall) return retry
    // Midnight fell in the gap: of the two candidates, the later one is the change itself.
    return Math.max(guess, retry)
  }

  private learn(utcDay: number): number {
    const before = this.ask(utcDay * MS_PER_DAY)
    const after = this.ask((utcDay + 1) * MS_PER_DAY)
    if (before === after) return before
    let low = utcDay * MS_PER_DAY
    let high = low + MS_PER_DAY
    while (high - low > 1) {
      const middle = Math.floor((low + high) / 2)
      if (this.ask(middle) === before) low = middle
      else high = middle
    }
    this.changes.set(utcDay, { at: high, before, after })
    return CHANGES
  }

  private ask(instant: number): number {
    return tzOffset(this.zone, new Date(instant)) * 60_000
  }
}

const zones = new Map<string, ZoneOffsets>()

function zoneOffsets(zone: string): ZoneOffsets {
  let found = zones.get(zone)
  if (!found) {
    assertTimeZone(zone)
    found = new ZoneOffsets(zone)
    zones.set(zone, found)
  }
  return found
}

// Building an Intl formatter to validate a zone costs tens of microseconds: remember the good ones.
const validZones = new Set<string>()

/** An IANA zone name this runtime knows (offset strings such as "+05:00" are refused). */
export function isTimeZone(zone: string): boolean {
  if (validZones.has(zone)) return true
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: zone })
  } catch {
    return false
  }
  const named = zone.includes('/') || zone === 'UTC'
  if (named) validZones.add(zone)
  return named
}

export function assertTimeZone(zone: string, field = 'timeZone'): void {
  if (!isTimeZone(zone)) {
    throw new DomainError('invalid-time-zone', `"${zone}" is not an IANA time zone such as America/Los_Angeles.`, field)
  }
}

/** The calendar date on the yard's wall calendar at this instant. */
export function localDay(zone: string, instant: number): DayNumber {
  return Math.floor((instant + zoneOffsets(zone).offset(instant)) / MS_PER_DAY)
}

/**
 * The first instant of a local calendar date. Where midnight itself is skipped by a change
 * (a few zones spring forward at 00:00), the day starts at the change.
 */
export function startOfLocalDay(zone: string, day: DayNumber): number {
  return zoneOffsets(zone).midnight(day)
}

const instantPattern = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d{1,9})?)?(Z|[+-]\d{2}:\d{2})$/
const earliest = Date.UTC(1900, 0, 1)
const latest = Date.UTC(2200, 0, 1)

export type Instant = string | number

/**
 * Epoch milliseconds from an ISO 8601 instant that names its offset (a bare local time would
 * be read in whatever zone the server runs in) or from epoch milliseconds.
 */
export function toEpochMs(value: Instant, field: string): number {
  const ms = typeof value === 'number' ? value : instantPattern.test(value) ? Date.parse(value) : Number.NaN
  if (!Number.isFinite(ms)) {
    throw new DomainError(
      'invalid-instant',
      `${field} must be a date and time with its offset, such as 2026-03-08T09:30:00-08:00.`,
      field,
    )
  }
  if (ms < earliest || ms >= latest) {
    throw new DomainError('invalid-instant', `${field} is outside the years 1900 to 2199.`, field)
  }
  return ms
}
