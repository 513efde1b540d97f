import { eq } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { tows } from '@db/schema'
import { storageBill, type StorageBill } from '@shared/domain/billing'
import type { RuleSet } from '@shared/schemas/rule-sets'
import { latestVersionOf, versionsById } from '../rule-sets/index'
import type { SummarizedVehicle, YardForCharges } from './charges.service'

export interface VehicleBill {
  bill: StorageBill
  towCents: number
  ruleSet: RuleSet
}

/**
 * One vehicle's storage bill with its lines, under the rule-set version it arrived under (the yard's
 * current one when it has none), as summarizeVehicles bills it: to `asOf`, or to the moment it left.
 * Undefined when no rule set bills it; the core's DomainError when the record cannot be billed.
 */
export async function vehicleBill(db: Executor, yard: YardForCharges, v: SummarizedVehicle, asOf: Date): Promise<VehicleBill | undefined> {
  const own = v.ruleSetVersionId ? (await versionsById(db, [v.ruleSetVersionId])).get(v.ruleSetVersionId) : undefined
  const ruleSet = own ?? (yard.ruleSetId ? (await latestVersionOf(db, yard.ruleSetId))?.ruleSet : undefined)
  if (!ruleSet || !ruleSet.vehicleClasses.some((c) => c.code === v.vehicleClass)) return undefined
  const towCents = v.towCents ?? (await db.select({ cents: tows.chargeCents }).from(tows).where(eq(tows.vehicleId, v.id)))[0]?.cents ?? 0
  const bill = storageBill(
    { arrivedAt: v.arrivedAt.toISOString(), releasedAt: v.closedAt?.toISOString() ?? null, vehicleClass: v.vehicleClass },
    ruleSet,
    asOf.toISOString(),
    { timeZone: yard.timeZone },
  )
  return { bill, towCents, ruleSet }
}
