import { and, eq, ne, or, sql, type SQL } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { vehicles, yards } from '@db/schema'
import { conflict, said } from '../errors'
import type { YardRow } from './vehicles.queries'

export interface Lookalike {
  id: string
  stockNumber: string
  /** What it shares with the vehicle being logged. */
  matches: ('vin' | 'plate')[]
}

const squeeze = (column: SQL | typeof vehicles.plate) => sql`upper(replace(${column}, ' ', ''))`

/**
 * Vehicles of the same company still in a yard (not closed) with the same VIN, or the same plate from
 * the same state: most likely the same vehicle logged twice, and billed twice.
 */
export async function activeLookalikes(db: Executor, yard: YardRow, v: { vin: string | null; plate: string | null; plateState: string | null }): Promise<Lookalike[]> {
  const same: SQL[] = []
  if (v.vin) same.push(eq(vehicles.vin, v.vin))
  if (v.plate) same.push(and(eq(squeeze(vehicles.plate), squeeze(sql`${v.plate}`)), sql`coalesce(${vehicles.plateState}, '') = ${v.plateState ?? ''}`)!)
  if (same.length === 0) return []
  const rows = await db
    .select({ id: vehicles.id, stockNumber: vehicles.stockNumber, vin: vehicles.vin, plate: vehicles.plate })
    .from(vehicles)
    .innerJoin(yards, eq(yards.id, vehicles.yardId))
    .where(and(eq(yards.companyId, yard.companyId), ne(vehicles.state, 'closed'), or(...same)))
    .orderBy(vehicles.stockNumber)
  const plainPlate = (p: string | null) => p?.replaceAll(' ', '').toUpperCase() ?? null
  return rows.map((r) => ({
    id: r.id,
    stockNumber: r.stockNumber,
    matches: [...(v.vin && r.vin === v.vin ? (['vin'] as const) : []), ...(v.plate && plainPlate(r.plate) === plainPlate(v.plate) ? (['plate'] as const) : [])],
  }))
}

/** A tow-in that looks like a vehicle already on the lot goes ahead only with the dispatcher's reason. */
export function assertNotLoggedTwice(found: Lookalike[], reason: string | null) {
  if (found.length === 0 || reason) return
  const first = found[0]!
  const what = first.matches.includes('vin') ? 'the same VIN' : 'the same plate'
  throw conflict(
    `This vehicle may already be on the lot: ${first.stockNumber} has ${what}${found.length > 1 ? ` (and ${found.length - 1} more)` : ''}. ` +
      'Open it instead, or say why this is a separate tow-in.',
    said('maybeTwice', { stock: first.stockNumber }, { duplicates: found }),
  )
}
