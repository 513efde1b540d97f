import { sql } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { stockCounters } from '@db/schema'
import { formatStockNumber, yearInZone } from '@shared/domain/vehicle'

/**
 * The next stock number of a yard for the arrival's year, in the transaction that inserts the vehicle:
 * the upsert locks the counter row, so two tow-ins never share a number, and a rolled-back tow-in
 * gives its number back before anyone saw it. A vehicle is never deleted, so a number is never reused.
 */
export async function nextStockNumber(tx: Executor, yard: { id: string; code: string; timeZone: string }, arrivedAt: Date) {
  const year = yearInZone(arrivedAt, yard.timeZone)
  const [row] = await tx
    .insert(stockCounters)
    .values({ yardId: yard.id, year, last: 1 })
    .onConflictDoUpdate({ target: [stockCounters.yardId, stockCounters.year], set: { last: sql`${stockCounters.last} + 1` } })
    .returning({ last: stockCounters.last })
  return formatStockNumber(yard.code, year, row!.last)
}
