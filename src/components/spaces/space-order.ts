import type { Space } from '@shared/schemas/spaces'

export type SpaceChoice = { id: string; label: string; size: string; taken: string | null }
export type SpaceRow = { row: string; spaces: SpaceChoice[]; free: number }

/**
 * The spaces as a person picks one: rows with a free space first, each row's free spaces first in
 * number order (the yard numbers a row from its gate end), the taken ones after them, and full rows
 * last — not forty greyed-out spaces before the first free one. The vehicle being placed keeps its own.
 */
export function orderSpaces(spaces: readonly Space[], vehicleId?: string): SpaceRow[] {
  const byRow = new Map<string, SpaceChoice[]>()
  for (const s of spaces) {
    const taken = s.occupant && s.occupant.id !== vehicleId ? s.occupant.stockNumber : null
    byRow.set(s.row, [...(byRow.get(s.row) ?? []), { id: s.id, label: s.label, size: s.size, taken }])
  }
  const rows = [...byRow].map(([row, list]) => ({
    row,
    spaces: [...list.filter((s) => !s.taken), ...list.filter((s) => s.taken)],
    free: list.filter((s) => !s.taken).length,
  }))
  return [...rows.filter((r) => r.free > 0), ...rows.filter((r) => r.free === 0)]
}
