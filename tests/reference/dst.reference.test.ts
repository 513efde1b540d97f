import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import ordinanceJson from '../../server/rule-sets/samples/ordinance-24h.json' with { type: 'json' }
import { dayFromIsoDate, localDay, startOfLocalDay } from '@shared/domain/time'
import { storageBill } from '@shared/domain/billing'
import { type RuleSet, ruleSetSchema } from '@shared/schemas/rule-sets'

// The oracle: the IANA time zone database as the runtime's Intl exposes it, read through
// formatToParts — a different path from the implementation's cached offsets.
const formats = new Map<string, Intl.DateTimeFormat>()
function wallClock(zone: string, ms: number) {
  let format = formats.get(zone)
  if (!format) {
    format = new Intl.DateTimeFormat('en-US', {
      timeZone: zone, hourCycle: 'h23', year: 'numeric', month: '2-digit', day: '2-digit',
      hour: '2-digit', minute: '2-digit', second: '2-digit',
    })
    formats.set(zone, format)
  }
  const part = Object.fromEntries(format.formatToParts(ms).map((p) => [p.type, p.value]))
  return { date: `${part.year}-${part.month}-${part.day}`, time: `${part.hour}:${part.minute}:${part.second}` }
}

/** The instant a wall clock in `zone` reads `local` ('2026-03-08T01:30'), found by asking Intl. */
function instantOf(zone: string, local: string): number {
  const target = Date.parse(`${local}:00Z`)
  let ms = target
  for (let i = 0; i < 3; i++) {
    const wall = wallClock(zone, ms)
    ms += target - Date.parse(`${wall.date}T${wall.time}Z`)
  }
  return ms
}

/** Local dates a stay touches, sampled every 15 minutes and at its last millisecond. */
function datesTouched(zone: string, arrival: number, release: number): number {
  const dates = new Set<string>()
  for (let t = arrival; t < release; t += 15 * 60_000) dates.add(wallClock(zone, t).date)
  dates.add(wallClock(zone, release - 1).date)
  return dates.size
}

const ordinance = ruleSetSchema.parse(ordinanceJson)
function counting(zone: string, method: 'calendar-day' | 'rolling-24h'): RuleSet {
  return { ...ordinance, timeZone: zone, storage: { counting: { method, source: { citation: 'test', confidence: 'C' } }, taxable: false } }
}

const HOUR = 3_600_000
const stays = [
  // US DST 2026: clocks spring forward at 02:00 on 8 March and fall back at 02:00 on 1 November.
  { zone: 'America/Los_Angeles', from: '2026-03-07T22:00', to: '2026-03-09T09:00', calendar: 3, hours: 34 },
  { zone: 'America/Los_Angeles', from: '2026-03-07T12:00', to: '2026-03-08T12:30', calendar: 2, hours: 23.5 },
  { zone: 'America/Los_Angeles', from: '2026-10-31T23:00', to: '2026-11-01T23:30', calendar: 2, hours: 25.5 },
  { zone: 'America/New_York', from: '2026-03-08T00:30', to: '2026-03-08T23:30', calendar: 1, hours: 22 },
  { zone: 'America/New_York', from: '2026-11-01T00:15', to: '2026-11-02T00:05', calendar: 2, hours: 24 + 50 / 60 },
  { zone: 'America/New_York', from: '2026-10-31T12:00', to: '2026-11-01T11:30', calendar: 2, hours: 24.5 },
]

describe('DST nights counted both ways, against the IANA database through Intl', () => {
  it.each(stays)('storageBill_calendarDays_$zone_$from_to_$to_is$calendar', ({ zone, from, to, calendar }) => {
    const arrival = instantOf(zone, from)
    const release = instantOf(zone, to)
    const days = storageBill({ arrivedAt: arrival, releasedAt: release, vehicleClass: 'standard' }, counting(zone, 'calendar-day'), release).days
    expect(days).toBe(datesTouched(zone, arrival, release))
    expect(days).toBe(calendar)
  })

  it.each(stays)('storageBill_24HourPeriods_$zone_$from_to_$to_countsElapsed$hours h', ({ zone, from, to, hours }) => {
    const arrival = instantOf(zone, from)
    const release = instantOf(zone, to)
    expect(release - arrival).toBe(Math.round(hours * HOUR))
    const days = storageBill({ arrivedAt: arrival, releasedAt: release, vehicleClass: 'standard' }, counting(zone, 'rolling-24h'), release).days
    expect(days).toBe(Math.ceil(hours / 24))
  })
})

const zones = ['America/Los_Angeles', 'America/New_York', 'America/Chicago', 'America/Denver', 'America/Phoenix', 'Pacific/Honolulu', 'Europe/London', 'Australia/Lord_Howe', 'Asia/Kolkata']
const instants = fc.integer({ min: Date.UTC(1995, 0, 1), max: Date.UTC(2045, 0, 1) })

describe('local dates against Intl (property, nine zones including half-hour offsets)', () => {
  it('localDay_anyInstant_isTheDateIntlShows', () => {
    fc.assert(
      fc.property(fc.constantFrom(...zones), instants, (zone, ms) => {
        expect(localDay(zone, ms)).toBe(dayFromIsoDate(wallClock(zone, ms).date))
      }),
      { numRuns: 3000 },
    )
  })

  it('startOfLocalDay_anyDate_isTheFirstInstantIntlShowsOnIt', () => {
    fc.assert(
      fc.property(fc.constantFrom(...zones), instants, (zone, ms) => {
        const day = dayFromIsoDate(wallClock(zone, ms).date)
        const start = startOfLocalDay(zone, day)
        expect(dayFromIsoDate(wallClock(zone, start).date)).toBe(day)
        expect(dayFromIsoDate(wallClock(zone, start - 1).date)).toBe(day - 1)
      }),
      { numRuns: 3000 },
    )
  })
})
