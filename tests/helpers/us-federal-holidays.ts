// The US federal holidays of 5 U.S.C. 6103, worked out by rule. Production takes its holidays
// from date-holidays (server/holidays); tests and benchmarks use this independent generator as a
// second opinion and as a calendar that needs no server.
import { civilFromDay, type DayNumber, dayFromCivil, isoDate, weekday } from '@shared/domain/time/calendar-dates'
import { type DatedHoliday, type HolidayCalendar, sliceBetween } from '@shared/domain/time/holidays'

function nthWeekday(year: number, month: number, day: number, n: number): DayNumber {
  const first = dayFromCivil(year, month, 1)
  return first + ((day - weekday(first) + 7) % 7) + (n - 1) * 7
}

function lastWeekday(year: number, month: number, day: number): DayNumber {
  const last = dayFromCivil(year, month + 1, 1) - 1
  return last - ((weekday(last) - day + 7) % 7)
}

const MONDAY = 1
const THURSDAY = 4

/**
 * The legal public holidays of 5 U.S.C. 6103(a) in `year`, on their own dates, as the law
 * stands since Juneteenth was added (2021); the Monday holidays follow the Uniform Monday
 * Holiday Act (1971) and Martin Luther King Jr. Day exists from 1986. Inauguration Day
 * (6103(c)) is left out: it closes only the Washington, D.C. area.
 */
function legalHolidays(year: number): { day: DayNumber; name: string; fixed: boolean }[] {
  const list = [
    { day: dayFromCivil(year, 1, 1), name: "New Year's Day", fixed: true },
    { day: nthWeekday(year, 2, MONDAY, 3), name: "Washington's Birthday", fixed: false },
    { day: lastWeekday(year, 5, MONDAY), name: 'Memorial Day', fixed: false },
    { day: dayFromCivil(year, 7, 4), name: 'Independence Day', fixed: true },
    { day: nthWeekday(year, 9, MONDAY, 1), name: 'Labor Day', fixed: false },
    { day: nthWeekday(year, 10, MONDAY, 2), name: 'Columbus Day', fixed: false },
    { day: dayFromCivil(year, 11, 11), name: 'Veterans Day', fixed: true },
    { day: nthWeekday(year, 11, THURSDAY, 4), name: 'Thanksgiving Day', fixed: false },
    { day: dayFromCivil(year, 12, 25), name: 'Christmas Day', fixed: true },
  ]
  if (year >= 1986) list.push({ day: nthWeekday(year, 1, MONDAY, 3), name: 'Birthday of Martin Luther King, Jr.', fixed: false })
  if (year >= 2021) list.push({ day: dayFromCivil(year, 6, 19), name: 'Juneteenth National Independence Day', fixed: true })
  return list
}

/**
 * OPM's rule for a holiday on a weekend (5 U.S.C. 6103(b), Executive Order 11582): Saturday is
 * observed the Friday before, Sunday the Monday after. So 1 January on a Saturday is observed
 * on 31 December of the year before — which is why a year's list looks one year ahead.
 */
function observed(day: DayNumber): DayNumber {
  const w = weekday(day)
  return w === 6 ? day - 1 : w === 0 ? day + 1 : day
}

/** The US federal holidays observed during calendar year `year`, in date order. */
export function usFederalHolidays(year: number): DatedHoliday[] {
  const first = dayFromCivil(year, 1, 1)
  const last = dayFromCivil(year, 12, 31)
  return [...legalHolidays(year), ...legalHolidays(year + 1)]
    .map((h) => {
      const day = h.fixed ? observed(h.day) : h.day
      return { day, date: isoDate(day), name: day === h.day ? h.name : `${h.name} (observed)` }
    })
    .filter((h) => h.day >= first && h.day <= last)
    .sort((a, b) => a.day - b.day)
}

/** US federal holidays for any year, each year worked out once on first use. */
export function usFederalCalendar(): HolidayCalendar {
  const years = new Map<number, DatedHoliday[]>()
  const ofYear = (year: number) => {
    let list = years.get(year)
    if (!list) {
      list = usFederalHolidays(year)
      years.set(year, list)
    }
    return list
  }
  return {
    between(first, last) {
      const from = civilFromDay(first).year
      const to = civilFromDay(last).year
      if (from === to) return sliceBetween(ofYear(from), first, last)
      const found: DatedHoliday[] = []
      for (let year = from; year <= to; year++) found.push(...sliceBetween(ofYear(year), first, last))
      return found
    },
  }
}
