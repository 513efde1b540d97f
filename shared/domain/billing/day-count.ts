import type { Source, StorageRules } from '../../schemas/rule-sets'
import { isoDate } from '../time/calendar-dates'
import { localDay, MS_PER_DAY, MS_PER_HOUR } from '../time/local-time'

export type DayCount = {
  days: number
  elapsedMs: number
  /** Each rule that shaped the count, in the order applied, in words, with its source. */
  steps: { rule: string; says: string; source: Source | undefined }[]
}

export function formatElapsed(ms: number): string {
  const minutes = Math.floor(ms / 60_000)
  const days = Math.floor(minutes / 1440)
  const h = Math.floor((minutes % 1440) / 60)
  const m = minutes % 60
  return days > 0 ? `${days} d ${h} h ${m} min` : `${h} h ${m} min`
}

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`

/** A rule set's storage rules in one fixed shape, so the billing loop sees one kind of object. */
type Rules = {
  calendar: boolean
  counting: Source
  graceMs: number
  grace: { hours: number; source: Source } | undefined
  noChargeUnderMs: number
  noChargeUnder: { hours: number; source: Source } | undefined
  oneDayWithinMs: number
  oneDayWithin: { hours: number; source: Source } | undefined
  maxDays: number
  cap: Source | undefined
}

const compiled = new WeakMap<StorageRules, Rules>()

function rulesOf(rules: StorageRules): Rules {
  let found = compiled.get(rules)
  if (!found) {
    found = {
      calendar: rules.counting.method === 'calendar-day',
      counting: rules.counting.source,
      graceMs: rules.grace ? Math.round(rules.grace.hours * MS_PER_HOUR) : 0,
      grace: rules.grace,
      noChargeUnderMs: rules.noChargeUnder ? rules.noChargeUnder.hours * MS_PER_HOUR : 0,
      noChargeUnder: rules.noChargeUnder,
      oneDayWithinMs: rules.oneDayIfReleasedWithin ? rules.oneDayIfReleasedWithin.hours * MS_PER_HOUR : -1,
      oneDayWithin: rules.oneDayIfReleasedWithin,
      maxDays: rules.cap?.maxDays ?? Number.POSITIVE_INFINITY,
      cap: rules.cap?.source,
    }
    compiled.set(rules, found)
  }
  return found
}

/**
 * Days of storage between arrival and end (release, or the as-of instant) under a rule set.
 * O(1): a calendar-day count compares the local dates of the two ends (DST makes a local day
 * 23 or 25 hours long, which is why elapsed time cannot be divided here); a 24-hour count
 * divides elapsed time, which DST does not touch.
 */
export function countStorageDays(arrival: number, end: number, storage: StorageRules, zone: string): DayCount {
  const rules = rulesOf(storage)
  const elapsedMs = end - arrival
  const stayed = formatElapsed(elapsedMs)
  const steps: DayCount['steps'] = []

  if (rules.noChargeUnder && elapsedMs < rules.noChargeUnderMs) {
    steps.push({
      rule: 'no-charge-under',
      says: `Stored ${stayed}, less than ${rules.noChargeUnder.hours} hours: no storage is charged.`,
      source: rules.noChargeUnder.source,
    })
    return { days: 0, elapsedMs, steps }
  }
  if (elapsedMs === 0) {
    steps.push({ rule: 'no-time', says: 'No time in storage yet: no storage is charged.', source: undefined })
    return { days: 0, elapsedMs, steps }
  }

  const graceMs = rules.graceMs
  let days: number
  let withoutGrace: number
  if (rules.calendar) {
    const first = localDay(zone, arrival)
    // The vehicle is in storage during [arrival, end): the last instant it occupies is end − 1 ms.
    const last = localDay(zone, end - 1 - graceMs)
    days = Math.max(1, last - first + 1)
    withoutGrace = graceMs === 0 ? days : localDay(zone, end - 1) - first + 1
    steps.push({
      rule: 'calendar-day',
      says:
        `Stored ${stayed}, on ${plural(days, 'calendar day', 'calendar days')} or part of one ` +
        `(${isoDate(first)} to ${isoDate(first + days - 1)}, ${zone} time).`,
      source: rules.counting,
    })
  } else {
    days = Math.max(1, Math.ceil((elapsedMs - graceMs) / MS_PER_DAY))
    withoutGrace = Math.ceil(elapsedMs / MS_PER_DAY)
    steps.push({
      rule: 'rolling-24h',
      says: `Stored ${stayed}: ${plural(days, 'period', 'periods')} of 24 hours or part of one, counted from arrival.`,
      source: rules.counting,
    })
  }
  if (rules.grace && withoutGrace !== days) {
    steps.push({
      rule: 'grace',
      says: `The last day had run less than ${rules.grace.hours} hours at the end, within the grace period: not counted.`,
      source: rules.grace.source,
    })
  }
  if (rules.oneDayWithin && days > 1 && elapsedMs <= rules.oneDayWithinMs) {
    days = 1
    steps.push({
      rule: 'one-day-if-released-within',
      says: `Released ${stayed} after arrival, within ${rules.oneDayWithin.hours} hours: no more than one day's storage.`,
      source: rules.oneDayWithin.source,
    })
  }
  if (days > rules.maxDays) {
    days = rules.maxDays
    steps.push({ rule: 'cap', says: `Storage is capped at ${plural(days, 'day', 'days')}.`, source: rules.cap })
  }
  return { days, elapsedMs, steps }
}
