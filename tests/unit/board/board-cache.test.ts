import { describe, expect, it } from 'vitest'
import type { Board, BoardCard } from '@shared/schemas/board'
import { findCard, withCard, withoutCard } from '../../../src/composables/board-cache'

const card = (id: string, state: BoardCard['state'], arrivedAt: string, version = 1) =>
  ({ id, stockNumber: `TC-${id}`, state, arrivedAt, version }) as BoardCard
const board = (cards: BoardCard[]): Board => ({
  eventId: 'e.0',
  yard: { id: 'y', name: 'Yard', timeZone: 'UTC' },
  asOf: '2026-12-01T00:00:00Z',
  columns: (['arrival', 'teardown', 'decision', 'storage', 'release'] as const).map((column) => ({ column, cards: cards.filter((c) => c.state === column) })),
})
const ids = (b: Board, column: string) => b.columns.find((c) => c.column === column)!.cards.map((c) => c.id)

describe('board cache', () => {
  const a = card('a', 'arrival', '2026-11-01T08:00:00Z')
  const b = card('b', 'teardown', '2026-11-02T08:00:00Z')
  const c = card('c', 'teardown', '2026-11-04T08:00:00Z')

  it('withCard_movedCard_leavesItsOldColumnAndLandsInArrivalOrder', () => {
    const next = withCard(board([a, b, c]), card('x', 'teardown', '2026-11-03T08:00:00Z'))
    expect(ids(next, 'teardown')).toEqual(['b', 'x', 'c'])
    const moved = withCard(next, { ...a, state: 'teardown', version: 2 })
    expect(ids(moved, 'arrival')).toEqual([])
    expect(ids(moved, 'teardown')).toEqual(['a', 'b', 'x', 'c'])
  })

  it('withCard_columnsItDoesNotTouch_keepTheirIdentity', () => {
    const before = board([a, b, c])
    const after = withCard(before, { ...b, version: 2 })
    expect(after.columns[0]).toBe(before.columns[0])
    expect(after.columns[1]).not.toBe(before.columns[1])
  })

  it('withoutCard_closedCard_leavesTheBoard', () => {
    const next = withoutCard(board([a, b, c]), 'b')
    expect(ids(next, 'teardown')).toEqual(['c'])
    expect(findCard(next, 'b')).toBeUndefined()
    expect(findCard(next, 'c')?.id).toBe('c')
  })
})
