import { pickupNeeds, type PickupEquipment, type PickupNeeds } from './pickup-needs'

export interface RollAbility {
  rolls: boolean | null
  steers: boolean | null
  brakes: boolean | null
  keys: 'yes' | 'no' | 'unknown'
}

/** The badge by code: its words are `inspection.badges.<code>` in shared/messages (`label` keeps the English). */
export type PickupBadgeCode = 'wheel-lift' | 'flatbed' | 'dollies' | 'flatbed-or-dollies' | 'wheel-lift-dollies' | 'flatbed-dollies'

export interface PickupBadge extends PickupNeeds {
  /** What the card says, in a driver's words: "Wheel-lift", "Flatbed or dollies". */
  label: string
  code: PickupBadgeCode
}

/**
 * The pickup badge once the technician has marked rolls, steers and brakes; null before. Keys not
 * known count as no keys: the driver brings dollies rather than be caught short at the gate.
 */
export function pickupBadge(v: RollAbility): PickupBadge | null {
  if (v.rolls === null || v.steers === null || v.brakes === null) return null
  const needs = pickupNeeds({ rolls: v.rolls, steers: v.steers, brakes: v.brakes, keys: v.keys === 'yes' })
  const code = badgeCode(needs.equipment, v.rolls)
  return { ...needs, label: LABELS[code], code }
}

const FIRST: Record<PickupEquipment, 'wheel-lift' | 'flatbed' | 'dollies'> = { 'wheel-lift': 'wheel-lift', flatbed: 'flatbed', 'dollies-or-skates': 'dollies' }

/** The English of each badge; the catalog's English (shared/messages/en/inspection.json) must read the same. */
export const PICKUP_BADGE_LABELS: Record<PickupBadgeCode, string> = {
  'wheel-lift': 'Wheel-lift',
  flatbed: 'Flatbed',
  dollies: 'Dollies',
  'flatbed-or-dollies': 'Flatbed or dollies',
  'wheel-lift-dollies': 'Wheel-lift + dollies',
  'flatbed-dollies': 'Flatbed + dollies',
}
const LABELS = PICKUP_BADGE_LABELS

function badgeCode(equipment: PickupEquipment[], rolls: boolean): PickupBadgeCode {
  const dollies = equipment.includes('dollies-or-skates')
  // Not rolling, either will do; rolling without keys, the dollies go under the wheels left down.
  if (!rolls) return 'flatbed-or-dollies'
  const first = FIRST[equipment[0]!]
  return dollies && first !== 'dollies' ? `${first}-dollies` : first
}
