/**
 * Model year from VIN position 10 (49 CFR 565.15(a)): a 30-code cycle that repeats, so one
 * code names two years 30 apart — 1980–2009 and 2010–2039. Position 7 tells them apart only
 * for passenger cars, MPVs and trucks of 10,000 lb GVWR or less (565.15(b), 73 FR 23367):
 * numeric → the earlier cycle, a letter → the later one. U, Z and 0 are never year codes.
 */
const YEAR_CODES = 'ABCDEFGHJKLMNPRSTVWXY123456789'

/** 'light': passenger car, MPV or truck ≤ 10,000 lb GVWR; 'heavy-or-trailer': anything else. */
export type VinVehicleKind = 'light' | 'heavy-or-trailer'

/** The reason as a code and parameters, for the reader's language (`vin.modelYear.<why>` in shared/messages). */
export type ModelYearWords = { why: 'not-a-year-code' | 'heavy-either' | 'light-year-digit' | 'light-year-letter'; params: Record<string, string | number> }

export type ModelYearReading =
  | { readable: true; code: string; candidates: [number, number]; year?: number; ambiguous: boolean; reason: string; words: ModelYearWords }
  | { readable: false; code: string; reason: string; words: ModelYearWords }

export function readModelYear(vin: string, kind: VinVehicleKind): ModelYearReading {
  const code = vin[9] as string
  const index = YEAR_CODES.indexOf(code)
  if (index < 0) {
    return { readable: false, code, reason: `Position 10 is "${code}", which is not a model-year code (U, Z and 0 are never used).`, words: { why: 'not-a-year-code', params: { code } } }
  }
  const candidates: [number, number] = [1980 + index, 2010 + index]
  const both = `${candidates[0]} or ${candidates[1]}`
  if (kind === 'heavy-or-trailer') {
    return {
      readable: true,
      code,
      candidates,
      ambiguous: true,
      reason:
        `Position 10 "${code}" means ${both}. For a heavy vehicle or a trailer the VIN alone cannot tell which: ` +
        'check the title or the label on the vehicle.',
      words: { why: 'heavy-either', params: { code, first: candidates[0], second: candidates[1] } },
    }
  }
  const seventh = vin[6] as string
  const numeric = seventh >= '0' && seventh <= '9'
  const year = numeric ? candidates[0] : candidates[1]
  return {
    readable: true,
    code,
    candidates,
    year,
    ambiguous: false,
    reason:
      `Position 10 "${code}" means ${both}; position 7 "${seventh}" is ${numeric ? 'a digit' : 'a letter'}, ` +
      `so for a car, MPV or light truck (10,000 lb GVWR or less) the model year is ${year}.`,
    words: { why: numeric ? 'light-year-digit' : 'light-year-letter', params: { code, first: candidates[0], second: candidates[1], seventh, year } },
  }
}
