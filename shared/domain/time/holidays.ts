import { type DayNumber, dayFromIsoDate } from './calendar-dates'

/**
 * A holiday as the server sends it to the client: the date it is observed on, and its name in English with
 * the Spanish beside it where the holiday source has one (`shared/messages/rule-words.ts` picks the reader's).
 */
export type Holiday = { date: string; name: string; es?: { name: string } | undefined }

/** A holiday's date and names, without anything a calendar added to find it. */
export const holidayNames = (h: Holiday): Holiday => (h.es ? { date: h.date, name: h.name, es: { name: h.es.name } } : { date: h.date, name: h.name })
export type DatedHoliday = Holiday & { day: DayNumber }

/**
 * Where legal clocks learn which days the yard's jurisdiction is closed. The client builds one
 * from the list the server sends; the server can add state holidays (from date-holidays) to
 * the federal ones with holidayCalendarFromList.
 */
export interface HolidayCalendar {
  /** Holidays observed from `first` through `last` (inclusive), in date order. */
  between(first: DayNumber, last: DayNumber): readonly DatedHoliday[]
}

const NONE: readonly DatedHoliday[] = Object.freeze([])

/** The holidays of a date-sorted list that fall from `first` through `last` (inclusive). */
export function sliceBetween(sorted: readonly DatedHoliday[], first: DayNumber, last: DayNumber): readonly DatedHoliday[] {
  let low = 0
  let high = sorted.length
  while (low < high) {
    const middle = (low + high) >> 1
    if ((sorted[middle] as DatedHoliday).day < first) low = middle + 1
    else high = middle
  }
  let end = low
  while (end < sorted.length && (sorted[end] as DatedHoliday).day <= last) end++
  // Most days are no holiday: answer those without making an array.
  return end === low ? NONE : sorted.slice(low, end)
}

/** A calendar from a list of dated holidays (for instance the server's federal + state list). */
export function holidayCalendarFromList(holidays: Iterable<Holiday>): HolidayCalendar {
  const sorted = [...holidays]
    .map((h) => ({ ...h, day: dayFromIsoDate(h.date, 'holidays') }))
    .sort((a, b) => a.day - b.day)
  return { between: (first, last) => sliceBetween(sorted, first, last) }
}

/**
 * A calendar closed only on the days every one of `calendars` closes, named as the first names them.
 * Where a statute counts business days without naming its holidays, counting with this one can only
 * bring a due date earlier than counting with any one of them.
 */
export function closedByEvery(calendars: readonly HolidayCalendar[]): HolidayCalendar {
  const [first, ...others] = calendars
  if (!first) throw new Error('closedByEvery needs at least one calendar')
  if (others.length === 0) return first
  return {
    between(from, to) {
      const found = first.between(from, to)
      return found.length === 0 ? found : found.filter((h) => others.every((c) => c.between(h.day, h.day).length > 0))
    },
  }
}
