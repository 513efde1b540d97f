import type { TimelineStep } from '../../schemas/rule-sets'
import { countBusinessDays } from '../time/business-days'
import { type DayNumber, isoDate, isoInstant } from '../time/calendar-dates'
import { clockEventLabels } from './clock-events'
import type { Holiday, HolidayCalendar } from '../time/holidays'
import { startOfLocalDay } from '../time/local-time'

/** Where one step lands from one start date: nothing here depends on the vehicle. */
export type DueDate = {
  day: DayNumber
  date: string
  /** Deadline: midnight ending the due date (missed from then). Earliest: midnight starting it. */
  edgeMs: number
  edgeIso: string
  weekendDays: number
  holidays: readonly Holiday[]
  explanation: string
}

const NO_HOLIDAYS: readonly Holiday[] = Object.freeze([])

/**
 * Vehicles stored on the same day share every due date, so each (calendar, step, zone, start
 * date) is worked out once — a yard's board asks for the same few hundred dates all day.
 */
const cache = new WeakMap<HolidayCalendar, WeakMap<TimelineStep, Map<string, DayTable<DueDate>>>>()

/** Values by day in a dense array spanning the days seen: a lookup is an index, not a hash. */
class DayTable<T> {
  private first = 0
  private items: (T | undefined)[] = []

  get(day: DayNumber): T | undefined {
    return this.items[day - this.first]
  }

  set(day: DayNumber, value: T): void {
    if (this.items.length === 0) this.first = day
    if (day < this.first) {
      this.items = [...new Array<T | undefined>(this.first - day).fill(undefined), ...this.items]
      this.first = day
    }
    while (this.items.length < day - this.first) this.items.push(undefined)
    this.items[day - this.first] = value
  }
}

export function dueDate(step: TimelineStep, startDay: DayNumber, zone: string, holidays: HolidayCalendar): DueDate {
  let bySteps = cache.get(holidays)
  if (!bySteps) cache.set(holidays, (bySteps = new WeakMap()))
  let byZone = bySteps.get(step)
  if (!byZone) bySteps.set(step, (byZone = new Map()))
  let byDay = byZone.get(zone)
  if (!byDay) byZone.set(zone, (byDay = new DayTable()))
  let found = byDay.get(startDay)
  if (!found) {
    found = work(step, startDay, zone, holidays)
    byDay.set(startDay, found)
  }
  return found
}

function work(step: TimelineStep, startDay: DayNumber, zone: string, holidays: HolidayCalendar): DueDate {
  const sign = step.direction === 'after' ? 1 : -1
  const counted =
    step.dayKind === 'business'
      ? countBusinessDays(startDay, step.days, sign, holidays)
      : { day: startDay + sign * step.days, weekendDays: 0, holidays: NO_HOLIDAYS }
  const edgeMs = startOfLocalDay(zone, step.kind === 'deadline' ? counted.day + 1 : counted.day)
  const date = isoDate(counted.day)
  const skipped = [
    ...(counted.weekendDays > 0 ? [`${counted.weekendDays} weekend day${counted.weekendDays === 1 ? '' : 's'}`] : []),
    ...counted.holidays.map((h) => `${h.name} (${h.date})`),
  ]
  const rule = `${countingText(step)} (${isoDate(startDay)}): ${step.kind === 'deadline' ? 'due by' : 'not before'} ${date}`
  return {
    day: counted.day,
    date,
    edgeMs,
    edgeIso: isoInstant(edgeMs),
    weekendDays: counted.weekendDays,
    holidays: counted.holidays.length > 0 ? counted.holidays.map((h) => ({ date: h.date, name: h.name })) : NO_HOLIDAYS,
    explanation: skipped.length > 0 ? `${rule}, skipping ${skipped.join(' and ')}.` : `${rule}.`,
  }
}

/** "7 business days after the vehicle was placed in storage". */
export function countingText(step: TimelineStep): string {
  return `${step.days} ${step.dayKind} day${step.days === 1 ? '' : 's'} ${step.direction} ${clockEventLabels[step.from]}`
}
