import { DomainError } from '../errors'
import { readModelYear, type ModelYearReading, type VinVehicleKind } from './vin-model-year'

export type { ModelYearReading, VinVehicleKind } from './vin-model-year'

export type VinProblem = {
  code: 'empty' | 'too-long' | 'illegal-character' | 'illegal-letter' | 'check-digit' | 'model-year-code'
  message: string
  /** 1-based position in the normalised VIN. */
  position?: number
  /** What the message says, for wording it in the reader's language (`vin.problems.<code>` in shared/messages). */
  params: Record<string, string | number>
}

/** Something to know about a VIN that can still be recorded (`vin.notes.<code>`): a short, pre-1981 VIN. */
export type VinNote = { code: 'short'; params: { length: number } }

export type VinReading = {
  input: string
  normalized: string
  /** True when the VIN can be recorded: a valid 17-character VIN, or a short pre-1981 one. */
  ok: boolean
  problems: VinProblem[]
  warnings: string[]
  /** The warnings as codes and parameters, in the same order. */
  notes: VinNote[]
  checkDigit?: { found: string; expected: string; valid: boolean }
  modelYear?: ModelYearReading
}

// 49 CFR 565.15(c): transliteration of letters and the weight of each position.
const VALUES: Record<string, number> = {
  A: 1, B: 2, C: 3, D: 4, E: 5, F: 6, G: 7, H: 8,
  J: 1, K: 2, L: 3, M: 4, N: 5, P: 7, R: 9,
  S: 2, T: 3, U: 4, V: 5, W: 6, X: 7, Y: 8, Z: 9,
  '0': 0, '1': 1, '2': 2, '3': 3, '4': 4, '5': 5, '6': 6, '7': 7, '8': 8, '9': 9,
}
const WEIGHTS = [8, 7, 6, 5, 4, 3, 2, 10, 0, 9, 8, 7, 6, 5, 4, 3, 2]

/** The check digit of a 17-character VIN of legal characters: the weighted sum mod 11, 10 → X. */
export function expectedCheckDigit(vin: string): string {
  let sum = 0
  for (let i = 0; i < 17; i++) sum += (VALUES[vin[i] as string] as number) * (WEIGHTS[i] as number)
  const remainder = sum % 11
  return remainder === 10 ? 'X' : String(remainder)
}

export function normalizeVin(text: string): string {
  return text.trim().toUpperCase().replace(/[\s-]+/g, '')
}

const ordinal = (n: number) => `${n}${n === 1 ? 'st' : n === 2 ? 'nd' : n === 3 ? 'rd' : 'th'}`

/** Read a VIN as typed: what is wrong with it, if anything, and its model year. */
export function vin(text: string, kind: VinVehicleKind = 'light'): VinReading {
  const normalized = normalizeVin(text)
  const reading: VinReading = { input: text, normalized, ok: false, problems: [], warnings: [], notes: [] }
  if (normalized.length === 0) {
    reading.problems.push({ code: 'empty', message: 'No VIN was entered.', params: {} })
    return reading
  }
  if (normalized.length > 17) {
    reading.problems.push({ code: 'too-long', message: `A VIN has 17 characters; this one has ${normalized.length}.`, params: { length: normalized.length } })
    return reading
  }
  for (let i = 0; i < normalized.length; i++) {
    const c = normalized[i] as string
    if (!/[A-Z0-9]/.test(c)) {
      reading.problems.push({ code: 'illegal-character', position: i + 1, message: `"${c}" (${ordinal(i + 1)} character) cannot be part of a VIN.`, params: { char: c, position: i + 1, nth: ordinal(i + 1) } })
    } else if (normalized.length === 17 && (c === 'I' || c === 'O' || c === 'Q')) {
      const instead = c === 'I' ? '1' : '0'
      reading.problems.push({
        code: 'illegal-letter',
        position: i + 1,
        message: `The ${ordinal(i + 1)} character is the letter ${c}, which a VIN never uses — is it the digit ${instead}?`,
        params: { letter: c, instead, position: i + 1, nth: ordinal(i + 1) },
      })
    }
  }
  if (normalized.length < 17) {
    reading.ok = reading.problems.length === 0
    reading.warnings.push(
      `This VIN has ${normalized.length} characters, not 17: only a vehicle made before 1981 has one this short, ` +
        'so it is saved only with a model year before 1981 (or a reason). It has no check digit or model-year code ' +
        'to verify — compare it with the title.',
    )
    reading.notes.push({ code: 'short', params: { length: normalized.length } })
    return reading
  }
  if (reading.problems.length > 0) return reading

  const found = normalized[8] as string
  const expected = expectedCheckDigit(normalized)
  reading.checkDigit = { found, expected, valid: found === expected }
  if (found !== expected) {
    reading.problems.push({
      code: 'check-digit',
      position: 9,
      message: `The check digit (9th character) is ${found} but the other characters give ${expected}: a character is probably mistyped.`,
      params: { found, expected },
    })
  }
  reading.modelYear = readModelYear(normalized, kind)
  if (!reading.modelYear.readable) {
    reading.problems.push({ code: 'model-year-code', position: 10, message: reading.modelYear.reason, params: { code: reading.modelYear.code } })
  }
  reading.ok = reading.problems.length === 0
  return reading
}

/** A 17-character VIN from the 16 characters around position 9, with its check digit — for demo data. */
export function vinWithCheckDigit(sixteen: string): string {
  const chars = normalizeVin(sixteen)
  if (chars.length !== 16 || /[^A-HJ-NPR-Z0-9]/.test(chars)) {
    throw new DomainError('invalid-vin', `"${sixteen}" is not 16 VIN characters (no I, O or Q).`, 'vin')
  }
  const draft = `${chars.slice(0, 8)}0${chars.slice(8)}`
  return `${chars.slice(0, 8)}${expectedCheckDigit(draft)}${chars.slice(8)}`
}

/**
 * The VIN in a scanned barcode. Code 39 labels on imported vehicles may carry an "I" before it and
 * Data Matrix labels more data around it: there, the first 17 VIN characters whose check digit is
 * right. A plain 17-character reading is returned as read, for the form to judge.
 */
export function vinFromBarcode(text: string): string | null {
  const read = text.trim().toUpperCase()
  const plain = /^I?([A-HJ-NPR-Z0-9]{17})$/.exec(read)
  if (plain) return plain[1]!
  for (const run of read.match(/[A-HJ-NPR-Z0-9]{17,}/g) ?? []) {
    for (let i = 0; i + 17 <= run.length; i++) {
      const candidate = run.slice(i, i + 17)
      if (expectedCheckDigit(candidate) === candidate[8]) return candidate
    }
  }
  return null
}
