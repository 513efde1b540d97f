import { and, eq, inArray, lt, ne } from 'drizzle-orm'
import type { Database } from '@db/client'
import { ruleSets, ruleSetVersions, vehicles } from '@db/schema'
import type { MoveToLatestVersion, OlderVersionVehicles } from '@shared/schemas/rule-set-editor'
import type { User } from '@shared/schemas/users'
import { conflict, fieldIssue, notFound, unprocessable, said } from '../errors'
import { latestVersionOf } from '../rule-sets/index'
import { changeVehicle, type VehicleChanges } from '../vehicles/index'
import { companyOf } from '../users/index'
import { yardOfUser } from '../yards/index'

/** The vehicles on the manager's yard still billed under an older version of one of the company's rule sets. */
export async function vehiclesOnOlderVersions(db: Database, actor: User, slug: string): Promise<OlderVersionVehicles> {
  const companyId = await companyOf(db, actor.id)
  const yard = await yardOfUser(db, actor.id)
  const [set] = await db.select({ id: ruleSets.id }).from(ruleSets).where(and(eq(ruleSets.slug, slug), eq(ruleSets.companyId, companyId)))
  if (!set || !yard) throw notFound('That rule set')
  const latest = (await latestVersionOf(db, set.id))!
  const older = db.select({ id: ruleSetVersions.id }).from(ruleSetVersions).where(and(eq(ruleSetVersions.ruleSetId, set.id), lt(ruleSetVersions.version, latest.version)))
  const rows = await db
    .select({ id: vehicles.id, stockNumber: vehicles.stockNumber, year: vehicles.year, make: vehicles.make, model: vehicles.model, version: ruleSetVersions.version, vehicleVersion: vehicles.version })
    .from(vehicles)
    .innerJoin(ruleSetVersions, eq(ruleSetVersions.id, vehicles.ruleSetVersionId))
    .where(and(eq(vehicles.yardId, yard.id), ne(vehicles.state, 'closed'), inArray(vehicles.ruleSetVersionId, older)))
    .orderBy(vehicles.stockNumber)
  return {
    latest: latest.version,
    vehicles: rows.map((r) => ({ id: r.id, stockNumber: r.stockNumber, description: [r.year, r.make, r.model].filter(Boolean).join(' '), version: r.version, vehicleVersion: r.vehicleVersion })),
  }
}

/**
 * Moves a vehicle to the current version of its yard's rule set (a manager, with a reason): its bill
 * and clocks count under the new values from then on, and the history says from which version to which.
 */
export async function moveToLatestVersion(changes: VehicleChanges, actor: User, vehicleId: string, input: MoveToLatestVersion & { reason: string }) {
  const { version } = await changeVehicle(
    changes,
    actor,
    vehicleId,
    async ({ tx, vehicle, yard, set, record }) => {
      if (vehicle.state === 'closed') throw conflict('This vehicle has left the yard: its bill is final.', said('closedBill'))
      if (!yard.ruleSetId) throw unprocessable('The yard has no rule set to move the vehicle to: choose one in Settings first.', said('noYardRuleSet'))
      const latest = (await latestVersionOf(tx, yard.ruleSetId))!
      if (vehicle.ruleSetVersionId === latest.versionId) throw unprocessable(`This vehicle is already on version ${latest.version} of ${latest.ruleSet.name}.`, said('vehicleOnVersion', { version: latest.version, name: latest.ruleSet.name }))
      if (!latest.ruleSet.vehicleClasses.some((c) => c.code === vehicle.vehicleClass)) {
        const words = { name: latest.ruleSet.name, vehicleClass: vehicle.vehicleClass }
        const message = `${words.name} has no class "${words.vehicleClass}": correct the vehicle's class first.`
        throw unprocessable(message, said('ruleSetLacksClass', words, { issues: [fieldIssue('version', 'ruleSetEditor.lacksClass', message, words)] }))
      }
      const [old] = vehicle.ruleSetVersionId
        ? await tx
            .select({ version: ruleSetVersions.version, name: ruleSets.name })
            .from(ruleSetVersions)
            .innerJoin(ruleSets, eq(ruleSets.id, ruleSetVersions.ruleSetId))
            .where(eq(ruleSetVersions.id, vehicle.ruleSetVersionId))
        : []
      set({ ruleSetVersionId: latest.versionId })
      record({
        kind: 'rule_set_changed',
        reason: input.reason,
        before: old ? { ruleSet: old.name, version: old.version } : { ruleSet: null },
        after: { ruleSet: latest.ruleSet.name, version: latest.version },
      })
    },
    {
      expectedVersion: input.version,
      stale: ({ vehicle }) => conflict('Someone else changed this vehicle after you opened it. Reload, then move it again.', said('vehicleStale', undefined, { version: vehicle.version })),
    },
  )
  return { version }
}
