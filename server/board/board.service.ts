import type { Database } from '../../db/client'
import { BOARD_COLUMNS, type BoardColumn } from '../../shared/domain/columns'
import type { Board, BoardCard } from '../../shared/schemas/board'
import { summarizeVehicles } from '../charges/index'
import { notFound } from '../errors'
import { yardOfUser } from '../yards/yards.queries'
import { activeHolds, activeVehicles } from './board.queries'

export async function getBoard(db: Database, userId: string, asOf = new Date()): Promise<Board> {
  const yard = await yardOfUser(db, userId)
  if (!yard) throw notFound('A yard for your company')
  const [rows, holdRows] = [await activeVehicles(db, yard.id), await activeHolds(db, yard.id)]
  const summaries = await summarizeVehicles(db, yard, rows, asOf)
  const holdsByVehicle = new Map<string, typeof holdRows>()
  for (const h of holdRows) holdsByVehicle.set(h.vehicleId, [...(holdsByVehicle.get(h.vehicleId) ?? []), h])
  const byColumn = new Map<BoardColumn, BoardCard[]>(BOARD_COLUMNS.map((c) => [c, []]))
  for (const r of rows) {
    byColumn.get(r.state as BoardColumn)?.push({
      id: r.id,
      stockNumber: r.stockNumber,
      year: r.year,
      make: r.make,
      model: r.model,
      colour: r.colour,
      plate: r.plate,
      plateState: r.plateState,
      state: r.state,
      version: r.version,
      arrivedAt: r.arrivedAt.toISOString(),
      space: r.spaceRow ? `${r.spaceRow}-${r.spaceNumber}` : null,
      rolls: r.rolls,
      holds: (holdsByVehicle.get(r.id) ?? []).map((h) => ({ kind: h.kind, until: h.until?.toISOString() ?? null })),
      photoCount: Number(r.photoCount),
      summary: summaries.get(r.id) ?? null,
    })
  }
  return {
    yard: { id: yard.id, name: yard.name, timeZone: yard.timeZone },
    asOf: asOf.toISOString(),
    columns: BOARD_COLUMNS.map((column) => ({ column, cards: byColumn.get(column)! })),
  }
}
