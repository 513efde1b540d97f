/**
 * Torque for technicians (lug nuts, caliper bolts): makers publish N·m or ft·lbf. The factor is
 * exact from the definitions — 1 ft = 0.3048 m, 1 lbf = 0.45359237 kg × 9.80665 m/s² =
 * 4.4482216152605 N — so 1 ft·lbf = 1.3558179483314004 N·m (NIST SP 811 lists 1.355 818).
 */
// The exact 1.3558179483314004 has no binary double; this product is the nearest one (it prints
// as 1.3558179483314003), so the constant is written as its definition.
export const NEWTON_METRES_PER_FOOT_POUND_FORCE = 0.3048 * 4.4482216152605

export function footPoundsToNewtonMetres(ftLbf: number): number {
  return ftLbf * NEWTON_METRES_PER_FOOT_POUND_FORCE
}

export function newtonMetresToFootPounds(newtonMetres: number): number {
  return newtonMetres / NEWTON_METRES_PER_FOOT_POUND_FORCE
}
