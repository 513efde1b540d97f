import { and, desc, eq, or, sql, type SQLWrapper } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { vehicles } from '@db/schema'
import type { SearchHit } from '@shared/schemas/search'
import { yardOfUser } from '../yards/index'

const LIMIT = 20
/** A VIN fragment shorter than this matches too many vehicles to be a search. */
const MIN_VIN = 6

const likeEscaped = (s: string) => s.replace(/[\\%_]/g, (c) => `\\${c}`)
/** Plates and stock numbers compared without spaces and dashes, as people read them out. */
const squeezed = (s: string) => s.toUpperCase().replace(/[\s-]+/g, '')
/** "2003 kestra lantern gold": what a person says when they describe the car rather than its numbers. */
const described = sql`lower(concat_ws(' ', ${vehicles.year}, ${vehicles.make}, ${vehicles.model}, ${vehicles.colour}))`
const squeezedColumn = (col: SQLWrapper) => sql`regexp_replace(upper(coalesce(${col}, '')), '[[:space:]-]+', '', 'g')`

/** Vehicles of the yard chosen in the top bar by stock number, plate, VIN (6+ characters), year/make/model/colour or owner name. */
export async function searchVehicles(db: Executor, userId: string, q: string): Promise<SearchHit[]> {
  const key = squeezed(q)
  const pattern = `%${likeEscaped(key)}%`
  const words = `%${likeEscaped(q.trim().toLowerCase())}%`
  const matches = [
    sql`${squeezedColumn(vehicles.stockNumber)} like ${pattern}`,
    sql`${squeezedColumn(vehicles.plate)} like ${pattern}`,
    sql`lower(${vehicles.ownerName}) like ${words}`,
    sql`${described} like ${words}`,
  ]
  if (key.length >= MIN_VIN) matches.push(sql`${vehicles.vin} like ${pattern}`)
  const yard = await yardOfUser(db, userId)
  if (!yard) return []
  const rows = await db
    .select({
      id: vehicles.id,
      stockNumber: vehicles.stockNumber,
      year: vehicles.year,
      make: vehicles.make,
      model: vehicles.model,
      colour: vehicles.colour,
      plate: vehicles.plate,
      vin: vehicles.vin,
      ownerName: vehicles.ownerName,
      state: vehicles.state,
    })
    .from(vehicles)
    .where(and(eq(vehicles.yardId, yard.id), or(...matches)))
    // Vehicles still on the lot first, newest arrivals first.
    .orderBy(sql`${vehicles.state} = 'closed'`, desc(vehicles.arrivedAt))
    .limit(LIMIT)
  return rows.map((r) => ({
    id: r.id,
    stockNumber: r.stockNumber,
    title: [r.year, r.make, r.model, r.colour].filter(Boolean).join(' ') || 'Vehicle',
    plate: r.plate,
    vin: r.vin,
    ownerName: r.ownerName,
    state: r.state,
    matched: squeezed(r.stockNumber).includes(key)
      ? 'stock number'
      : squeezed(r.plate ?? '').includes(key)
        ? 'plate'
        : key.length >= MIN_VIN && (r.vin ?? '').includes(key)
          ? 'VIN'
          : [r.year, r.make, r.model, r.colour].filter(Boolean).join(' ').toLowerCase().includes(q.trim().toLowerCase())
            ? 'vehicle'
            : 'owner',
  }))
}
