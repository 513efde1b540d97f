import { eq } from 'drizzle-orm'
import { inspections } from '@db/schema'
import { CAUTIONS, estimateTotals, pickupBadge, repairOrSalvage } from '@shared/domain/inspection'
import type { User } from '@shared/schemas/users'
import { conflict, fieldIssue, unprocessable, type Issue, said } from '../errors'
import { versionsById } from '../rule-sets/index'
import { changeVehicle, type VehicleChanges } from '../vehicles/index'
import { changeInspection } from './inspection-change'
import { itemsOf, latestInspection, linesOf } from './inspections.queries'

/**
 * Starts an inspection on a vehicle in Teardown (the board's move API puts it there). Starting
 * again while one is under way answers the one under way; a re-inspection clears the vehicle's
 * "inspected" mark, so it cannot go on to Owner decision until this one is finished too.
 */
export async function startInspection(changes: VehicleChanges, actor: User, vehicleId: string): Promise<{ created: boolean }> {
  const { changed } = await changeVehicle(changes, actor, vehicleId, async ({ tx, vehicle, now, set, record }) => {
    if (vehicle.state !== 'teardown') {
      throw conflict(`Move ${vehicle.stockNumber} to Teardown first: the inspection is done there.`, said('teardownFirst', { stock: vehicle.stockNumber }))
    }
    const current = await latestInspection(tx, vehicleId)
    if (current && !current.finishedAt) return
    const [row] = await tx.insert(inspections).values({ vehicleId, startedById: actor.id, startedAt: now }).returning({ id: inspections.id })
    const cleared = vehicle.inspectedAt !== null
    if (cleared) set({ inspectedAt: null, inspectedById: null })
    record({
      kind: 'inspection_started',
      before: cleared ? { inspectedAt: vehicle.inspectedAt!.toISOString(), previousInspectionId: current?.id ?? null } : null,
      after: { inspectionId: row!.id, reinspection: current !== undefined },
    })
  })
  return { created: changed }
}

/** Once per inspection: the technician has read the cautions. A second tap records nothing. */
export async function acknowledgeSafety(changes: VehicleChanges, actor: User, vehicleId: string): Promise<void> {
  await changeInspection(changes, actor, vehicleId, 'any', async ({ tx, inspection, now: at, record }) => {
    if (inspection.safetyAcknowledgedAt) return
    await tx.update(inspections).set({ safetyAcknowledgedAt: at, safetyAcknowledgedById: actor.id }).where(eq(inspections.id, inspection.id))
    record({ kind: 'safety_acknowledged', after: { inspectionId: inspection.id, cautions: CAUTIONS.map((c) => c.text) }, at })
  })
}

export const NOT_ACKNOWLEDGED = 'Read the safety cautions and tap “I have read them” first.'

/**
 * Finishes the inspection: who and when, on the inspection and on the vehicle (the board's
 * "inspection finished" guard reads the vehicle). Refused, with every reason, until the safety
 * cautions are acknowledged, something has been checked, and rolls, steers and brakes are marked.
 */
export async function finishInspection(changes: VehicleChanges, actor: User, vehicleId: string): Promise<void> {
  await changeInspection(changes, actor, vehicleId, 'open', async ({ tx, vehicle, inspection, now: at, set, record }) => {
    const items = await itemsOf(tx, inspection.id)
    const issues: Issue[] = []
    if (!inspection.safetyAcknowledgedAt) issues.push(fieldIssue('safety', 'inspections.readCautionsFirst', NOT_ACKNOWLEDGED))
    if (!items.some((i) => i.status !== 'not_checked')) {
      issues.push(fieldIssue('items', 'inspections.noFindingsYet', 'No findings yet: mark at least one item OK, worn or broken.'))
    }
    for (const [field, question] of [['rolls', 'Does it roll?'], ['steers', 'Does it steer?'], ['brakes', 'Does it brake?']] as const) {
      if (vehicle[field] === null) issues.push(fieldIssue(field, 'inspections.answerForPickup', `Answer “${question}” for the pickup.`, { what: field }))
    }
    if (issues.length > 0) {
      throw unprocessable(`The inspection cannot be finished yet. ${issues.map((i) => i.message).join(' ')}`, { issues })
    }
    await tx.update(inspections).set({ finishedAt: at, finishedById: actor.id }).where(eq(inspections.id, inspection.id))
    set({ inspectedAt: at, inspectedById: actor.id })
    const totals = estimateTotals(await linesOf(tx, inspection.id))
    const count = (status: string) => items.filter((i) => i.status === status).map((i) => i.itemCode)
    const ruleSet = vehicle.ruleSetVersionId ? (await versionsById(tx, [vehicle.ruleSetVersionId])).get(vehicle.ruleSetVersionId) : undefined
    const verdict =
      ruleSet && inspection.actualCashValueCents !== null
        ? repairOrSalvage(totals.totalCents, inspection.actualCashValueCents, inspection.salvageValueCents ?? 0, ruleSet).recommendation
        : null
    record({
      kind: 'inspection_finished',
      after: {
        inspectionId: inspection.id,
        broken: count('broken'),
        worn: count('worn'),
        estimateCents: totals.totalCents,
        recommendation: verdict,
        pickupNeeds: pickupBadge(vehicle)?.label ?? null,
      },
      at,
    })
  })
}
