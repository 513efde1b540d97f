import type { PoliceNoticeRule, Source } from '../../schemas/rule-sets'
import { type Instant, toEpochMs } from '../time/local-time'

/** The tow's own times as the tow-in records them (ISO instants). */
export interface TowTimes {
  reason: string
  calledAt: string | null
  hookedAt: string | null
  arrivedAt: string
}

/** Who at the police was told, when, and the number they gave. */
export interface PoliceNotification {
  notifiedAt: string
  agency: string
  person: string | null
  reportNumber: string | null
}

/** open: not yet told, time left; overdue: not told and the time has passed; met: told in time; late: told after it. */
export type PoliceNoticeStatus = 'open' | 'overdue' | 'met' | 'late'

/** Which recorded time the clock ran from. */
export type PoliceNoticeStart = 'called' | 'hooked' | 'arrived'

export interface PoliceNoticeClock {
  label: string
  es?: { label?: string }
  status: PoliceNoticeStatus
  hours: number
  start: PoliceNoticeStart
  startAt: string
  dueAt: string
  /** Whole minutes from the as-of instant to the due time; negative once it has passed. */
  minutesLeft: number
  explanation: string
  source: Source
  placeholder: boolean
  notification: PoliceNotification | null
}

const HOUR_MS = 3_600_000
const START_WORDS: Record<PoliceNoticeStart, string> = { called: 'the call for the tow', hooked: 'the hook-up', arrived: 'the arrival at the yard' }

/** Whether this rule asks anything of a tow with this reason. */
export function needsPoliceNotice(rule: PoliceNoticeRule | undefined, reason: string | null | undefined): rule is PoliceNoticeRule {
  return !!rule && !!reason && (rule.towReasons as readonly string[]).includes(reason)
}

/** The instant the clock runs from: the earliest recorded tow time for `tow-requested`, the arrival for `tow-completed`. */
export function policeNoticeStart(rule: PoliceNoticeRule, tow: TowTimes): { start: PoliceNoticeStart; ms: number } {
  if (rule.from === 'tow-requested') {
    if (tow.calledAt) return { start: 'called', ms: toEpochMs(tow.calledAt, 'calledAt') }
    if (tow.hookedAt) return { start: 'hooked', ms: toEpochMs(tow.hookedAt, 'hookedAt') }
  }
  return { start: 'arrived', ms: toEpochMs(tow.arrivedAt, 'arrivedAt') }
}

function hoursText(hours: number): string {
  if (hours < 1) return `${Math.round(hours * 60)} minutes`
  return `${hours} hour${hours === 1 ? '' : 's'}`
}

/**
 * The police-notification clock of one tow, as of an instant: null when the rule set asks nothing of
 * this tow. Counted in hours from the tow itself, not in days on a calendar: the yard's zone and its
 * holidays do not move it. Met by the first recorded notification at or before the due instant.
 */
export function policeNoticeClock(
  rule: PoliceNoticeRule | undefined,
  tow: TowTimes | null,
  notification: PoliceNotification | null,
  asOf: Instant,
): PoliceNoticeClock | null {
  if (!tow || !needsPoliceNotice(rule, tow.reason)) return null
  const { start, ms } = policeNoticeStart(rule, tow)
  const dueMs = ms + Math.round(rule.hours * HOUR_MS)
  const asOfMs = toEpochMs(asOf, 'asOf')
  const dueAt = new Date(dueMs).toISOString()
  let status: PoliceNoticeStatus
  if (notification) status = toEpochMs(notification.notifiedAt, 'notifiedAt') <= dueMs ? 'met' : 'late'
  else status = asOfMs <= dueMs ? 'open' : 'overdue'
  return {
    label: rule.label,
    ...(rule.es?.label ? { es: { label: rule.es.label } } : {}),
    status,
    hours: rule.hours,
    start,
    startAt: new Date(ms).toISOString(),
    dueAt,
    minutesLeft: Math.floor((dueMs - asOfMs) / 60_000),
    explanation: `${hoursText(rule.hours)} after ${START_WORDS[start]} (${new Date(ms).toISOString()}): due by ${dueAt}.`,
    source: rule.source,
    placeholder: rule.placeholder,
    notification,
  }
}
