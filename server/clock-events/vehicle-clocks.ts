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

/** The rule set a vehicle is held under: the version it arrived under, else the yard's current one. */
export async function ruleSetOf(db: Executor, vehicle: ClockedVehicle, yard: { ruleSetId: string | null }): Promise<RuleSet | undefined> {
  if (vehicle.ruleSetVersionId) {
    const own = (await versionsById(db, [vehicle.ruleSetVersionId])).get(vehicle.ruleSetVersionId)
    if (own) return own
  }
  return yard.ruleSetId ? (await latestVersionOf(db, yard.ruleSetId))?.ruleSet : undefined
}

/**
 * Every step of one vehicle's legal clocks as of an instant, from its arrival and the events the office
 * recorded (clock_events), with `extra` events added as if recorded (a mailing about to be made).
 * The same counting as the board's (server/charges): the rule set's calendars, the yard's zone.
 */
export async function vehicleClocks(
  db: Executor,
  vehicle: ClockedVehicle,
  yard: { timeZone: string; ruleSetId: string | null },
  asOf = new Date(),
  extra: readonly ClockEvent[] = [],
): Promise<{ clocks: LegalClocks; ruleSet: RuleSet } | null> {
  const ruleSet = await ruleSetOf(db, vehicle, yard)
  if (!ruleSet) return null
  const recorded = (await clockEventsOf(db, [vehicle.id])).get(vehicle.id) ?? []
  const arrival = (ruleSet.arrivalEvents?.kinds ?? ['stored']).map((kind) => ({ kind, at: vehicle.arrivedAt.toISOString() }))
  const at = asOf.getTime() < vehicle.arrivedAt.getTime() ? vehicle.arrivedAt : asOf
  const clocks = legalClocks(
    { modelYear: vehicle.year, valueCents: vehicle.estimatedValueCents },
    [...arrival, ...recorded, ...extra],
    ruleSet,
    ruleSetCalendars(ruleSet),
    at.toISOString(),
    { timeZone: yard.timeZone },
  )
  return { clocks, ruleSet }
}
