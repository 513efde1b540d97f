import { describe, expect, it } from 'vitest'
import type { Space } from '@shared/schemas/spaces'
import { orderSpaces } from '@/components/spaces/space-order'

const space = (row: string, n: number, occupant: string | null = null): Space =>
  ({ id: `${row}-${n}`, row, number: n, label: `${row}-${n}`, size: 'standard', occupant: occupant ? { id: `v-${occupant}`, stockNumber: occupant } : null })

// Issue 16 item 10: the list opened on about forty greyed-out taken spaces before the first free one.
describe('the yard-space list, as a person picks a space', () => {
  it('free spaces first in each row, in number order, then the taken ones; full rows last', () => {
    const rows = orderSpaces([space('A', 1, 'TC-1'), space('A', 2, 'TC-2'), space('B', 1, 'TC-3'), space('B', 2), space('B', 3, 'TC-4'), space('B', 4), space('C', 1)])
    expect(rows.map((r) => [r.row, r.free, r.spaces.map((s) => s.id)])).toEqual([
      ['B', 2, ['B-2', 'B-4', 'B-1', 'B-3']],
      ['C', 1, ['C-1']],
      ['A', 0, ['A-1', 'A-2']],
    ])
  })

  it("the vehicle being placed counts its own space as free", () => {
    const [row] = orderSpaces([space('A', 1, 'TC-9'), space('A', 2, 'TC-2')], 'v-TC-9')
    expect(row!.spaces.map((s) => [s.id, s.taken])).toEqual([
      ['A-1', null],
      ['A-2', 'TC-2'],
    ])
  })
})
