/**
 * Which yard spaces a vehicle fits, by its storage class (the rule set's class codes: `motorcycle`,
 * `standard`, `heavy`) and the space's size (`motorcycle` bay, `standard` car space, `wide` heavy-duty
 * space). A smaller vehicle fits a larger space, never the reverse. A class the rule set names that is
 * none of these is taken as a car (common trade practice: the standard space is the yard's default).
 */
export const SPACE_SIZES = ['motorcycle', 'standard', 'wide'] as const
export type SpaceSize = (typeof SPACE_SIZES)[number]

const RANK: Record<SpaceSize, number> = { motorcycle: 0, standard: 1, wide: 2 }

/** The smallest space a vehicle of this class fits in. */
export function spaceNeeded(vehicleClass: string): SpaceSize {
  if (vehicleClass === 'motorcycle') return 'motorcycle'
  if (vehicleClass === 'heavy') return 'wide'
  return 'standard'
}

/** Why not: `reason` in English, and `code` with `params` (sizes) for the reader's language (`vehicle.spaceFit.<code>`, sizes `vehicle.spaceSizes`). */
export type SpaceFit = { fits: true } | { fits: false; needs: SpaceSize; reason: string; code: 'tooSmall'; params: { needs: SpaceSize; size: SpaceSize } }

/** The English words of each size (shared/messages `vehicle.spaceSizes`; a test keeps them equal). */
export const SPACE_SIZE_WORDS: Record<SpaceSize, string> = { motorcycle: 'a motorcycle bay', standard: 'a car space', wide: 'a heavy-duty space' }

/** Whether a vehicle of this class fits a space of this size, and if not, why. */
export function spaceFit(vehicleClass: string, size: SpaceSize): SpaceFit {
  const needs = spaceNeeded(vehicleClass)
  if (RANK[size] >= RANK[needs]) return { fits: true }
  return { fits: false, needs, reason: `This vehicle needs ${SPACE_SIZE_WORDS[needs]} or larger; this is ${SPACE_SIZE_WORDS[size]}.`, code: 'tooSmall', params: { needs, size } }
}
