import type { VehicleValueReply, vehicleValueSchema } from '@shared/schemas/vehicles'
import type { User } from '@shared/schemas/users'
import type { z } from 'zod'
import { conflict, unprocessable, said } from '../errors'
import { changeVehicle, type VehicleChanges } from './vehicle-change'

type ValueInput = z.output<typeof vehicleValueSchema>

/**
 * Records the vehicle's value and its source outside any inspection. The value picks the lien
 * clocks' branch, so the board's next deadline may change: one transaction with its history event,
 * made against the version the person saw (a stale one is a conflict).
 */
export async function recordValue(changes: VehicleChanges, actor: User, vehicleId: string, input: ValueInput): Promise<VehicleValueReply> {
  const { version } = await changeVehicle(
    changes,
    actor,
    vehicleId,
    async ({ vehicle, set, record }) => {
      if (vehicle.state === 'closed') throw conflict('This vehicle has left the yard; its value can no longer be changed.', said('closedValue'))
      if (vehicle.estimatedValueCents === input.valueCents && vehicle.estimatedValueSource === input.source) {
        throw unprocessable('Nothing was changed: the record already says that.', said('nothingChanged'))
      }
      set({ estimatedValueCents: input.valueCents, estimatedValueSource: input.source })
      record({
        kind: 'vehicle_value_recorded',
        before: { estimatedValueCents: vehicle.estimatedValueCents, estimatedValueSource: vehicle.estimatedValueSource },
        after: { estimatedValueCents: input.valueCents, estimatedValueSource: input.source },
      })
    },
    {
      expectedVersion: input.version,
      stale: ({ vehicle }) => conflict('Someone else changed this vehicle after you opened it. Reload to see their change, then record the value again.', said('vehicleStale', undefined, { version: vehicle.version })),
    },
  )
  return { version, valueCents: input.valueCents, source: input.source }
}
