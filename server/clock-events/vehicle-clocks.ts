import type { Executor } from '@db/client'
import { type ClockEvent, type LegalClocks, legalClocks } from '@shared/domain/clocks'
import type { RuleSet } from '@shared/schemas/rule-sets'
import { ruleSetCalendars } from '../holidays/index'
import { latestVersionOf, versionsById } from '../rule-sets/index'
import { clockEventsOf } from './clock-events.queries'

export interface ClockedVehicle {
  id: string
  arrivedAt: Date
  year: number | null
  estimatedValueCents: number | null
  ruleSetVersionId: string | null
}

export interface ClockYard {
  timeZone: string
  ruleSetId: string | null
}

export type WorkedClocks = { clocks: LegalClocks; ruleSet: RuleSet }

/**
 * Every step of these vehicles' legal clocks as of an instant, from their arrival and the events the
 * office recorded (clock_events) — one query for the events, one per rule-set version — with `extra`
 * events added as if recorded (a mailing about to be made). The same counting as the board's
 * (server/charges): the version a vehicle arrived under (else the yard's current rule set), the rule
 * set's calendars, the yard's zone. A vehicle with no rule set maps to null.
 */
export async function clocksOfVehicles(
  db: Executor,
  vehicles: readonly ClockedVehicle[],
  yard: ClockYard,
  asOf = new Date(),
  extra: readonly ClockEvent[] = [],
): Promise<Map<string, WorkedClocks | null>> {
  const out = new Map<string, WorkedClocks | null>()
  if (vehicles.length === 0) return out
  const versions = await versionsById(db, vehicles.flatMap((v) => (v.ruleSetVersionId ? [v.ruleSetVersionId] : [])))
  const needFallback = yard.ruleSetId !== null && vehicles.some((v) => !v.ruleSetVersionId || !versions.has(v.ruleSetVersionId))
  const fallback = needFallback ? (await latestVersionOf(db, yard.ruleSetId!))?.ruleSet : undefined
  const recorded = await clockEventsOf(db, vehicles.map((v) => v.id))
  for (const vehicle of vehicles) {
    const ruleSet: RuleSet | undefined = (vehicle.ruleSetVersionId && versions.get(vehicle.ruleSetVersionId)) || fallback
    if (!ruleSet) {
      out.set(vehicle.id, null)
      continue
    }
    out.set(vehicle.id, { clocks: work(vehicle, ruleSet, recorded.get(vehicle.id) ?? [], yard, asOf, extra), ruleSet })
  }
  return out
}

function work(vehicle: ClockedVehicle, ruleSet: RuleSet, recorded: readonly ClockEvent[], yard: ClockYard, asOf: Date, extra: readonly ClockEvent[]): LegalClocks {
  const arrival = (ruleSet.arrivalEvents?.kinds ?? ['stored']).map((kind) => ({ kind, at: vehicle.arrivedAt.toISOString() }))
  const at = asOf.getTime() < vehicle.arrivedAt.getTime() ? vehicle.arrivedAt : asOf
  return legalClocks(
    { modelYear: vehicle.year, valueCents: vehicle.estimatedValueCents },
    [...arrival, ...recorded, ...extra],
    ruleSet,
    ruleSetCalendars(ruleSet),
    at.toISOString(),
    { timeZone: yard.timeZone },
  )
}

/**
 * One vehicle's clocks as a function of events put IN PLACE of the recorded ones of their kind (a
 * sale date being tried day by day replaces the one on record): the rule set and the recorded
 * events read once. Null for a vehicle with no rule set.
 */
export async function vehicleClocksWith(db: Executor, vehicle: ClockedVehicle, yard: ClockYard, asOf = new Date()): Promise<((extra: readonly ClockEvent[]) => LegalClocks) | null> {
  const worked = await vehicleClocks(db, vehicle, yard, asOf)
  if (!worked) return null
  const recorded = (await clockEventsOf(db, [vehicle.id])).get(vehicle.id) ?? []
  return (instead) => work(vehicle, worked.ruleSet, recorded.filter((e) => !instead.some((i) => i.kind === e.kind)), yard, asOf, instead)
}

/** One vehicle's clocks (see clocksOfVehicles). */
export async function vehicleClocks(db: Executor, vehicle: ClockedVehicle, yard: ClockYard, asOf = new Date(), extra: readonly ClockEvent[] = []): Promise<WorkedClocks | null> {
  return (await clocksOfVehicles(db, [vehicle], yard, asOf, extra)).get(vehicle.id) ?? null
}
