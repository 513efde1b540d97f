import { eq } from 'drizzle-orm'
import type { z } from 'zod'
import { inspections } from '@db/schema'
import { pickupBadge } from '@shared/domain/inspection'
import type { rollAbilitySchema } from '@shared/schemas/inspections'
import type { User } from '@shared/schemas/users'
import { badRequest, fieldIssue, unprocessable } from '../errors'
import type { VehicleChanges } from '../vehicles/index'
import { changeInspection } from './inspection-change'
import { NOT_ACKNOWLEDGED } from './inspections.service'

type Marks = z.output<typeof rollAbilitySchema>

/**
 * Rolls, steers, brakes, keys, and a wheel refitted to make it roll: what the pickup needs follows
 * from these (shared/domain/inspection/pickup-badge.ts). Someone may be under the vehicle to find out, so the
 * safety cautions must have been acknowledged on this inspection first.
 */
export async function markRollAbility(changes: VehicleChanges, actor: User, vehicleId: string, marks: Marks): Promise<void> {
  await changeInspection(changes, actor, vehicleId, 'any', async ({ tx, vehicle, inspection, set, record }) => {
    if (!inspection.safetyAcknowledgedAt) throw unprocessable(NOT_ACKNOWLEDGED, { issues: [fieldIssue('safety', 'inspections.readCautionsFirst', NOT_ACKNOWLEDGED)] })
    const wheelRefitted = marks.wheelRefitted ?? inspection.wheelRefitted
    const lugTorqueFtLbf = wheelRefitted ? (marks.lugTorqueFtLbf ?? inspection.lugTorqueFtLbf) : null
    if (wheelRefitted && lugTorqueFtLbf === null) {
      const message = "Enter the maker's lug-nut torque the refitted wheel was tightened to."
      throw badRequest(message, [fieldIssue('lugTorqueFtLbf', 'inspections.enterRefittedTorque', message)])
    }
    const before = { rolls: vehicle.rolls, steers: vehicle.steers, brakes: vehicle.brakes, keys: vehicle.keys, wheelRefitted: inspection.wheelRefitted, lugTorqueFtLbf: inspection.lugTorqueFtLbf }
    const after = {
      rolls: marks.rolls ?? vehicle.rolls,
      steers: marks.steers ?? vehicle.steers,
      brakes: marks.brakes ?? vehicle.brakes,
      keys: marks.keys === undefined ? vehicle.keys : marks.keys ? ('yes' as const) : ('no' as const),
      wheelRefitted,
      lugTorqueFtLbf,
    }
    const changed = (Object.keys(after) as (keyof typeof after)[]).filter((k) => after[k] !== before[k])
    if (changed.length === 0) return
    set({ rolls: after.rolls, steers: after.steers, brakes: after.brakes, keys: after.keys })
    await tx.update(inspections).set({ wheelRefitted, lugTorqueFtLbf }).where(eq(inspections.id, inspection.id))
    record({
      kind: 'roll_ability_marked',
      before: Object.fromEntries(changed.map((k) => [k, before[k]])),
      after: { inspectionId: inspection.id, ...Object.fromEntries(changed.map((k) => [k, after[k]])), pickupNeeds: pickupBadge(after)?.label ?? null },
    })
  })
}
