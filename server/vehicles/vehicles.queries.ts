import { and, eq } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { vehicles, yards } from '@db/schema'
import { notFound } from '../errors'
import { yardOfStaff } from '../yards/index'

export type VehicleRow = typeof vehicles.$inferSelect
export type YardRow = typeof yards.$inferSelect

/**
 * A vehicle with its yard, if it is in one of the staff member's yards; anything else is "not found",
 * so an id from another yard or company reveals nothing. `lock` holds the row for the transaction's change.
 */
export async function vehicleForUser(db: Executor, userId: string, vehicleId: string, lock = false): Promise<{ vehicle: VehicleRow; yard: YardRow }> {
  const query = db
    .select({ vehicle: vehicles, yard: yards })
    .from(vehicles)
    .innerJoin(yards, eq(yards.id, vehicles.yardId))
    .where(and(eq(vehicles.id, vehicleId), yardOfStaff(userId)))
  const [row] = lock ? await query.for('update', { of: vehicles }) : await query
  if (!row) throw notFound('That vehicle')
  return row
}

/**
 * A vehicle with its yard by id alone, for a caller that has already proved its right to this one
 * vehicle some other way (an owner link). Staff code uses vehicleForUser.
 */
export async function vehicleById(db: Executor, vehicleId: string, lock = false): Promise<{ vehicle: VehicleRow; yard: YardRow }> {
  const query = db.select({ vehicle: vehicles, yard: yards }).from(vehicles).innerJoin(yards, eq(yards.id, vehicles.yardId)).where(eq(vehicles.id, vehicleId))
  const [row] = lock ? await query.for('update', { of: vehicles }) : await query
  if (!row) throw notFound('That vehicle')
  return row
}
