import { eq } from 'drizzle-orm'
import { tows } from '@db/schema'
import type { correctVehicleSchema } from '@shared/schemas/tow-in'
import type { User } from '@shared/schemas/users'
import type { z } from 'zod'
import { conflict, unprocessable, said } from '../errors'
import { assertKnownClass, classesOfVersion } from './rules'
import { towColumns } from './tow-charge'
import { changeVehicle, type VehicleChanges, type VehicleColumns } from './vehicle-change'

type Correction = z.output<typeof correctVehicleSchema>
type Values = Record<string, unknown>

const TOW_FIELDS = [
  'pickupLat', 'pickupLng', 'pickupAddress', 'reason', 'reasonNote', 'requesterName', 'requesterAgency', 'requesterReference',
  'calledAt', 'hookedAt', 'arrivedAt', 'truck', 'driver', 'roadMiles', 'winchingUnits', 'dollies', 'afterHours', 'chargeCents',
] as const

const plain = (v: unknown) => (v instanceof Date ? v.toISOString() : v ?? null)

/** The fields whose values differ, as before/after maps of JSON values for the history. */
function differences(current: Values, next: Values, fields: readonly string[]) {
  const before: Values = {}
  const after: Values = {}
  for (const f of fields) {
    if (plain(current[f]) === plain(next[f])) continue
    before[f] = plain(current[f])
    after[f] = plain(next[f])
  }
  return { before, after }
}

/**
 * Corrects what was recorded at tow-in. The change names the version it was made against (a stale
 * one is a conflict) and a reason; the history keeps each changed field's old and new value.
 */
export async function correctVehicle(changes: VehicleChanges, actor: User, vehicleId: string, input: Correction) {
  const { version } = await changeVehicle(
    changes,
    actor,
    vehicleId,
    async ({ tx, vehicle, yard, set, record }) => {
      const before: Values = {}
      const after: Values = {}
      const vehicleChanges: Values = {}
      if (input.vehicle) {
        const d = differences(vehicle, input.vehicle, Object.keys(input.vehicle))
        if ('vehicleClass' in d.after) assertKnownClass(await classesOfVersion(tx, vehicle.ruleSetVersionId), input.vehicle.vehicleClass)
        Object.assign(before, d.before)
        Object.assign(after, d.after)
        for (const f of Object.keys(d.after)) vehicleChanges[f] = input.vehicle[f as keyof typeof input.vehicle]
      }
      if (input.conditionNotes !== undefined && plain(vehicle.conditionNotes) !== plain(input.conditionNotes)) {
        before.conditionNotes = vehicle.conditionNotes
        after.conditionNotes = input.conditionNotes
        vehicleChanges.conditionNotes = input.conditionNotes
      }
      if (input.tow) {
        const [current] = await tx.select().from(tows).where(eq(tows.vehicleId, vehicleId))
        const towRow = towColumns(input.tow, yard)
        const d = differences(current ?? {}, towRow, TOW_FIELDS)
        Object.assign(before, d.before)
        Object.assign(after, d.after)
        if (Object.keys(d.after).length > 0) {
          await tx.update(tows).set(towRow).where(eq(tows.vehicleId, vehicleId))
          // Storage runs from the gate: the vehicle's arrival follows the tow's (its stock number stays).
          if ('arrivedAt' in d.after) vehicleChanges.arrivedAt = towRow.arrivedAt
        }
      }
      if (Object.keys(after).length === 0) throw unprocessable('Nothing was changed: the record already says that.', said('nothingChanged'))
      set(vehicleChanges as VehicleColumns)
      record({ kind: 'corrected', reason: input.reason, before, after })
    },
    {
      expectedVersion: input.version,
      stale: ({ vehicle }) => conflict('Someone else changed this vehicle after you opened it. Reload to see their change, then correct it again.', said('vehicleStale', undefined, { version: vehicle.version })),
    },
  )
  return { version }
}
