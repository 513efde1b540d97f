import { randomUUID } from 'node:crypto'
import type { Database } from '@db/client'
import * as t from '@db/schema'
import { DAY, sampleVersion } from './board'
import { makeVehicle } from './factories'

/** A vehicle in Release billed by a sample rule set, towed in `days` days (and an hour) ago with a tow charge. */
export async function billedVehicle(db: Database, yardId: string, options: { sample?: string; days?: number; towCents?: number; state?: 'release' | 'storage' } = {}) {
  const ruleSetVersionId = await sampleVersion(db, options.sample ?? 'california-sample')
  const arrivedAt = new Date(Date.now() - (options.days ?? 3) * DAY - 3_600_000)
  const v = await makeVehicle(db, yardId, { state: options.state ?? 'release', ruleSetVersionId, arrivedAt })
  if (options.towCents !== 0) await db.insert(t.tows).values({ vehicleId: v.id, reason: 'private_property', arrivedAt, chargeCents: options.towCents ?? 18_500 })
  return v
}

export const key = () => randomUUID()
