import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { normalizeVin, vin, vinFromBarcode, vinWithCheckDigit } from '@shared/domain/vehicle'

describe('vin input', () => {
  it.each([
    { typed: ' 1g4ah59h45g118341 ', why: 'lower case and spaces' },
    { typed: '1G4-AH59H-45G-118341', why: 'dashes' },
    { typed: '1G4 AH59H 45G 118341', why: 'spaces inside' },
  ])('vin_typedWith$why_isNormalisedAndValid', ({ typed }) => {
    expect(vin(typed)).toMatchObject({ normalized: '1G4AH59H45G118341', ok: true })
  })

  it.each([
    { typed: '', code: 'empty' },
    { typed: '1G4AH59H45G1183412', code: 'too-long' },
    { typed: '1G4AH59H45G11834*', code: 'illegal-character' },
  ])('vin_$code_isRefused', ({ typed, code }) => {
    const reading = vin(typed)
    expect(reading.ok).toBe(false)
    expect(reading.problems[0]?.code).toBe(code)
  })

  it('vin_letterO_suggestsTheDigitZero', () => {
    expect(vin('1G4AH59H45GO18341').problems[0]?.message).toBe('The 12th character is the letter O, which a VIN never uses — is it the digit 0?')
  })
})

describe('vinWithCheckDigit (demo data)', () => {
  const legal = fc.constantFrom(...'ABCDEFGHJKLMNPRSTUVWXYZ0123456789'.split(''))

  it('vinWithCheckDigit_any16LegalCharacters_makesAVinWhoseCheckDigitVerifies', () => {
    fc.assert(
      fc.property(fc.array(legal, { minLength: 16, maxLength: 16 }), (chars) => {
        const sixteen = chars.join('')
        const made = vinWithCheckDigit(sixteen)
        expect(made.slice(0, 8) + made.slice(9)).toBe(sixteen)
        expect(vin(made).checkDigit?.valid).toBe(true)
      }),
    )
  })

  it.each([
    { bad: '1G4AH59H5G11834', why: 'fifteen characters' },
    { bad: '1G4AH59HI5G11834', why: 'the letter I' },
  ])('vinWithCheckDigit_$why_throwsInvalidVin', ({ bad }) => {
    expect(() => vinWithCheckDigit(bad)).toThrow(expect.objectContaining({ code: 'invalid-vin' }))
  })

  it('normalizeVin_keepsOnlyTheCharacters', () => {
    expect(normalizeVin(' ab-c d ')).toBe('ABCD')
  })
})

describe('vinFromBarcode', () => {
  it.each([
    { why: 'a Code 39 VIN as printed', text: '1G4AH59H45G118341', vin: '1G4AH59H45G118341' },
    { why: 'an import "I" before it', text: 'I1G4AH59H45G118341', vin: '1G4AH59H45G118341' },
    { why: 'lower case and a trailing newline', text: '1g4ah59h45g118341\n', vin: '1G4AH59H45G118341' },
    { why: 'a Data Matrix with more data around it', text: 'MFG 03/05 1G4AH59H45G118341 GVWR 4400', vin: '1G4AH59H45G118341' },
    { why: 'a plain reading whose check digit fails (the form judges it)', text: '1G4AH59H45G128341', vin: '1G4AH59H45G128341' },
  ])('vinFromBarcode_$why_isTheVin', ({ text, vin: expected }) => {
    expect(vinFromBarcode(text)).toBe(expected)
  })

  it.each([
    { why: 'a part number', text: '84263317' },
    { why: 'a run of characters with no valid check digit inside longer text', text: 'LOT 1G4AH59H45G128341X TAG' },
  ])('vinFromBarcode_$why_isNothing', ({ text }) => {
    expect(vinFromBarcode(text)).toBeNull()
  })
})
