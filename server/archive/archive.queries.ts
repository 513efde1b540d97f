import { and, count, desc, eq, ilike, or, sql } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { vehicles } from '@db/schema'
import type { Disposition } from '@shared/domain/lifecycle'
import { identityColumns } from '../board/index'

export interface ArchiveFilter {
  yardId: string
  q: string | null
  disposition: Disposition | null
}

// Any part of the stock number, plate, VIN, owner, or "make model" as people say it.
function matches(q: string) {
  const like = `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`
  return or(
    ilike(vehicles.stockNumber, like),
    ilike(vehicles.plate, like),
    ilike(vehicles.vin, like),
    ilike(vehicles.ownerName, like),
    ilike(sql`concat_ws(' ', ${vehicles.year}, ${vehicles.make}, ${vehicles.model}, ${vehicles.colour})`, like),
  )
}

const where = (f: ArchiveFilter) =>
  and(eq(vehicles.yardId, f.yardId), eq(vehicles.state, 'closed'), f.disposition ? eq(vehicles.disposition, f.disposition) : undefined, f.q ? matches(f.q) : undefined)

/** Closed vehicles, most recently closed first. */
export function closedVehicles(db: Executor, f: ArchiveFilter, page: { limit: number; offset: number }) {
  return db
    .select({
      ...identityColumns,
      vin: vehicles.vin,
      ownerName: vehicles.ownerName,
      disposition: vehicles.disposition,
      arrivedAt: vehicles.arrivedAt,
      closedAt: vehicles.closedAt,
    })
    .from(vehicles)
    .where(where(f))
    .orderBy(desc(vehicles.closedAt), desc(vehicles.stockNumber))
    .limit(page.limit)
    .offset(page.offset)
}

export async function countClosed(db: Executor, f: ArchiveFilter): Promise<number> {
  const [row] = await db.select({ n: count() }).from(vehicles).where(where(f))
  return row?.n ?? 0
}
