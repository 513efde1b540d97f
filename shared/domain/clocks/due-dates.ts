import type { TimelineStep } from '../../schemas/rule-sets'
import { countBusinessDays } from '../time/business-days'
import { type DayNumber, isoDate, isoInstant, weekday } from '../time/calendar-dates'
import { type ClockCalendars, postOfficeClosed } from './clock-calendars'
import { clockEventLabels, mailingEvents } from './clock-events'
import { type Holiday, holidayNames } from '../time/holidays'
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
  /** The explanation's facts, for the reader's language (the screens word them; `explanation` stays the English). */
  words: DueDateWords
}

/** What an explanation says, as data: the start day, a day a mailing moved off, what was skipped. */
export type DueDateWords = {
  start: string
  /** The day counted, when a mailing moved the due date off it to the open day before. */
  counted?: string
  /** Why post offices were closed on the counted day: a holiday's name (with its Spanish), or a weekday (0 Sunday … 6 Saturday). */
  closed?: PostOfficeClosed
  weekendDays: number
  holidays: readonly Holiday[]
}

export type PostOfficeClosed = { holiday?: string; es?: { holiday: string }; weekday?: number }

const NO_HOLIDAYS: readonly Holiday[] = Object.freeze([])

/**
 * Vehicles stored on the same day share every due date, so each (calendar, step, zone, start
 * date) is worked out once — a yard's board asks for the same few hundred dates all day.
 */
const cache = new WeakMap<ClockCalendars, WeakMap<TimelineStep, Map<string, DayTable<DueDate>>>>()

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

export function dueDate(step: TimelineStep, startDay: DayNumber, zone: string, calendars: ClockCalendars): DueDate {
  let bySteps = cache.get(calendars)
  if (!bySteps) cache.set(calendars, (bySteps = new WeakMap()))
  let byZone = bySteps.get(step)
  if (!byZone) bySteps.set(step, (byZone = new Map()))
  let byDay = byZone.get(zone)
  if (!byDay) byZone.set(zone, (byDay = new DayTable()))
  let found = byDay.get(startDay)
  if (!found) {
    found = work(step, startDay, zone, calendars)
    byDay.set(startDay, found)
  }
  return found
}

/**
 * A deadline to mail something that falls on a day post offices are closed moves to the open day
 * before it — never after, so the notice cannot go out later than the law requires.
 */
function mailingDay(step: TimelineStep, day: DayNumber, calendars: ClockCalendars): { day: DayNumber; note?: string; closed?: DueDateWords['closed'] } {
  const postOffice = calendars.postOffice
  if (!postOffice || step.kind !== 'deadline' || !mailingEvents.has(step.doneBy)) return { day }
  const why = postOfficeClosed(postOffice, day)
  if (!why) return { day }
  let open = day - 1
  while (postOfficeClosed(postOffice, open)) open--
  const holiday = postOffice.holidays.between(day, day)[0]
  return {
    day: open,
    note: `${isoDate(day)} is ${why}, when post offices are closed, so the mailing is due the open day before, ${isoDate(open)}`,
    closed: holiday ? { holiday: holiday.name, ...(holiday.es ? { es: { holiday: holiday.es.name } } : {}) } : { weekday: weekday(day) },
  }
}

function work(step: TimelineStep, startDay: DayNumber, zone: string, calendars: ClockCalendars): DueDate {
  const sign = step.direction === 'after' ? 1 : -1
  const counted =
    step.dayKind === 'business'
      ? countBusinessDays(startDay, step.days, sign, calendars.closed)
      : { day: startDay + sign * step.days, weekendDays: 0, holidays: NO_HOLIDAYS }
  const mailing = mailingDay(step, counted.day, calendars)
  const edgeMs = startOfLocalDay(zone, step.kind === 'deadline' ? mailing.day + 1 : mailing.day)
  const date = isoDate(mailing.day)
  const skipped = [
    ...(counted.weekendDays > 0 ? [`${counted.weekendDays} weekend day${counted.weekendDays === 1 ? '' : 's'}`] : []),
    ...counted.holidays.map((h) => `${h.name} (${h.date})`),
  ]
  const rule = mailing.note
    ? `${countingText(step)} (${isoDate(startDay)}): ${isoDate(counted.day)}`
    : `${countingText(step)} (${isoDate(startDay)}): ${step.kind === 'deadline' ? 'due by' : 'not before'} ${date}`
  const counting = skipped.length > 0 ? `${rule}, skipping ${skipped.join(' and ')}` : rule
  return {
    day: mailing.day,
    date,
    edgeMs,
    edgeIso: isoInstant(edgeMs),
    weekendDays: counted.weekendDays,
    holidays: counted.holidays.length > 0 ? counted.holidays.map(holidayNames) : NO_HOLIDAYS,
    explanation: mailing.note ? `${counting}; ${mailing.note}.` : `${counting}.`,
    words: {
      start: isoDate(startDay),
      ...(mailing.closed ? { counted: isoDate(counted.day), closed: mailing.closed } : {}),
      weekendDays: counted.weekendDays,
      holidays: counted.holidays.length > 0 ? counted.holidays.map(holidayNames) : NO_HOLIDAYS,
    },
  }
}

/** "7 business days after the vehicle was placed in storage". */
export function countingText(step: TimelineStep): string {
  return `${step.days} ${step.dayKind} day${step.days === 1 ? '' : 's'} ${step.direction} ${clockEventLabels[step.from]}`
}
