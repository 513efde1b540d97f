import { footPoundsToNewtonMetres, NEWTON_METRES_PER_FOOT_POUND_FORCE } from './units'

export interface Caution {
  code: string
  text: string
  /** Where the caution comes from, with how sure we are (shared/REFERENCES.md's markers). */
  source: string
}

/**
 * The cautions shown wherever Holdfast tells someone to work on a vehicle: the teardown screen
 * and the "does it roll?" step, where a wheel may be refitted for the pickup.
 */
export const CAUTIONS: readonly Caution[] = [
  {
    code: 'stands',
    text: 'Hold a raised vehicle up on rated jack stands, on firm, level ground.',
    source: 'ASME PASE-2019, portable automotive service equipment [V]',
  },
  {
    code: 'never-jack-only',
    text: 'Never get under a vehicle that is held up only by a jack.',
    source: 'WAC 296-307-22509(3): "Working under a load raised only with jacks is prohibited." [V]; OSHA 29 CFR 1910.244(a)(2): block or crib a raised load at once [from memory]',
  },
  { code: 'chocks', text: 'Chock the wheels that stay on the ground.', source: 'Usual shop practice [S]' },
  { code: 'parking-brake', text: 'Set the parking brake.', source: 'Usual shop practice [S]' },
  {
    code: 'lug-nuts',
    text:
      "After refitting a wheel, torque the lug nuts to the vehicle maker's figure in a star pattern, in two passes, " +
      'with the vehicle lowered for the final pass. Check them again after driving (commonly after 50–100 miles).',
    source: 'Common practice [S]; the torque figure is the maker’s',
  },
]

export const DEFER_TO_MAKER =
  "These are the usual cautions, not a repair procedure: follow the vehicle maker's procedures and your shop's licensed practice."

/** "80 ft·lbf = 108.5 N·m": both units, from the exact factor, to a tenth. */
export function torqueInBothUnits(ftLbf: number): string {
  const newtonMetres = footPoundsToNewtonMetres(ftLbf)
  return `${ftLbf} ft·lbf = ${newtonMetres.toFixed(1)} N·m`
}

export const TORQUE_FACTOR_NOTE = `1 ft·lbf = ${NEWTON_METRES_PER_FOOT_POUND_FORCE} N·m exactly (0.3048 m × 4.4482216152605 N)`
