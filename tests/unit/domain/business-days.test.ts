import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { countBusinessDays, dayFromIsoDate, holidayCalendarFromList, isoDate, isWeekend } from '@shared/domain/time'
import { usFederalCalendar } from '../../helpers/us-federal-holidays'

const federal = usFederalCalendar()
const day = (text: string) => dayFromIsoDate(text)

describe('countBusinessDays', () => {
  it.each([
    { from: '2026-06-30', n: 7, direction: 1 as const, due: '2026-07-10', weekend: 2, holidays: ['2026-07-03'], why: 'Tuesday + 7 over the observed Independence Day' },
    { from: '2026-01-09', n: 5, direction: 1 as const, due: '2026-01-16', weekend: 2, holidays: [], why: 'Friday + 5 is the next Friday' },
    { from: '2026-01-10', n: 1, direction: 1 as const, due: '2026-01-12', weekend: 1, holidays: [], why: 'from a Saturday the first business day is Monday' },
    { from: '2026-12-21', n: 10, direction: 1 as const, due: '2027-01-06', weekend: 4, holidays: ['2026-12-25', '2027-01-01'], why: 'across Christmas and New Year' },
    { from: '2026-07-10', n: 7, direction: -1 as const, due: '2026-06-30', weekend: 2, holidays: ['2026-07-03'], why: 'counting back undoes counting forward' },
    { from: '2026-03-04', n: 0, direction: 1 as const, due: '2026-03-04', weekend: 0, holidays: [], why: 'zero days is the day itself' },
  ])('countBusinessDays_$why', ({ from, n, direction, due, weekend, holidays }) => {
    const counted = countBusinessDays(day(from), n, direction, federal)
    expect(isoDate(counted.day)).toBe(due)
    expect(counted.weekendDays).toBe(weekend)
    expect(counted.holidays.map((h) => h.date)).toEqual(holidays)
  })

  it('countBusinessDays_anyStartCountAndHolidays_landsWhereADayByDayWalkLands', () => {
    const start = day('2025-01-01')
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 700 }),
        fc.integer({ min: 0, max: 60 }),
        fc.constantFrom(1 as const, -1 as const),
        fc.uniqueArray(fc.integer({ min: 0, max: 900 }), { maxLength: 40 }),
        (offset, n, direction, holidayOffsets) => {
          const closed = new Set(holidayOffsets.map((o) => start - 100 + o))
          const calendar = holidayCalendarFromList([...closed].map((d) => ({ date: isoDate(d), name: `Holiday ${d}` })))
          // Oracle: one day at a time.
          let walked = start + offset
          let weekendDays = 0
          let skipped = 0
          for (let left = n; left > 0; ) {
            walked += direction
            if (isWeekend(walked)) weekendDays++
            else if (closed.has(walked)) skipped++
            else left--
          }
          const counted = countBusinessDays(start + offset, n, direction, calendar)
          expect(counted.day).toBe(walked)
          expect(counted.weekendDays).toBe(weekendDays)
          expect(counted.holidays).toHaveLength(skipped)
        },
      ),
      { numRuns: 500 },
    )
  })
})
