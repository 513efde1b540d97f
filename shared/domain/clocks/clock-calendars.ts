import type { DayNumber } from '../time/calendar-dates'
import { weekday } from '../time/calendar-dates'
import type { HolidayCalendar } from '../time/holidays'

/** The days post offices are closed: a calendar's public holidays and some weekdays. */
export type PostOfficeDays = { holidays: HolidayCalendar; closedWeekdays: readonly number[] }

/** The calendars a rule set's clocks count with. */
export type ClockCalendars = {
  /** The holidays a business-day count passes over (besides Saturdays and Sundays). */
  closed: HolidayCalendar
  /** When set, a deadline to mail something that falls on a day post offices are closed moves to the open day before. */
  postOffice?: PostOfficeDays | null
  /** Made from the rule set's own businessDays and mailDeadlines: its deadlines then cite those rules. */
  ofRuleSet?: boolean
}

const wrapped = new WeakMap<HolidayCalendar, ClockCalendars>()

/** One calendar alone counts business days and moves no mailing (the client's preview, most unit tests). */
export function asClockCalendars(calendars: HolidayCalendar | ClockCalendars): ClockCalendars {
  if (!('between' in calendars)) return calendars
  let found = wrapped.get(calendars)
  if (!found) wrapped.set(calendars, (found = { closed: calendars, postOffice: null }))
  return found
}

const WEEKDAY_NAMES = ['a Sunday', 'a Monday', 'a Tuesday', 'a Wednesday', 'a Thursday', 'a Friday', 'a Saturday']

/** Why post offices are closed on this day ("Columbus Day", "a Sunday"), or undefined when they are open. */
export function postOfficeClosed(days: PostOfficeDays, day: DayNumber): string | undefined {
  const holiday = days.holidays.between(day, day)[0]
  if (holiday) return holiday.name
  const w = weekday(day)
  return days.closedWeekdays.includes(w) ? WEEKDAY_NAMES[w] : undefined
}
