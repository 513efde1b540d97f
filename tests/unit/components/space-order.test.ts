import { describe, expect, it } from 'vitest'
import type { Space } from '@shared/schemas/spaces'
import { orderSpaces } from '@/components/spaces/space-order'

const space = (row: string, n: number, occupant: string | null = null, size: Space['size'] = 'standard', retired = false): Space =>
  ({ id: `${row}-${n}`, row, number: n, label: `${row}-${n}`, size, retired, occupant: occupant ? { id: `v-${occupant}`, stockNumber: occupant } : null })

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

  it('issue 12: a car sees the spaces it fits first; a motorcycle bay comes after, saying what the car needs; retired spaces are left out', () => {
    const spaces = [space('M', 1, null, 'motorcycle'), space('M', 2, null, 'motorcycle'), space('A', 1, null, 'motorcycle'), space('A', 2), space('A', 3, null, 'standard', true), space('H', 1, null, 'wide')]
    const rows = orderSpaces(spaces, undefined, 'standard')
    expect(rows.map((r) => [r.row, r.free, r.spaces.map((s) => [s.id, s.tooSmall])])).toEqual([
      ['A', 1, [['A-2', null], ['A-1', 'standard']]],
      ['H', 1, [['H-1', null]]],
      ['M', 0, [['M-1', 'standard'], ['M-2', 'standard']]],
    ])
    expect(orderSpaces(spaces, undefined, 'heavy').map((r) => [r.row, r.free])).toEqual([['H', 1], ['M', 0], ['A', 0]])
  })

  it('a vehicle in a retired space still sees it as its own', () => {
    const [row] = orderSpaces([space('A', 3, 'TC-1', 'standard', true)], 'v-TC-1', 'standard')
    expect(row!.spaces.map((s) => s.id)).toEqual(['A-3'])
  })
})
