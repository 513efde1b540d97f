import type { Deadline } from '@shared/domain/clocks'
import { isoDate, localDay } from '@shared/domain/time'
import type { DeadlineEntry } from '@shared/schemas/deadlines'
import type { VehicleClocks } from '../charges/index'
import type { ActiveVehicle } from './deadlines.queries'

type Who = Pick<DeadlineEntry, 'vehicleId' | 'stockNumber' | 'vehicle' | 'plate'>

/** A "deadline" step still to do: not done, whether or not its day has passed; undated steps wait for their start. */
const isOpen = (d: Deadline) => d.kind === 'deadline' && !d.doneBy.at && !!d.dueDate && (d.status === 'upcoming' || d.status === 'missed')

/**
 * The open deadlines of one vehicle: the police clock until it is met, every "deadline" step of its
 * timeline not yet done, and its lien sale — the date it becomes allowed, or "eligible" (on today)
 * once it is and nobody has claimed the vehicle.
 */
export function entriesOf(v: ActiveVehicle, c: VehicleClocks, today: string, timeZone: string, nowMs: number): DeadlineEntry[] {
  const who: Who = { vehicleId: v.id, stockNumber: v.stockNumber, vehicle: [v.year, v.make, v.model].filter(Boolean).join(' '), plate: v.plate }
  const out: DeadlineEntry[] = []
  const p = c.policeNotice
  if (p && !p.notification) {
    const dueMs = Date.parse(p.dueAt)
    out.push({
      ...who,
      kind: 'police',
      code: 'police-notice',
      label: p.label,
      day: isoDate(localDay(timeZone, dueMs)),
      dueAt: p.dueAt,
      status: dueMs < nowMs ? 'overdue' : 'due',
      explanation: p.explanation,
      explained: { code: 'police', hours: p.hours, start: p.start, startAt: p.startAt, dueAt: p.dueAt },
      citation: p.source.citation,
      ...withWords(p.es?.label, p.source.es?.citation),
    })
  }
  for (const d of c.clocks.deadlines.filter(isOpen)) {
    out.push({
      ...who,
      kind: 'notice',
      code: d.code,
      label: d.label,
      day: d.dueDate!,
      dueAt: d.dueAt ?? null,
      status: d.status === 'missed' ? 'overdue' : 'due',
      explanation: d.explanation,
      explained: d.explained,
      citation: d.source.citation,
      ...withWords(d.es?.label, d.source.es?.citation),
      doneBy: d.doneBy.event,
    })
  }
  const gate = c.lienSale
  if (!c.claimed && gate.date && gate.step && gate.citation && (gate.code === 'open' || gate.code === 'not-before')) {
    out.push({
      ...who,
      kind: 'lien-sale',
      code: 'lien-sale',
      label: gate.step,
      day: gate.open ? today : gate.date,
      dueAt: null,
      status: gate.open ? 'eligible' : 'due',
      ...(gate.open ? { since: gate.date } : {}),
      explanation: gate.open ? `Eligible for lien sale or disposal since ${gate.date}.` : `Not before ${gate.date}.`,
      explained: { code: gate.open ? 'eligible-since' : 'not-before', date: gate.date },
      citation: gate.citation,
      ...withWords(gate.es?.step, gate.es?.citation),
    })
  }
  return out
}

/** The Spanish label and citation beside the English, only where the rule set has them. */
function withWords(label: string | undefined, citation: string | undefined): Pick<DeadlineEntry, 'es'> {
  return label || citation ? { es: { ...(label ? { label } : {}), ...(citation ? { citation } : {}) } } : {}
}

/** Overdue first (oldest first), then by day; within a day, by the minute it falls due, then by stock number. */
export function byUrgency(a: DeadlineEntry, b: DeadlineEntry): number {
  const overdue = Number(b.status === 'overdue') - Number(a.status === 'overdue')
  if (overdue !== 0) return overdue
  if (a.day !== b.day) return a.day < b.day ? -1 : 1
  // ISO instants and stock numbers sort as plain text; no locale rules (and none of their cost) apply.
  const at = compare(a.dueAt ?? '\uffff', b.dueAt ?? '\uffff')
  return at !== 0 ? at : compare(a.stockNumber, b.stockNumber)
}

const compare = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0)
