export type PickupCondition = { rolls: boolean; steers: boolean; brakes: boolean; keys: boolean }

export type PickupEquipment = 'wheel-lift' | 'flatbed' | 'dollies-or-skates'

/** Why, by code: the words are `inspection.pickupReasons.<code>` in shared/messages (`reasons` keeps the English). */
export type PickupReason = 'no-roll' | 'no-steer' | 'no-brake' | 'no-keys' | 'wheel-lift-will-do'

export type PickupNeeds = {
  /** What the pickup truck must bring; the first item is the usual choice. */
  equipment: PickupEquipment[]
  reasons: string[]
  reasonCodes: PickupReason[]
  /** True when a technician should look first: the vehicle may be made to roll for the pickup. */
  technicianFirst: boolean
}

/**
 * What a pickup needs, from the technician's marks. These are common trade practice, not a
 * published rule: a vehicle that rolls and steers goes on a wheel-lift; one that does not
 * roll (a broken drive shaft, a separated ball joint) needs a flatbed with its winch, or
 * dollies or skates under the wheels that will not turn — unless a technician refits the
 * joint and wheel so that it rolls.
 */
export function pickupNeeds(condition: PickupCondition): PickupNeeds {
  const reasons: string[] = []
  const reasonCodes: PickupReason[] = []
  const movesOnItsWheels = condition.rolls && condition.steers && condition.brakes
  const equipment: PickupEquipment[] = [movesOnItsWheels ? 'wheel-lift' : 'flatbed']
  if (!condition.rolls || !condition.keys) equipment.push('dollies-or-skates')
  if (!condition.rolls) {
    reasonCodes.push('no-roll')
    reasons.push(
      'It does not roll: winch it onto a flatbed, or put dollies or skates under the wheels that will not turn. ' +
        'A technician can often refit the joint and wheel so it rolls for the pickup.',
    )
  }
  if (!condition.steers) {
    reasonCodes.push('no-steer')
    reasons.push('It does not steer: carry it on a flatbed, or lift the steering wheels off the ground.')
  }
  if (!condition.brakes) {
    reasonCodes.push('no-brake')
    reasons.push('It does not brake: nothing holds it while it is loaded — keep it on the winch line and carry it on a flatbed.')
  }
  if (!condition.keys) {
    reasonCodes.push('no-keys')
    reasons.push('No keys: the steering may be locked and the transmission in park — put dollies under the wheels left on the ground.')
  }
  if (reasons.length === 0) {
    reasonCodes.push('wheel-lift-will-do')
    reasons.push('It rolls, steers and brakes, and the keys are here: a wheel-lift tow will do.')
  }
  return { equipment, reasons, reasonCodes, technicianFirst: !condition.rolls }
}
