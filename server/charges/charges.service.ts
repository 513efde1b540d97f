import { inArray } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { tows } from '@db/schema'
import type { VehicleSummary } from '@shared/schemas/charges'
import type { RuleSet } from '@shared/schemas/rule-sets'
import { DomainError } from '@shared/domain/errors'
import { clockEventsOf } from '../clock-events/index'
import { ruleSetCalendars } from '../holidays/index'
import { latestVersionOf, versionsById } from '../rule-sets/index'
import { summarizeVehicle } from './vehicle-summary'

export interface SummarizedVehicle {
  id: string
  arrivedAt: Date
  closedAt: Date | null
  vehicleClass: string
  year: number | null
  estimatedValueCents: number | null
  ruleSetVersionId: string | null
  /** The tow charge, when the caller has read it already: the board reads 2,000 at once. */
  towCents?: number
}

export interface YardForCharges {
  timeZone: string
  ruleSetId: string | null
}

/**
 * Running bills and next legal dates for many vehicles at once: one query for their tow charges,
 * one per rule-set version not yet parsed. A vehicle is billed under the version it arrived under;
 * one without (or whose class the rule set does not know) gets no summary rather than a wrong one.
 * One whose record the core refuses to bill (an arrival decades ago) gets none either, and the
 * core's reason goes into `problems` when the caller passes it: one bad record never stops a board.
 */
export async function summarizeVehicles(
  db: Executor,
  yard: YardForCharges,
  vehicles: SummarizedVehicle[],
  asOf = new Date(),
  problems?: Map<string, string>,
): Promise<Map<string, VehicleSummary | null>> {
  const out = new Map<string, VehicleSummary | null>()
  if (vehicles.length === 0) return out
  const versions = await versionsById(db, vehicles.flatMap((v) => (v.ruleSetVersionId ? [v.ruleSetVersionId] : [])))
  // The yard's current rule set only bills vehicles that arrived without a version of their own.
  const needFallback = yard.ruleSetId !== null && vehicles.some((v) => !v.ruleSetVersionId || !versions.has(v.ruleSetVersionId))
  const fallback: RuleSet | undefined = needFallback ? (await latestVersionOf(db, yard.ruleSetId!))?.ruleSet : undefined
  const unread = vehicles.filter((v) => v.towCents === undefined).map((v) => v.id)
  const towRows = unread.length > 0 ? await db.select({ vehicleId: tows.vehicleId, cents: tows.chargeCents }).from(tows).where(inArray(tows.vehicleId, unread)) : []
  const towCents = new Map(towRows.map((t) => [t.vehicleId, t.cents]))
  const recorded = await clockEventsOf(db, vehicles.map((v) => v.id))
  for (const v of vehicles) {
    const ruleSet = (v.ruleSetVersionId && versions.get(v.ruleSetVersionId)) || fallback
    if (!ruleSet || !ruleSet.vehicleClasses.some((c) => c.code === v.vehicleClass)) {
      out.set(v.id, null)
      continue
    }
    const input = {
      arrivedAt: v.arrivedAt,
      closedAt: v.closedAt,
      vehicleClass: v.vehicleClass,
      modelYear: v.year,
      valueCents: v.estimatedValueCents,
      towCents: v.towCents ?? towCents.get(v.id) ?? 0,
      clockEvents: recorded.get(v.id) ?? [],
    }
    try {
      out.set(v.id, summarizeVehicle(input, ruleSet, ruleSetCalendars(ruleSet), asOf, yard.timeZone))
    } catch (err) {
      if (!(err instanceof DomainError)) throw err
      out.set(v.id, null)
      problems?.set(v.id, err.message)
    }
  }
  return out
}
