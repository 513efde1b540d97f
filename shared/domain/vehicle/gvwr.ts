import { ODOMETER_EXEMPT_ABOVE_GVWR_LB } from './odometer'

/** A gross vehicle weight rating known only as a class band (as vPIC gives it), in pounds. */
export type GvwrBand = { class: string; fromLb: number; toLb: number | null }

/**
 * The line between a light and a heavy vehicle: 49 CFR 565.15(b) draws it at 10,000 lb GVWR for
 * reading the model year, and light-duty towing and storage rates commonly cover GVWR Classes 1–2,
 * up to the same 10,000 lb (common trade practice).
 */
export const LIGHT_VEHICLE_MAX_GVWR_LB = 10_000

const pounds = (lb: number) => lb.toLocaleString('en-US')

/** "Class 2F, 7,001–8,000 lb"; "Class 8, 33,001 lb and above"; "Class 1, 6,000 lb or less". */
export function describeGvwr(g: GvwrBand): string {
  if (g.toLb === null) return `Class ${g.class}, ${pounds(g.fromLb)} lb and above`
  if (g.fromLb === 0) return `Class ${g.class}, ${pounds(g.toLb)} lb or less`
  return `Class ${g.class}, ${pounds(g.fromLb)}–${pounds(g.toLb)} lb`
}

/** Over 16,000 lb GVWR: no odometer disclosure on a transfer (49 CFR 580.17(a)(1)); null when the band straddles the line. */
export function odometerExemptByGvwr(g: GvwrBand): boolean | null {
  if (g.fromLb > ODOMETER_EXEMPT_ABOVE_GVWR_LB) return true
  if (g.toLb !== null && g.toLb <= ODOMETER_EXEMPT_ABOVE_GVWR_LB) return false
  return null
}

export type ClassSuggestion = { code: string; reason: string }

/**
 * The billing class a decoded vehicle most likely belongs in, among the yard's rule-set classes:
 * a motorcycle by its body class, otherwise heavy or standard by the GVWR band. Null when the
 * band straddles the line, nothing is known, or the rule set has no such class — the dispatcher
 * decides, and may always choose otherwise.
 */
export function suggestVehicleClass(
  decoded: { bodyClass: string | null; vehicleType: string | null; gvwr: GvwrBand | null },
  offered: readonly string[],
): ClassSuggestion | null {
  const pick = (code: string, reason: string) => (offered.includes(code) ? { code, reason } : null)
  if (decoded.vehicleType === 'Motorcycle' || decoded.bodyClass?.startsWith('Motorcycle')) {
    return pick('motorcycle', 'vPIC lists it as a motorcycle')
  }
  const g = decoded.gvwr
  if (!g) return null
  if (g.fromLb > LIGHT_VEHICLE_MAX_GVWR_LB) return pick('heavy', `GVWR ${describeGvwr(g)}: over 10,000 lb`)
  if (g.toLb !== null && g.toLb <= LIGHT_VEHICLE_MAX_GVWR_LB) return pick('standard', `GVWR ${describeGvwr(g)}: 10,000 lb or less`)
  return null
}
