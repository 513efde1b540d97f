import type { ClockEventKind, RuleSet, TimelineStep } from '../schemas/rule-sets'
import { type Counted, countBusinessDays } from './business-days'
import { CACHED_DAYS, cacheSlot, civilFromDay, type DayNumber, isoDate, isoInstant } from './calendar-dates'
import { type Branch, branchChooser, type ClockVehicle } from './clock-branches'
import { type ClockEvent, clockEventLabels, type ClockStatus, type Deadline, type LegalClocks, plannedEvents } from './clock-events'
import type { HolidayCalendar } from './holidays'
import { assertTimeZone, type Instant, localDay, startOfLocalDay, toEpochMs } from './local-time'

export type { ClockVehicle } from './clock-branches'
export type { ClockEvent, ClockStatus, Deadline, LegalClocks } from './clock-events'
export { clockEventLabels } from './clock-events'

/**
 * Every notice and disposal date of one vehicle under a rule set, as of an instant. A clock
 * starts from the latest event of its kind (a rescheduled sale moves what hangs on it) and is
 * answered by the first event that satisfies it. The yard's holidays come from `holidays`.
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
  const asOfRecord = new Recorded('stored', asOfMs, zone)
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
    const due = startDay === undefined ? undefined : dueDay(step, startDay, holidays)
    deadlines.push(deadline(step, branch, start, due, pick(recorded, step.doneBy, 'first'), asOfMs, zone))
  }
  return { asOf: asOfRecord.iso, timeZone: zone, deadlines, notApplicable, caution: ruleSet.caution }
}

/** A recorded event's instant; its local date and texts are worked out once, and only if used. */
class Recorded {
  private isoText: string | undefined
  private localDay: DayNumber | undefined
  private localYear: number | undefined
  constructor(
    readonly kind: ClockEventKind,
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

// "7 business days after the vehicle was placed in storage": one text per step, not per vehicle.
const countingTexts = new WeakMap<TimelineStep, string>()

function countingText(step: TimelineStep): string {
  let text = countingTexts.get(step)
  if (text === undefined) {
    text = `${step.days} ${step.dayKind} day${step.days === 1 ? '' : 's'} ${step.direction} ${clockEventLabels[step.from]}`
    countingTexts.set(step, text)
  }
  return text
}

/** The first or the latest event of a kind (a vehicle has a handful: a scan beats a Map). */
function pick(recorded: readonly Recorded[], kind: ClockEventKind, which: 'first' | 'latest'): Recorded | undefined {
  let found: Recorded | undefined
  for (const r of recorded) {
    if (r.kind === kind && (!found || (which === 'first' ? r.ms < found.ms : r.ms > found.ms))) found = r
  }
  return found
}

function dueDay(step: TimelineStep, startDay: DayNumber, holidays: HolidayCalendar): Counted {
  const sign = step.direction === 'after' ? 1 : -1
  return step.dayKind === 'business'
    ? countBusinessDays(startDay, step.days, sign, holidays)
    : { day: startDay + sign * step.days, weekendDays: 0, holidays: [] }
}

// Local midnights recur across vehicles: their ISO text is made once per zone and date.
const midnightTexts = new Map<string, (string | undefined)[]>()

function localMidnight(zone: string, day: DayNumber): { ms: number; iso: string } {
  const ms = startOfLocalDay(zone, day)
  const slot = cacheSlot(day)
  if (slot < 0) return { ms, iso: isoInstant(ms) }
  let texts = midnightTexts.get(zone)
  if (!texts) midnightTexts.set(zone, (texts = new Array<string | undefined>(CACHED_DAYS).fill(undefined)))
  let iso = texts[slot]
  if (iso === undefined) texts[slot] = iso = isoInstant(ms)
  return { ms, iso }
}

function deadline(
  step: TimelineStep,
  branch: Branch,
  start: Recorded | undefined,
  due: Counted | undefined,
  done: Recorded | undefined,
  asOfMs: number,
  zone: string,
): Deadline {
  const counting = countingText(step)
  const edge = due && localMidnight(zone, step.kind === 'deadline' ? due.day + 1 : due.day)
  const dueDate = due && isoDate(due.day)
  let status: ClockStatus
  let statusReason: string
  if (branch.applies === 'unknown') [status, statusReason] = ['needs-information', branch.why]
  else if (!edge || !dueDate) [status, statusReason] = ['not-started', `Starts when ${clockEventLabels[step.from]} is recorded.`]
  else [status, statusReason] = judge(step, edge.ms, done, asOfMs, dueDate)
  return {
    code: step.code,
    label: step.label,
    kind: step.kind,
    status,
    statusReason,
    dueDate,
    dueAt: edge?.iso,
    days: step.days,
    dayKind: step.dayKind,
    direction: step.direction,
    weekendDaysSkipped: due ? due.weekendDays : 0,
    holidaysSkipped: due && due.holidays.length > 0 ? due.holidays.map((h) => ({ date: h.date, name: h.name })) : [],
    start: { event: step.from, label: clockEventLabels[step.from], at: start?.iso },
    doneBy: { event: step.doneBy, label: clockEventLabels[step.doneBy], at: done?.iso },
    branch: branch.why,
    explanation: due && start && dueDate ? explain(counting, step, due, dueDate, isoDate(start.day)) : `${counting}.`,
    source: step.source,
    placeholder: step.placeholder,
  }
}

function explain(counting: string, step: TimelineStep, due: Counted, dueDate: string, startDate: string): string {
  const skipped = due.holidays.map((h) => `${h.name} (${h.date})`)
  if (due.weekendDays > 0) skipped.unshift(`${due.weekendDays} weekend day${due.weekendDays === 1 ? '' : 's'}`)
  const rule = `${counting} (${startDate}): ${step.kind === 'deadline' ? 'due by' : 'not before'} ${dueDate}`
  return skipped.length > 0 ? `${rule}, skipping ${skipped.join(' and ')}.` : `${rule}.`
}

function judge(step: TimelineStep, edge: number, done: Recorded | undefined, asOfMs: number, dueDate: string): [ClockStatus, string] {
  const what = clockEventLabels[step.doneBy]
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
