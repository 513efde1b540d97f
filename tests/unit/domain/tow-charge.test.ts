import { describe, expect, it } from 'vitest'
import { haversineMiles, towCharge } from '@shared/domain/tow'

const yard = { lat: 36.12, lng: -86.67 }
const pickup = { lat: 36.2, lng: -86.7 }
const rates = { hookUpCents: 19_500, perMileCents: 650, includedMiles: 5, winchingCentsPerUnit: 9_500, dolliesCents: 7_500, afterHoursCents: 8_500 }

describe('towCharge', () => {
  it('towCharge_roadMilesEntered_winOverTheGreatCircle', () => {
    const charge = towCharge(pickup, yard, rates, { roadMiles: 17.3 })
    expect(charge).toMatchObject({ milesFrom: 'road', miles: 17.3, billableMiles: 12.3 })
    // 12.3 miles × $6.50 = $79.95.
    expect(charge.lines.find((l) => l.code === 'mileage')?.amountCents).toBe(7_995)
  })

  it('towCharge_noRoadMiles_billsGreatCircleMilesRoundedUpToTheTenth', () => {
    const miles = haversineMiles(pickup, yard)
    const charge = towCharge(pickup, yard, { ...rates, includedMiles: 0 })
    expect(charge.milesFrom).toBe('great-circle')
    expect(charge.billableMiles).toBe(Math.ceil(miles * 10) / 10)
  })

  it.each([
    { roadMiles: 3, billable: 0, why: 'a tow inside the included miles bills no mileage' },
    { roadMiles: 5.01, billable: 0.1, why: 'a hundredth over the included miles is a tenth' },
    { roadMiles: 5.3, billable: 0.3, why: 'an exact tenth is not rounded up again' },
  ])('towCharge_$why', ({ roadMiles, billable }) => {
    expect(towCharge(pickup, yard, rates, { roadMiles }).billableMiles).toBe(billable)
  })

  it('towCharge_allAddOns_addOneLineEachAndSumToTheTotal', () => {
    const charge = towCharge(pickup, yard, rates, { roadMiles: 10, winchingUnits: 2, dollies: true, afterHours: true })
    expect(charge.lines.map((l) => [l.code, l.amountCents])).toEqual([
      ['hook-up', 19_500],
      ['mileage', 3_250],
      ['winching', 19_000],
      ['dollies', 7_500],
      ['after-hours', 8_500],
    ])
    expect(charge.totalCents).toBe(57_750)
  })

  it.each([
    { why: 'negative road miles', call: () => towCharge(pickup, yard, rates, { roadMiles: -1 }), field: 'roadMiles' },
    { why: 'a fractional winching unit', call: () => towCharge(pickup, yard, rates, { winchingUnits: 1.5 }), field: 'winchingUnits' },
    { why: 'a fractional rate', call: () => towCharge(pickup, yard, { ...rates, perMileCents: 6.5 }), field: 'perMileCents' },
    { why: 'a latitude past the pole', call: () => towCharge({ lat: 91, lng: 0 }, yard, rates), field: 'pickup' },
  ])('towCharge_$why_throwsAtItsField', ({ call, field }) => {
    expect(call).toThrow(expect.objectContaining({ field }))
  })
})
