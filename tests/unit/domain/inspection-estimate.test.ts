import { describe, expect, it } from 'vitest'
import { estimateTotals, hoursToHundredths, lineCents } from '@shared/domain/inspection'

describe('lineCents — parts exact, labour half-up to the cent on each line', () => {
  it.each([
    { why: 'an hour and a half at $125.00', line: { quantity: 1, unitPriceCents: 0, labourHundredths: 150, labourRateCents: 12_500 }, labourCents: 18_750 },
    { why: 'half a cent rounds up', line: { quantity: 1, unitPriceCents: 0, labourHundredths: 50, labourRateCents: 12_345 }, labourCents: 6_173 },
    { why: 'under half a cent rounds down', line: { quantity: 1, unitPriceCents: 0, labourHundredths: 1, labourRateCents: 49 }, labourCents: 0 },
    { why: 'no labour', line: { quantity: 4, unitPriceCents: 2_599, labourHundredths: 0, labourRateCents: 12_500 }, labourCents: 0 },
  ])('lineCents_$why', ({ line, labourCents }) => {
    const cents = lineCents(line)
    expect(cents.labourCents).toBe(labourCents)
    expect(cents.totalCents).toBe(line.quantity * line.unitPriceCents + labourCents)
  })

  it('estimateTotals_isTheSumOfTheRoundedLines_notARoundedSum', () => {
    // 0.01 h at $0.50 an hour is half a cent: each line rounds up to 1 ¢, so three lines are 3 ¢ (a rounded sum of 1.5 ¢ would be 2 ¢).
    const tiny = { quantity: 1, unitPriceCents: 0, labourHundredths: 1, labourRateCents: 50 }
    expect(estimateTotals([tiny, tiny, tiny])).toEqual({ partsCents: 0, labourCents: 3, totalCents: 3 })
  })

  it('lineCents_aNegativePrice_throwsAtItsField', () => {
    expect(() => lineCents({ quantity: 1, unitPriceCents: -1, labourHundredths: 0, labourRateCents: 0 })).toThrow(expect.objectContaining({ field: 'unitPriceCents' }))
  })
})

describe('hoursToHundredths', () => {
  it.each([
    [1.5, 150],
    [0.25, 25],
    [0.1, 10],
    [40, 4000],
    [1.333, undefined],
  ])('hoursToHundredths_%s_is_%s', (hours, hundredths) => {
    expect(hoursToHundredths(hours)).toBe(hundredths)
  })
})
