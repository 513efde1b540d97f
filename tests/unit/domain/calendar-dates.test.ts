import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { civilFromDay, dayFromCivil, dayFromIsoDate, isoDate, isoInstant, weekday } from '@shared/domain/time'

const DAY = 86_400_000
const days = fc.integer({ min: -40_000, max: 120_000 })

describe('day numbers against the JavaScript Date (oracle)', () => {
  it('dayFromCivil_anyDate_countsTheDaysDateUtcCounts', () => {
    fc.assert(
      fc.property(days, (day) => {
        const d = new Date(day * DAY)
        expect(dayFromCivil(d.getUTCFullYear(), d.getUTCMonth() + 1, d.getUTCDate())).toBe(day)
      }),
    )
  })

  it('civilFromDay_anyDay_isTheDateDateUtcShows', () => {
    fc.assert(
      fc.property(days, (day) => {
        const d = new Date(day * DAY)
        expect(civilFromDay(day)).toEqual({ year: d.getUTCFullYear(), month: d.getUTCMonth() + 1, day: d.getUTCDate() })
      }),
    )
  })

  it('weekday_anyDay_isGetUtcDay', () => {
    fc.assert(
      fc.property(days, (day) => {
        expect(weekday(day)).toBe(new Date(day * DAY).getUTCDay())
      }),
    )
  })

  it('isoInstant_anyInstant_isToIsoString', () => {
    fc.assert(
      fc.property(fc.integer({ min: Date.UTC(1900, 0, 1), max: Date.UTC(2199, 11, 31) }), (ms) => {
        expect(isoInstant(ms)).toBe(new Date(ms).toISOString())
      }),
    )
  })
})

describe('ISO calendar dates', () => {
  it.each(['2026-02-29', '2026-13-01', '2026-1-5', '05/03/2026', ''])('dayFromIsoDate_%s_throwsInvalidDate', (text) => {
    expect(() => dayFromIsoDate(text, 'transferDate')).toThrow(expect.objectContaining({ code: 'invalid-date', field: 'transferDate' }))
  })

  it.each(['2024-02-29', '2000-02-29', '1999-12-31'])('dayFromIsoDate_%s_roundTripsThroughIsoDate', (text) => {
    expect(isoDate(dayFromIsoDate(text))).toBe(text)
  })
})
