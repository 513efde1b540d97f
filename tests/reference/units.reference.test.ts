import { describe, expect, it } from 'vitest'
import { footPoundsToNewtonMetres, NEWTON_METRES_PER_FOOT_POUND_FORCE, newtonMetresToFootPounds } from '@shared/domain/inspection'

describe('torque units — foot and pound-force by definition (NIST SP 811, appendix B)', () => {
  it('newtonMetresPerFootPoundForce_isTheExactProductOfTheDefinitions', () => {
    // 1 ft = 0.3048 m exactly; 1 lbf = 4.4482216152605 N exactly (0.45359237 kg × 9.80665 m/s²).
    // Multiplied as integers: 3048 × 44482216152605 = 135581794833140040, i.e. 1.35581794833140040.
    expect((3048n * 44482216152605n).toString()).toBe('135581794833140040')
    expect(NEWTON_METRES_PER_FOOT_POUND_FORCE).toBe(Number('1.3558179483314004'))
  })

  it('footPoundsToNewtonMetres_onePoundForceFoot_roundsToNistsListed1.355818 (NIST SP 811 [M])', () => {
    expect(footPoundsToNewtonMetres(1).toFixed(6)).toBe('1.355818')
  })

  it.each([
    // A typical passenger-car lug nut spec, converted both ways (common practice figures).
    { ftLbf: 100, newtonMetres: 135.58179483314004 },
    { ftLbf: 80, newtonMetres: 108.465435866512 },
  ])('newtonMetresToFootPounds_$newtonMetres_isBackTo$ftLbf', ({ ftLbf, newtonMetres }) => {
    expect(footPoundsToNewtonMetres(ftLbf)).toBeCloseTo(newtonMetres, 10)
    expect(newtonMetresToFootPounds(newtonMetres)).toBeCloseTo(ftLbf, 10)
  })
})
