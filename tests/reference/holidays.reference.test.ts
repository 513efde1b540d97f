import Holidays from 'date-holidays'
import { describe, expect, it } from 'vitest'
import { usFederalHolidays } from '../helpers/us-federal-holidays'

const observedIn = (year: number) => usFederalHolidays(year).map((h) => h.date)

describe('US federal holidays — 5 U.S.C. 6103 with OPM’s weekend rule', () => {
  it.each([
    // Check dates from REFERENCES.md [C]: Saturday → the Friday before, Sunday → the Monday after.
    { date: '2026-07-03', name: 'Independence Day (observed)', why: 'Sat 4 Jul 2026 → Fri 3 Jul' },
    { date: '2027-07-05', name: 'Independence Day (observed)', why: 'Sun 4 Jul 2027 → Mon 5 Jul' },
    { date: '2027-12-24', name: 'Christmas Day (observed)', why: 'Sat 25 Dec 2027 → Fri 24 Dec' },
    { date: '2027-12-31', name: "New Year's Day (observed)", why: 'Sat 1 Jan 2028 → Fri 31 Dec 2027, the year before' },
    { date: '2028-11-10', name: 'Veterans Day (observed)', why: 'Sat 11 Nov 2028 → Fri 10 Nov' },
    { date: '2029-11-12', name: 'Veterans Day (observed)', why: 'Sun 11 Nov 2029 → Mon 12 Nov' },
  ])('usFederalHolidays_$why_isObservedOn$date', ({ date, name }) => {
    expect(usFederalHolidays(Number(date.slice(0, 4)))).toContainEqual(expect.objectContaining({ date, name }))
  })

  it('usFederalHolidays_2028_doesNotRepeatNewYearObservedIn2027 (OPM: 1 Jan 2028 is observed on 31 Dec 2027)', () => {
    expect(observedIn(2028)).not.toContain('2028-01-01')
    expect(observedIn(2028)).toHaveLength(10)
  })

  it.each([2021, 2024, 2026])('usFederalHolidays_%i_includesJuneteenth (6103(a), from 2021)', (year) => {
    expect(usFederalHolidays(year).some((h) => h.name.startsWith('Juneteenth'))).toBe(true)
  })
})

// date-holidays as the oracle: its public US holidays plus substitute days (the Veterans Day
// substitute is typed "bank"), kept where they fall on a weekday — the days the office closes.
function oracle(year: number): string[] {
  const weekday = (date: string) => {
    const day = new Date(`${date}T00:00:00Z`).getUTCDay()
    return day !== 0 && day !== 6
  }
  return new Holidays('US')
    .getHolidays(year)
    .filter((h) => h.type === 'public' || (h.type === 'bank' && h.substitute === true))
    .map((h) => h.date.slice(0, 10))
    .filter(weekday)
    .sort()
}

describe('US federal holidays against date-holidays 3.x (oracle library)', () => {
  it.each([2021, 2022, 2023, 2024, 2025, 2026, 2027, 2028, 2029, 2030])(
    'usFederalHolidays_%i_matchesDateHolidaysWeekdayObservances',
    (year) => {
      expect(observedIn(year)).toEqual(oracle(year))
    },
  )

  it('dateHolidays_2026_listsJuneteenth (the oracle itself is current)', () => {
    expect(new Holidays('US').getHolidays(2026).some((h) => h.name.startsWith('Juneteenth') && h.type === 'public')).toBe(true)
  })
})
