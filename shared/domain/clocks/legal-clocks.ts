import type { ClockEventKind, RuleSet, TimelineStep } from '../../schemas/rule-sets'
import { civilFromDay, type DayNumber, isoInstant } from '../time/calendar-dates'
import { type Branch, branchChooser, type ClockVehicle } from './clock-branches'
import { asClockCalendars, type ClockCalendars } from './clock-calendars'
import { type ClockAlert, type ClockEvent, clockEventLabels, type ClockStatus, type CountingRule, type Deadline, type LegalClocks, mailingEvents, plannedEvents, type StepExplanation } from './clock-events'
import { countingText, type DueDate, dueDate } from './due-dates'
import type { HolidayCalendar } from '../time/holidays'
import { assertTimeZone, type Instant, localDay, toEpochMs } from '../time/local-time'

export type { ClockVehicle } from './clock-branches'
export type { ClockAlert, ClockEvent, ClockExplanation, ClockNeed, ClockStatus, Deadline, LegalClocks, StepExplanation } from './clock-events'
export { clockEventLabels } from './clock-events'

/**
 * Every notice and disposal date of one vehicle under a rule set, as of an instant. A clock
 * starts from the latest event of its kind (a rescheduled sale moves what hangs on it) and is
 * answered by the first event that satisfies it. Days are counted on the yard's calendar: the
 * rule set's time zone unless `options.timeZone` names the yard's own, closed on `calendars` (one
 * calendar, or the ones the rule set names with the post offices' closed days: server/holidays).
 * Nothing is dropped silently: a step waiting for the value or model year comes back as
 * "needs-information", and a vehicle no branch fits gets a "no-branch" alert.
 */
export function legalClocks(
  vehicle: ClockVehicle,
  events: readonly ClockEvent[],
  ruleSet: RuleSet,
  calendars: HolidayCalendar | ClockCalendars,
  asOf: Instant,
  options: { timeZone?: string } = {},
): LegalClocks {
  const holidays = asClockCalendars(calendars)
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
  let branched = 0
  for (const step of ruleSet.timeline) {
    const start = pick(recorded, step.from, 'latest')
    const startDay = start?.day
    const branch = choose(step, (start ?? asOfRecord).year)
    if (step.when) branched++
    if (branch.applies === false) {
      notApplicable.push({ code: step.code, label: step.label, reason: branch.why })
      continue
    }
    const due = startDay === undefined ? undefined : dueDate(step, startDay, zone, holidays)
    const made = deadline(step, branch, start, due, pick(recorded, step.doneBy, 'first'), asOfMs)
    const rules = countingRules(ruleSet, step, holidays)
    deadlines.push(rules ? { ...made, rules } : made)
  }
  const alerts = clockAlerts(deadlines, notApplicable, branched)
  return { asOf: asOfRecord.iso, timeZone: zone, deadlines, notApplicable, alerts, caution: ruleSet.caution }
}

const NEEDS_ALERTS: Record<NonNullable<Deadline['needs']>, ClockAlert> = {
  value: { code: 'needs-value', message: 'Enter the value to see the deadlines that depend on it.' },
  'model-year': { code: 'needs-model-year', message: 'Enter the model year to see the deadlines that depend on it.' },
}

/** What the screens must show for the clocks as a whole, instead of showing nothing. */
function clockAlerts(deadlines: readonly Deadline[], notApplicable: LegalClocks['notApplicable'], branched: number): ClockAlert[] {
  const alerts: ClockAlert[] = []
  for (const need of ['value', 'model-year'] as const) {
    if (deadlines.some((d) => d.needs === need)) alerts.push(NEEDS_ALERTS[need])
  }
  // Every step that has a branch condition was left out: no branch of the rule set fits the vehicle.
  if (branched > 0 && notApplicable.length === branched) {
    const reasons = [...new Set(notApplicable.map((n) => n.reason))].join(' ')
    alerts.push({ code: 'no-branch', message: `No branch of the rule set applies to this vehicle, so it shows no sale date. ${reasons}` })
  }
  return alerts
}

// The counting rules of a rule set's steps, written once per step.
const rulesCache = new WeakMap<TimelineStep, CountingRule[] | null>()

/**
 * The rule set's own counting rules that this step's date followed (business days, mailing days),
 * each cited — only when the calendars are the ones the rule set names (server/holidays).
 */
function countingRules(ruleSet: RuleSet, step: TimelineStep, calendars: ClockCalendars): CountingRule[] | undefined {
  if (!calendars.ofRuleSet) return undefined
  let rules = rulesCache.get(step)
  if (rules === undefined) {
    rules = []
    const { businessDays, mailDeadlines } = ruleSet
    if (step.dayKind === 'business' && businessDays) {
      const names = businessDays.calendars.map((c) => (c.state ? `${c.country}-${c.state}` : c.country)).join(', ')
      rules.push({ code: 'business-days', calendars: names, rule: `Business days skip Saturdays, Sundays and only the holidays that every one of these calendars closes: ${names}.`, source: businessDays.source })
    }
    if (step.kind === 'deadline' && mailingEvents.has(step.doneBy) && mailDeadlines) {
      rules.push({ code: 'mailing-day', rule: 'A mailing due on a day post offices are closed is due the open day before it, never after.', source: mailDeadlines.source })
    }
    if (rules.length === 0) rules = null
    rulesCache.set(step, rules)
  }
  return rules ?? undefined
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
    ...(step.es?.label ? { es: { label: step.es.label } } : {}),
    kind: step.kind,
    status,
    statusReason,
    ...(branch.applies === 'unknown' ? { needs: branch.needs } : {}),
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
    explained: explained(step, due),
    source: step.source,
    placeholder: step.placeholder,
  }
}

/** The explanation's facts: the counting always, the dates once the start is recorded. */
function explained(step: TimelineStep, due: DueDate | undefined): StepExplanation {
  const counting = { code: 'step', kind: step.kind, days: step.days, dayKind: step.dayKind, direction: step.direction, from: step.from } as const
  if (!due) return counting
  const w = due.words
  return {
    ...counting,
    start: w.start,
    date: due.date,
    ...(w.counted ? { counted: w.counted, closed: w.closed } : {}),
    ...(w.weekendDays > 0 ? { weekendDays: w.weekendDays } : {}),
    ...(w.holidays.length > 0 ? { holidays: w.holidays } : {}),
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
