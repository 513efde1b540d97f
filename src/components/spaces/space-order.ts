import { spaceFit, type SpaceSize } from '@shared/domain/vehicle'
import type { Space } from '@shared/schemas/spaces'

/** `tooSmall`: the vehicle does not fit; the space needs to be this size at least. */
export type SpaceChoice = { id: string; label: string; size: string; taken: string | null; tooSmall: SpaceSize | null }
export type SpaceRow = { row: string; spaces: SpaceChoice[]; free: number }

/**
 * The spaces as a person picks one: rows with a free space the vehicle fits first, each row's free
 * fitting spaces first in number order (the yard numbers a row from its gate end), then the ones the
 * vehicle does not fit and the taken ones, and full rows last — not forty greyed-out spaces before the
 * first free one. The vehicle being placed keeps its own space; retired spaces are left out. Without a
 * vehicle class every space fits.
 */
export function orderSpaces(spaces: readonly Space[], vehicleId?: string, vehicleClass?: string): SpaceRow[] {
  const byRow = new Map<string, SpaceChoice[]>()
  for (const s of spaces) {
    const own = Boolean(vehicleId) && s.occupant?.id === vehicleId
    if (s.retired && !own) continue
    const taken = s.occupant && !own ? s.occupant.stockNumber : null
    const fit = vehicleClass ? spaceFit(vehicleClass, s.size) : { fits: true as const }
    byRow.set(s.row, [...(byRow.get(s.row) ?? []), { id: s.id, label: s.label, size: s.size, taken, tooSmall: fit.fits ? null : fit.needs }])
  }
  const usable = (s: SpaceChoice) => !s.taken && !s.tooSmall
  const rows = [...byRow].map(([row, list]) => ({
    row,
    spaces: [...list.filter(usable), ...list.filter((s) => !usable(s) && !s.taken), ...list.filter((s) => s.taken)],
    free: list.filter(usable).length,
  }))
  return [...rows.filter((r) => r.free > 0), ...rows.filter((r) => r.free === 0)]
}
