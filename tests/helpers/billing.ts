import { randomUUID } from 'node:crypto'
import { eq } from 'drizzle-orm'
import type { Database } from '@db/client'
import * as t from '@db/schema'
import { localDay, startOfLocalDay } from '@shared/domain/time'
import { DAY, sampleVersion } from './board'
import { makeVehicle } from './factories'

/**
 * A vehicle in Release billed by a sample rule set, towed in `days` days (and up to an hour) ago with a tow
 * charge. The extra hour never reaches back past the yard's midnight: a stay is then `days + 1` calendar days
 * and `days + 1` started 24-hour periods alike, at any time of day the test runs (a run just after midnight
 * once counted a day more than the test said).
 */
export async function billedVehicle(db: Database, yardId: string, options: { sample?: string; days?: number; towCents?: number; state?: 'release' | 'storage' } = {}) {
  const ruleSetVersionId = await sampleVersion(db, options.sample ?? 'california-sample')
  const [yard] = await db.select({ timeZone: t.yards.timeZone }).from(t.yards).where(eq(t.yards.id, yardId))
  const now = Date.now()
  const sinceMidnight = now - startOfLocalDay(yard!.timeZone, localDay(yard!.timeZone, now))
  const arrivedAt = new Date(now - (options.days ?? 3) * DAY - Math.min(3_600_000, sinceMidnight / 2))
  const v = await makeVehicle(db, yardId, { state: options.state ?? 'release', ruleSetVersionId, arrivedAt })
  if (options.towCents !== 0) await db.insert(t.tows).values({ vehicleId: v.id, reason: 'private_property', arrivedAt, chargeCents: options.towCents ?? 18_500 })
  return v
}

export const key = () => randomUUID()
