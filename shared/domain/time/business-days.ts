import { type DayNumber, isWeekend } from './calendar-dates'
import type { DatedHoliday, HolidayCalendar } from './holidays'

export type Counted = {
  day: DayNumber
  /** Saturdays and Sundays passed over on the way (business-day counts only). */
  weekendDays: number
  /** Weekday holidays passed over on the way, by name. */
  holidays: DatedHoliday[]
}

/**
 * The `n`-th business day after (direction 1) or before (direction −1) `from`, which itself is
 * not counted — the usual way a statute's "within N business days of" is read. Whole weeks are
 * jumped at once (five business days and two weekend days each, less the holidays found in
 * them), so a long count costs a few steps, not one per day.
 */
export function countBusinessDays(from: DayNumber, n: number, direction: 1 | -1, holidays: HolidayCalendar): Counted {
  let day = from
  let remaining = n
  let weekendDays = 0
  const skipped: DatedHoliday[] = []
  while (remaining > 0) {
    if (remaining >= 5 && !isWeekend(day)) {
      // From a weekday, the 7·w days ahead hold exactly 5·w weekdays and end on a weekday.
      const weeks = Math.floor(remaining / 5)
      const to = day + direction * 7 * weeks
      const found = direction === 1 ? holidays.between(day + 1, to) : holidays.between(to, day - 1)
      const closed = found.filter((h) => !isWeekend(h.day))
      if (direction === -1) closed.reverse()
      skipped.push(...closed)
      weekendDays += 2 * weeks
      remaining += closed.length - 5 * weeks
      day = to
      continue
    }
    day += direction
    if (isWeekend(day)) {
      weekendDays++
      continue
    }
    const holiday = holidays.between(day, day)[0]
    if (holiday) skipped.push(holiday)
    else remaining--
  }
  return { day, weekendDays, holidays: skipped }
}
