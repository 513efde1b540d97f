import { describe, expect, it } from 'vitest'
import { instantFromWallClock, isoInZone, wallClock } from '@shared/domain/time'

// US daylight saving time, 15 U.S.C. 260a (as amended by the Energy Policy Act of 2005): from 2:00 a.m.
// on the second Sunday of March to 2:00 a.m. on the first Sunday of November — in 2026, 8 March and
// 1 November. Arizona does not observe it (a state may exempt itself under the same section).
const LA = 'America/Los_Angeles'

describe('a wall-clock time typed at the yard is the yard-zone instant, whatever the browser zone', () => {
  it.each([
    ['winter, Pacific Standard Time (UTC−8)', LA, '2026-12-02T14:05:00', '2026-12-02T22:05:00.000Z', '2026-12-02T14:05:00-08:00'],
    ['summer, Pacific Daylight Time (UTC−7)', LA, '2026-07-04T09:00:00', '2026-07-04T16:00:00.000Z', '2026-07-04T09:00:00-07:00'],
    ['Arizona keeps UTC−7 all year', 'America/Phoenix', '2026-07-04T09:00:00', '2026-07-04T16:00:00.000Z', '2026-07-04T09:00:00-07:00'],
    ['Eastern, the day after the change back', 'America/New_York', '2026-11-02T08:30:00', '2026-11-02T13:30:00.000Z', '2026-11-02T08:30:00-05:00'],
  ])('%s', (_case, zone, wall, utc, iso) => {
    const instant = instantFromWallClock(zone, wall)
    expect(new Date(instant).toISOString()).toBe(utc)
    expect(wallClock(zone, instant)).toBe(wall)
    expect(isoInZone(zone, instant)).toBe(iso)
  })

  it('02:30 on 8 March 2026 does not exist in Los Angeles: it is read as 03:30 daylight time, after the change', () => {
    const instant = instantFromWallClock(LA, '2026-03-08T02:30:00')
    expect(new Date(instant).toISOString()).toBe('2026-03-08T10:30:00.000Z')
    expect(isoInZone(LA, instant)).toBe('2026-03-08T03:30:00-07:00')
  })

  it('01:30 on 1 November 2026 happens twice in Los Angeles: the first, daylight time, is taken', () => {
    const instant = instantFromWallClock(LA, '2026-11-01T01:30:00')
    expect(new Date(instant).toISOString()).toBe('2026-11-01T08:30:00.000Z')
    expect(isoInZone(LA, instant + 3_600_000)).toBe('2026-11-01T01:30:00-08:00')
  })

  it('minutes without seconds are read, seconds are dropped on the way back', () => {
    expect(wallClock(LA, instantFromWallClock(LA, '2026-12-02T14:05') + 42_700)).toBe('2026-12-02T14:05:42')
  })

  it('refuses what is not a wall-clock time, and an unknown zone', () => {
    expect(() => instantFromWallClock(LA, '2026-12-02T14:05:00-08:00')).toThrow(/not a wall-clock time/)
    expect(() => wallClock('Pacific', 0)).toThrow(/IANA time zone/)
  })
})
