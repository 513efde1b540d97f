import { stepWords } from '@shared/messages/rule-words'
import { dayFromIsoDate, type HolidayCalendar, localDay } from '@shared/domain/time'
import {
  type ClockCalendars,
  type ClockEvent,
  type Deadline,
  type LegalClocks,
  type LienSaleGate,
  legalClocks,
  lienSaleGate,
  type PoliceNotification,
  policeNoticeClock,
  type TowTimes,
} from '@shared/domain/clocks'
import { storageBill } from '@shared/domain/billing'
import type { LienSaleEligible, NextDeadline, VehicleSummary } from '@shared/schemas/charges'
import type { RuleSet } from '@shared/schemas/rule-sets'

export interface SummaryInput {
  arrivedAt: Date
  closedAt: Date | null
  vehicleClass: string
  modelYear: number | null
  valueCents: number | null
  towCents: number
  /** Recorded notice events beyond the arrival itself (mailings, filings, postings). */
  clockEvents: ClockEvent[]
  /** The tow's reason and times, for the rule set's police-notification clock (none without them). */
  tow?: TowTimes | null
  policeNotification?: PoliceNotification | null
  /** The owner has claimed the vehicle (chosen to collect it or have it repaired): not eligible for sale. */
  claimed?: boolean
}

// Missed deadlines first, then the nearest open one; an "earliest" date only once no deadline is open.
const URGENCY: Partial<Record<Deadline['status'], number>> = { missed: 0, upcoming: 1 }

/**
 * Every legal clock of one vehicle, as of an instant: the events the arrival itself records under the
 * rule set (storage, the lien arising) and those recorded since. The board, the vehicle page and the
 * Deadlines page all read their dates from here.
 */
export function vehicleClocks(
  input: Pick<SummaryInput, 'arrivedAt' | 'modelYear' | 'valueCents' | 'clockEvents'>,
  ruleSet: RuleSet,
  holidays: HolidayCalendar | ClockCalendars,
  at: Date,
  timeZone: string,
): LegalClocks {
  const atArrival = (ruleSet.arrivalEvents?.kinds ?? ['stored']).map((kind) => ({ kind, at: input.arrivedAt.toISOString() }))
  const events: ClockEvent[] = [...atArrival, ...input.clockEvents]
  return legalClocks({ modelYear: input.modelYear, valueCents: input.valueCents }, events, ruleSet, holidays, at.toISOString(), { timeZone })
}

/** The running bill and the next legal date of one vehicle, as of an instant, in the yard's zone. */
export function summarizeVehicle(input: SummaryInput, ruleSet: RuleSet, holidays: HolidayCalendar | ClockCalendars, asOf: Date, timeZone: string): VehicleSummary {
  const at = asOf.getTime() < input.arrivedAt.getTime() ? input.arrivedAt : asOf
  const bill = storageBill(
    { arrivedAt: input.arrivedAt.toISOString(), releasedAt: input.closedAt?.toISOString() ?? null, vehicleClass: input.vehicleClass },
    ruleSet,
    at.toISOString(),
    { timeZone },
  )
  const clocks = vehicleClocks(input, ruleSet, holidays, at, timeZone)
  const open = clocks.deadlines
    .filter((d) => d.dueDate && URGENCY[d.status] !== undefined && !(d.kind === 'earliest' && d.status === 'missed'))
    .sort((a, b) => rank(a) - rank(b) || a.dueDate!.localeCompare(b.dueDate!))
  const today = localDay(timeZone, at.getTime())
  const lienSale = lienSaleGate(clocks.deadlines, clocks.alerts)
  return {
    daysOnLot: bill.days,
    storageCents: bill.totalCents,
    towCents: input.towCents,
    balanceCents: bill.totalCents + input.towCents,
    // A vehicle that has left has no deadline ahead of it: its record shows what happened, not what is due.
    nextDeadline: open[0] && !input.closedAt ? toNext(open[0], today) : null,
    lienSale,
    clockAlerts: input.closedAt ? [] : clocks.alerts,
    eligible: input.claimed || input.closedAt ? null : eligibleSince(lienSale),
    // The tow's clock runs on the real clock, from the tow: as of now, not as of the arrival.
    policeNotice: input.closedAt ? null : policeNoticeClock(ruleSet.policeNotice, input.tow ?? null, input.policeNotification ?? null, asOf.toISOString()),
    warnings: bill.warnings,
    sampleWarnings: bill.sampleWarnings,
  }
}

/** Open gate: eligible for lien sale or disposal since its date, by the rule that set it. */
export function eligibleSince(gate: LienSaleGate): LienSaleEligible | null {
  return gate.open && gate.date && gate.step && gate.citation ? { since: gate.date, step: gate.step, citation: gate.citation, ...(gate.es ? { es: gate.es } : {}) } : null
}

function rank(d: Deadline): number {
  return (URGENCY[d.status] ?? 9) * 2 + (d.kind === 'earliest' ? 1 : 0)
}

function toNext(d: Deadline, today: number): NextDeadline {
  return {
    code: d.code,
    label: d.label,
    kind: d.kind,
    status: d.status,
    dueDate: d.dueDate!,
    dueAt: d.dueAt ?? null,
    daysLeft: dayFromIsoDate(d.dueDate!) - today,
    explanation: d.explanation,
    explained: d.explained,
    citation: d.source.citation,
    ...(stepWords(d) ? { es: stepWords(d) } : {}),
    ...(d.rules ? { rules: d.rules.map((r) => ({ code: r.code, rule: r.rule, citation: r.source.citation, ...(r.source.es?.citation ? { es: { citation: r.source.es.citation } } : {}), ...(r.calendars ? { calendars: r.calendars } : {}) })) } : {}),
  }
}
