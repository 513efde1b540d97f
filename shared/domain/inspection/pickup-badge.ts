import { pickupNeeds, type PickupEquipment, type PickupNeeds } from './pickup-needs'

export interface RollAbility {
  rolls: boolean | null
  steers: boolean | null
  brakes: boolean | null
  keys: 'yes' | 'no' | 'unknown'
}

export interface PickupBadge extends PickupNeeds {
  /** What the card says, in a driver's words: "Wheel-lift", "Flatbed or dollies". */
  label: string
}

/**
 * The pickup badge once the technician has marked rolls, steers and brakes; null before. Keys not
 * known count as no keys: the driver brings dollies rather than be caught short at the gate.
 */
export function pickupBadge(v: RollAbility): PickupBadge | null {
  if (v.rolls === null || v.steers === null || v.brakes === null) return null
  const needs = pickupNeeds({ rolls: v.rolls, steers: v.steers, brakes: v.brakes, keys: v.keys === 'yes' })
  return { ...needs, label: badgeLabel(needs.equipment, v.rolls) }
}

const FIRST: Record<PickupEquipment, string> = { 'wheel-lift': 'Wheel-lift', flatbed: 'Flatbed', 'dollies-or-skates': 'Dollies' }

function badgeLabel(equipment: PickupEquipment[], rolls: boolean): string {
  const dollies = equipment.includes('dollies-or-skates')
  // Not rolling, either will do; rolling without keys, the dollies go under the wheels left down.
  if (!rolls) return 'Flatbed or dollies'
  return dollies ? `${FIRST[equipment[0]!]} + dollies` : FIRST[equipment[0]!]
}
