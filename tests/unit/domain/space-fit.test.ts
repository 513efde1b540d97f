import { describe, expect, it } from 'vitest'
import { spaceFit, spaceNeeded } from '@shared/domain/vehicle'

// The fit rule is Holdfast's own (common trade practice: a smaller vehicle fits a larger space).
describe('spaceFit', () => {
  it.each([
    ['motorcycle', 'motorcycle', true],
    ['motorcycle', 'standard', true],
    ['motorcycle', 'wide', true],
    ['standard', 'motorcycle', false],
    ['standard', 'standard', true],
    ['standard', 'wide', true],
    ['heavy', 'motorcycle', false],
    ['heavy', 'standard', false],
    ['heavy', 'wide', true],
    ['trailer', 'motorcycle', false],
    ['trailer', 'standard', true],
  ] as const)('a %s vehicle in a %s space fits: %s', (vehicleClass, size, fits) => {
    expect(spaceFit(vehicleClass, size).fits).toBe(fits)
  })

  it('a refusal says what the vehicle needs and what the space is, in English and as a code with the two sizes', () => {
    expect(spaceFit('standard', 'motorcycle')).toEqual({
      fits: false,
      needs: 'standard',
      reason: 'This vehicle needs a car space or larger; this is a motorcycle bay.',
      code: 'tooSmall',
      params: { needs: 'standard', size: 'motorcycle' },
    })
    expect(spaceFit('heavy', 'standard')).toMatchObject({ needs: 'wide', reason: 'This vehicle needs a heavy-duty space or larger; this is a car space.', code: 'tooSmall', params: { needs: 'wide', size: 'standard' } })
  })

  it('an unknown class needs a car space', () => {
    expect(spaceNeeded('camper')).toBe('standard')
  })
})
