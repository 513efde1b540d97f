import type { ClockEventKind, RuleSet, TimelineStep } from '../../schemas/rule-sets'
import { civilFromDay, type DayNumber, isoInstant } from '../time/calendar-dates'
import { type Branch, branchChooser, type ClockVehicle } from './clock-branches'
import { type ClockEvent, clockEventLabels, type ClockStatus, type Deadline, type LegalClocks, plannedEvents } from './clock-events'
import { countingText, type DueDate, dueDate } from './due-dates'
import type { HolidayCalendar } from '../time/holidays'
import { assertTimeZone, type Instant, localDay, toEpochMs } from '../time/local-time'

export type { ClockVehicle } from './clock-branches'
export type { ClockEvent, ClockStatus, Deadline, LegalClocks } from './clock-events'
export { clockEventLabels } from './clock-events'

/**
 * Every notice and disposal date of one vehicle under a rule set, as of an instant. A clock
 * starts from the latest event of its kind (a rescheduled sale moves what hangs on it) and is
 * answered by the first event that satisfies it. Days are counted on the yard's calendar: the
 * rule set's time zone unless `options.timeZone` names the yard's own, closed on `holidays`.
 */
export function legalClocks(
  vehicle: ClockVehicle,
  events: readonly ClockEvent[],
  ruleSet: RuleSet,
  holidays: HolidayCalendar,
  asOf: Instant,
  options: { timeZone?: string } = {},
): LegalClocks {
  const zone = options.timeZone ?? ruleSet.timeZone
  assertTimeZone(zone)
  const asOfMs = toEpochMs(asOf, 'asOf')
  const recorded: Recorded[] = []
  for (const event of events) {
    const ms = toEpochMs(event.at, 'events.at')
    if (ms <= asOfMs || plannedEvents.has(event.kind)) recorded.push(new Recorded(event.kind, ms, zone))
  }
  const choose = branchChooser(vehicle)
  const asOfRecord = new Recorded('as-of', asOfMs, zone)
  const deadlines: Deadline[] = []
  const notApplicable: LegalClocks['notApplicable'] = []
  for (const step of ruleSet.timeline) {
    const start = pick(recorded, step.from, 'latest')
    const startDay = start?.day
    const branch = choose(step, (start ?? asOfRecord).year)
    if (branch.applies === false) {
      notApplicable.push({ code: step.code, label: step.label, reason: branch.why })
      continue
    }
    const due = startDay === undefined ? undefined : dueDate(step, startDay, zone, holidays)
    deadlines.push(deadline(step, branch, start, due, pick(recorded, step.doneBy, 'first'), asOfMs))
  }
  return { asOf: asOfRecord.iso, timeZone: zone, deadlines, notApplicable, caution: ruleSet.caution }
}

/** A recorded event's instant; its local date and texts are worked out once, and only if used. */
class Recorded {
  private isoText: string | undefined
  private localDay: DayNumber | undefined
  private localYear: number | undefined
  constructor(
    readonly kind: ClockEventKind | 'as-of',
    readonly ms: number,
    private readonly zone: string,
  ) {}
  get iso(): string {
    this.isoText ??= isoInstant(this.ms)
    return this.isoText
  }
  get day(): DayNumber {
    this.localDay ??= localDay(this.zone, this.ms)
    return this.localDay
  }
  /** The calendar year the event fell in, on the yard's calendar (a vehicle's age counts from it). */
  get year(): number {
    this.localYear ??= civilFromDay(this.day).year
    return this.localYear
  }
}

/** The first or the latest event of a kind (a vehicle has a handful: a scan beats a Map). */
function pick(recorded: readonly Recorded[], kind: ClockEventKind, which: 'first' | 'latest'): Recorded | undefined {
  let found: Recorded | undefined
  for (const r of recorded) {
    if (r.kind === kind && (!found || (which === 'first' ? r.ms < found.ms : r.ms > found.ms))) found = r
  }
  return found
}

function deadline(
  step: TimelineStep,
  branch: Branch,
  start: Recorded | undefined,
  due: DueDate | undefined,
  done: Recorded | undefined,
  asOfMs: number,
): Deadline {
  let status: ClockStatus
  let statusReason: string
  if (branch.applies === 'unknown') [status, statusReason] = ['needs-information', branch.why]
  else if (!due) [status, statusReason] = ['not-started', `Starts once the record shows ${clockEventLabels[step.from]}.`]
  else [status, statusReason] = judge(step, due, done, asOfMs)
  return {
    code: step.code,
    label: step.label,
    kind: step.kind,
    status,
    statusReason,
    dueDate: due?.date,
    dueAt: due?.edgeIso,
    days: step.days,
    dayKind: step.dayKind,
    direction: step.direction,
    weekendDaysSkipped: due ? due.weekendDays : 0,
    holidaysSkipped: due ? due.holidays : [],
    start: { event: step.from, label: clockEventLabels[step.from], at: start?.iso },
    doneBy: { event: step.doneBy, label: clockEventLabels[step.doneBy], at: done?.iso },
    branch: branch.why,
    explanation: due ? due.explanation : `${countingText(step)}.`,
    source: step.source,
    placeholder: step.placeholder,
  }
}

function judge(step: TimelineStep, due: DueDate, done: Recorded | undefined, asOfMs: number): [ClockStatus, string] {
  const what = clockEventLabels[step.doneBy]
  const edge = due.edgeMs
  const dueDate = due.date
  if (step.kind === 'deadline') {
    if (done) {
      return done.ms < edge
        ? ['met', `Done in time: ${what} on ${done.iso}.`]
        : ['missed', `Done late: ${what} on ${done.iso}, after ${dueDate}.`]
    }
    return asOfMs < edge ? ['upcoming', `Due by the end of ${dueDate}.`] : ['missed', `Not recorded, and ${dueDate} has passed.`]
  }
  if (done) {
    return done.ms >= edge
      ? ['met', `Not before ${dueDate}, as required: ${what} on ${done.iso}.`]
      : ['missed', `Too early: ${what} on ${done.iso}, before ${dueDate}.`]
  }
  return asOfMs >= edge ? ['reached', `Open since ${dueDate}.`] : ['upcoming', `Not before ${dueDate}.`]
}
