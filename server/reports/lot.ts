import type { Database } from '@db/client'
import type { BoardCard } from '@shared/schemas/board'
import { boardYardOf, type BoardHub } from '../board/index'

export type Yard = Awaited<ReturnType<typeof boardYardOf>>

/**
 * The vehicles on the lot of the person's yard, as the board's own cards: the hub's snapshot of this
 * minute (bill, payments, credits, clocks), patched by every change as the board is. So the reports
 * say what the board says, and 2,000 vehicles are not billed again on every page.
 */
export async function lotOf(db: Database, hub: BoardHub, userId: string): Promise<{ yard: Yard; asOf: Date; cards: readonly BoardCard[] }> {
  const yard = await boardYardOf(db, userId)
  const { asOf, cards } = await hub.cards(yard)
  return { yard, asOf, cards }
}

export const vehicleName = (c: Pick<BoardCard, 'year' | 'make' | 'model'>) => [c.year, c.make, c.model].filter(Boolean).join(' ')
