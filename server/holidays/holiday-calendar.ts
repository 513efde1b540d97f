import { createRequire } from 'node:module'
import type HolidaysType from 'date-holidays'
import { civilFromDay, closedByEvery, type DatedHoliday, type Holiday, type HolidayCalendar, holidayCalendarFromList } from '@shared/domain/time'
import type { ClockCalendars } from '@shared/domain/clocks'
import type { RuleSet } from '@shared/schemas/rule-sets'

export interface CalendarKey {
  country: string
  state?: string
}

const calendars = new Map<string, HolidayCalendar>()

// date-holidays takes about 0.3 s to load: it is required on the first legal clock, not at start-up.
let Holidays: typeof HolidaysType | undefined
const holidaysLibrary = () => (Holidays ??= createRequire(import.meta.url)('date-holidays') as typeof HolidaysType)

/**
 * The public holidays of a jurisdiction (date-holidays' `public` type, which includes its observed
 * substitutes for weekend holidays), worked out a year at a time on first use and kept.
 * date-holidays is server-only (about 236 KB gzipped); the client gets lists from the API.
 */
export function holidayCalendar(key: CalendarKey): HolidayCalendar {
  const id = `${key.country}/${key.state ?? ''}`
  let calendar = calendars.get(id)
  if (!calendar) {
    const Library = holidaysLibrary()
    // Two instances: date-holidays' getHolidays(year, 'es') switches the instance's language for every later
    // call, and a substitute day is matched to its holiday by the English name (SUBSTITUTE below).
    calendar = yearByYear(new Library(key.country, key.state ?? ''), new Library(key.country, key.state ?? '', { languages: ['es'] }))
    calendars.set(id, calendar)
  }
  return calendar
}

const byRuleSet = new WeakMap<RuleSet, ClockCalendars>()

/**
 * The calendars a rule set's clocks count with: its business days skip only the holidays every
 * calendar it names closes (its own holiday calendar when it names none), and its mailing deadlines
 * move off the days post offices are closed when it says so.
 */
export function ruleSetCalendars(ruleSet: RuleSet): ClockCalendars {
  let found = byRuleSet.get(ruleSet)
  if (!found) {
    const { businessDays, mailDeadlines } = ruleSet
    found = {
      closed: businessDays ? closedByEvery(businessDays.calendars.map(holidayCalendar)) : holidayCalendar(ruleSet.holidayCalendar),
      postOffice: mailDeadlines ? { holidays: holidayCalendar(mailDeadlines.postOfficeCalendar), closedWeekdays: mailDeadlines.closedWeekdays } : null,
      ofRuleSet: true,
    }
    byRuleSet.set(ruleSet, found)
  }
  return found
}

const SUBSTITUTE = / \(substitute day\)$/

/**
 * The public holidays of a year, with the weekday a weekend holiday is observed on. date-holidays
 * types some of those substitutes otherwise (the US Veterans Day one is "bank"), so a substitute
 * counts whenever the holiday it stands for is public: 5 U.S.C. 6103(b) and OPM's weekend rule.
 * Each keeps the name it has always had (the calendar's own language: English for the US) and carries
 * date-holidays' Spanish name beside it where the library has one; where it has none it answers in the
 * calendar's own language, the same name, and no Spanish is given (the reader then reads the English).
 */
export function publicHolidays(source: HolidaysType, year: number, inSpanish?: HolidaysType): Holiday[] {
  const all = source.getHolidays(year)
  const spanish = new Map((inSpanish?.getHolidays(year) ?? []).map((h) => [`${h.date}|${h.rule}`, h.name]))
  const publicNames = new Set(all.filter((h) => h.type === 'public').map((h) => h.name))
  return all
    .filter((h) => h.type === 'public' || (h.substitute === true && publicNames.has(h.name.replace(SUBSTITUTE, ''))))
    .map((h) => {
      const es = spanish.get(`${h.date}|${h.rule}`)
      return es && es !== h.name ? { date: h.date.slice(0, 10), name: h.name, es: { name: es } } : { date: h.date.slice(0, 10), name: h.name }
    })
}

function yearByYear(source: HolidaysType, inSpanish: HolidaysType): HolidayCalendar {
  const years = new Map<number, HolidayCalendar>()
  const ofYear = (year: number) => {
    let cal = years.get(year)
    if (!cal) {
      cal = holidayCalendarFromList(publicHolidays(source, year, inSpanish))
      years.set(year, cal)
    }
    return cal
  }
  return {
    between(first, last) {
      const from = civilFromDay(first).year
      const to = civilFromDay(last).year
      if (from === to) return ofYear(from).between(first, last)
      const found: DatedHoliday[] = []
      for (let y = from; y <= to; y++) found.push(...ofYear(y).between(first, last))
      return found
    },
  }
}
