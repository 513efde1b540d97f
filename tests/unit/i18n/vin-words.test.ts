import { beforeAll, describe, expect, it } from 'vitest'
import { vin, vinWithCheckDigit } from '@shared/domain/vehicle'
import { towInSchema } from '@shared/schemas/tow-in'
import { fieldText } from '@/composables/field-words'
import { i18n, loadMessages } from '@/i18n'

// Issue 14: what is wrong with a VIN reads in the reader's language. The core (49 CFR 565: check digit at
// position 9, model-year code at position 10, no I, O or Q) gives each problem, note and model-year reading
// as a code with its parameters beside its English; the catalogs' English must say what the core says.
const GOOD = '1G4AH59H45G118341' // the regulation's own sample, check digit 4 (49 CFR 565)
const cases: [string, string, string][] = [
  ['too long', `${GOOD}99`, 'too-long'],
  ['a character no VIN has', '1G4AH59H45G1183#1', 'illegal-character'],
  ['the letter O', '1G4AH59H45G11834O'.replace(/^(.{16}).$/, '$1O'), 'illegal-letter'],
  ['a wrong check digit', '1G4AH59H55G118341', 'check-digit'],
  ['no model-year code at position 10', vinWithCheckDigit('1G4AH59HU5G11834').replace(/^(.{9})./, '$1U'), 'model-year-code'],
]

describe('a VIN’s problems in the reader’s language', () => {
  beforeAll(() => Promise.all([loadMessages('en'), loadMessages('es')]), 60_000)

  it.each(cases)('%s: the English catalog says what the core says, and Spanish says it in Spanish', (_, text, code) => {
    const problem = vin(text).problems.find((p) => p.code === code)
    expect(problem, `the core finds ${code}`).toBeDefined()
    i18n.global.locale.value = 'en'
    expect(i18n.global.t(`vin.problems.${code}`, problem!.params)).toBe(problem!.message)
    i18n.global.locale.value = 'es'
    const spanish = i18n.global.t(`vin.problems.${code}`, problem!.params)
    expect(spanish).not.toBe(problem!.message)
    expect(spanish).not.toMatch(/[{}]/)
  })

  it('a short pre-1981 VIN and each model-year reading: the English is the core’s own, the Spanish differs', () => {
    const short = vin('8J57Y100123')
    const light = vin(GOOD).modelYear!
    const heavy = vin(GOOD, 'heavy-or-trailer').modelYear!
    const letter = vin(vinWithCheckDigit('1G4AH5AH5G118341')).modelYear!
    const words: [string, Record<string, string | number>, string][] = [
      [`vin.notes.${short.notes[0]!.code}`, short.notes[0]!.params, short.warnings[0]!],
      [`vin.modelYear.${light.words.why}`, light.words.params, light.reason],
      [`vin.modelYear.${heavy.words.why}`, heavy.words.params, heavy.reason],
      [`vin.modelYear.${letter.words.why}`, letter.words.params, letter.reason],
    ]
    expect(new Set([light.words.why, heavy.words.why, letter.words.why])).toEqual(new Set(['light-year-digit', 'heavy-either', 'light-year-letter']))
    for (const [key, params, english] of words) {
      i18n.global.locale.value = 'en'
      expect(i18n.global.t(key, params)).toBe(english)
      i18n.global.locale.value = 'es'
      expect(i18n.global.t(key, params)).not.toBe(english)
    }
  })

  it('the tow-in’s refusal of a mistyped VIN reads wholly in Spanish for a Spanish reader', () => {
    const issue = towInSchema.safeParse({ vehicle: { vin: '1G4AH59H55G118341', vehicleClass: 'standard' } }).error?.issues.find((i) => i.path.join('.') === 'vehicle.vin')
    expect(issue).toBeDefined()
    i18n.global.locale.value = 'es'
    const text = fieldText({ message: issue!.message })
    expect(text).toContain('El dígito de control (posición 9) es 5, pero los demás caracteres dan 4')
    expect(text).not.toMatch(/check digit|Correct it/)
    i18n.global.locale.value = 'en'
    expect(fieldText({ message: issue!.message })).toBe('The check digit (9th character) is 5 but the other characters give 4: a character is probably mistyped. Correct it, or record it as read and give the reason.')
  })
})
