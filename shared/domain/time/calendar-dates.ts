import { DomainError } from '../errors'

/**
 * Calendar dates as whole day numbers (days since 1970-01-01 in the proleptic Gregorian
 * calendar). Day numbers make "N days later" an addition and "how many days" a subtraction,
 * which is what keeps the billing and the legal clocks O(1) per vehicle.
 * Conversions follow Howard Hinnant's civil-date algorithms (days_from_civil / civil_from_days).
 */
export type DayNumber = number

/** 0 = Sunday … 6 = Saturday (1970-01-01 was a Thursday). */
export function weekday(day: DayNumber): number {
  return (((day + 4) % 7) + 7) % 7
}

export function isWeekend(day: DayNumber): boolean {
  const w = weekday(day)
  return w === 0 || w === 6
}

export function dayFromCivil(year: number, month: number, dayOfMonth: number): DayNumber {
  const y = month <= 2 ? year - 1 : year
  const era = Math.floor(y / 400)
  const yearOfEra = y - era * 400
  const dayOfYear = Math.floor((153 * (month + (month > 2 ? -3 : 9)) + 2) / 5) + dayOfMonth - 1
  const dayOfEra = yearOfEra * 365 + Math.floor(yearOfEra / 4) - Math.floor(yearOfEra / 100) + dayOfYear
  return era * 146097 + dayOfEra - 719468
}

export function civilFromDay(day: DayNumber): { year: number; month: number; day: number } {
  const z = day + 719468
  const era = Math.floor(z / 146097)
  const dayOfEra = z - era * 146097
  const yearOfEra = Math.floor(
    (dayOfEra - Math.floor(dayOfEra / 1460) + Math.floor(dayOfEra / 36524) - Math.floor(dayOfEra / 146096)) / 365,
  )
  const dayOfYear = dayOfEra - (365 * yearOfEra + Math.floor(yearOfEra / 4) - Math.floor(yearOfEra / 100))
  const mp = Math.floor((5 * dayOfYear + 2) / 153)
  const month = mp < 10 ? mp + 3 : mp - 9
  return {
    year: yearOfEra + era * 400 + (month <= 2 ? 1 : 0),
    month,
    day: dayOfYear - Math.floor((153 * mp + 2) / 5) + 1,
  }
}

const pad2 = (n: number) => (n < 10 ? `0${n}` : `${n}`)

/**
 * Per-day caches (offsets, midnights, date texts) are flat arrays indexed by day, which is
 * several times quicker than a Map keyed by a day number. They cover 1900 to 2216 — every
 * instant Holdfast accepts plus the longest clock — and anything outside is simply not cached.
 */
export const CACHED_DAYS = 116_000
const FIRST_CACHED_DAY = -25_600

/** The slot of a day in a per-day cache, or -1 outside the cached years. */
export function cacheSlot(day: DayNumber): number {
  const slot = day - FIRST_CACHED_DAY
  return slot >= 0 && slot < CACHED_DAYS ? slot : -1
}

// Bills and clocks print the same few thousand dates over and over: each is made once.
const isoDates: (string | undefined)[] = new Array<string | undefined>(CACHED_DAYS).fill(undefined)

/** 'YYYY-MM-DD' for years 1000–9999, the only ones a yard will meet. */
export function isoDate(day: DayNumber): string {
  const slot = cacheSlot(day)
  let text = slot < 0 ? undefined : isoDates[slot]
  if (text === undefined) {
    const c = civilFromDay(day)
    text = `${c.year}-${pad2(c.month)}-${pad2(c.day)}`
    if (slot >= 0) isoDates[slot] = text
  }
  return text
}

const isoDatePattern = /^(\d{4})-(\d{2})-(\d{2})$/

export function dayFromIsoDate(text: string, field = 'date'): DayNumber {
  const match = isoDatePattern.exec(text)
  if (match) {
    const [year, month, dayOfMonth] = [Number(match[1]), Number(match[2]), Number(match[3])]
    const day = dayFromCivil(year, month, dayOfMonth)
    const back = civilFromDay(day)
    if (back.month === month && back.day === dayOfMonth) return day
  }
  throw new DomainError('invalid-date', `"${text}" is not a calendar date written as YYYY-MM-DD.`, field)
}


const MS_PER_DAY = 86_400_000
// Zero-padded texts ("007", "59", "23:59"), so writing a time converts no numbers to strings.
const threeDigits = Array.from({ length: 1000 }, (_, n) => String(n).padStart(3, '0'))
const twoDigits = threeDigits.slice(0, 60).map((text) => text.slice(1))
const hoursMinutes = Array.from({ length: 1440 }, (_, n) => `${twoDigits[Math.floor(n / 60)]}:${twoDigits[n % 60]}`)

/**
 * The same text as Date#toISOString ('2026-03-08T10:00:00.000Z'), built from day numbers:
 * a billing run writes millions of these, and skipping the Date object halves the cost.
 */
export function isoInstant(ms: number): string {
  const day = Math.floor(ms / MS_PER_DAY)
  const rest = ms - day * MS_PER_DAY
  const minutes = Math.floor(rest / 60_000)
  const millis = rest - minutes * 60_000
  const seconds = Math.floor(millis / 1000)
  return `${isoDate(day)}T${hoursMinutes[minutes]}:${twoDigits[seconds]}.${threeDigits[millis - seconds * 1000]}Z`
}
