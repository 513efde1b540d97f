import { describe, expect, it } from 'vitest'
import { describeGvwr, suggestVehicleClass } from '@shared/domain/vehicle'

const SAMPLE_CLASSES = ['standard', 'heavy', 'motorcycle']
const nothing = { bodyClass: null, vehicleType: null, gvwr: null }

describe('suggestVehicleClass', () => {
  it.each([
    { why: 'a Class 2F pickup', decoded: { ...nothing, gvwr: { class: '2F', fromLb: 7_001, toLb: 8_000 } }, code: 'standard' },
    { why: 'a Class 3 truck', decoded: { ...nothing, gvwr: { class: '3', fromLb: 10_001, toLb: 14_000 } }, code: 'heavy' },
    { why: 'a Class 8 tractor', decoded: { ...nothing, gvwr: { class: '8', fromLb: 33_001, toLb: null } }, code: 'heavy' },
    { why: 'a motorcycle by body class', decoded: { ...nothing, bodyClass: 'Motorcycle - Cruiser' }, code: 'motorcycle' },
    { why: 'a motorcycle by vehicle type', decoded: { ...nothing, vehicleType: 'Motorcycle' }, code: 'motorcycle' },
  ])('suggestVehicleClass_$why_is$code', ({ decoded, code }) => {
    expect(suggestVehicleClass(decoded, SAMPLE_CLASSES)?.code).toBe(code)
  })

  it.each([
    { why: 'no GVWR', decoded: { ...nothing, bodyClass: 'Sedan/Saloon' } },
    { why: 'a band across 10,000 lb', decoded: { ...nothing, gvwr: { class: '2H–3', fromLb: 9_001, toLb: 14_000 } } },
  ])('suggestVehicleClass_$why_suggestsNothing', ({ decoded }) => {
    expect(suggestVehicleClass(decoded, SAMPLE_CLASSES)).toBeNull()
  })

  it('suggestVehicleClass_classNotInTheRuleSet_suggestsNothing', () => {
    expect(suggestVehicleClass({ ...nothing, gvwr: { class: '8', fromLb: 33_001, toLb: null } }, ['standard', 'motorcycle'])).toBeNull()
  })

  it('suggestVehicleClass_heavy_saysWhyInPounds', () => {
    expect(suggestVehicleClass({ ...nothing, gvwr: { class: '6', fromLb: 19_501, toLb: 26_000 } }, SAMPLE_CLASSES)?.reason).toBe(
      'GVWR Class 6, 19,501–26,000 lb: over 10,000 lb',
    )
  })
})

describe('describeGvwr', () => {
  it.each([
    { band: { class: '1', fromLb: 0, toLb: 6_000 }, text: 'Class 1, 6,000 lb or less' },
    { band: { class: '2E–2F', fromLb: 6_001, toLb: 8_000 }, text: 'Class 2E–2F, 6,001–8,000 lb' },
    { band: { class: '8', fromLb: 33_001, toLb: null }, text: 'Class 8, 33,001 lb and above' },
  ])('describeGvwr_class$band.class_reads $text', ({ band, text }) => {
    expect(describeGvwr(band)).toBe(text)
  })
})
