import type { Database } from '@db/client'
import type { BoardCard } from '@shared/schemas/board'
import { activeCards, boardYardOf } from '../board/index'

export type Yard = Awaited<ReturnType<typeof boardYardOf>>

/** The vehicles on the lot of the person's yard, as the board's cards (bill, payments, clocks). */
export async function lotOf(db: Database, userId: string, asOf: Date): Promise<{ yard: Yard; cards: BoardCard[] }> {
  const yard = await boardYardOf(db, userId)
  return { yard, cards: await activeCards(db, yard, asOf) }
}

export const vehicleName = (c: Pick<BoardCard, 'year' | 'make' | 'model'>) => [c.year, c.make, c.model].filter(Boolean).join(' ')
