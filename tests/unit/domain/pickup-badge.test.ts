import { describe, expect, it } from 'vitest'
import { pickupBadge, torqueInBothUnits } from '@shared/domain/inspection'

// The equipment is pickupNeeds' (common trade practice); the badge puts it in a driver's words.
describe('pickupBadge', () => {
  it.each([
    { why: 'sound, keys here', v: { rolls: true, steers: true, brakes: true, keys: 'yes' as const }, label: 'Wheel-lift' },
    { why: 'does not roll', v: { rolls: false, steers: true, brakes: true, keys: 'yes' as const }, label: 'Flatbed or dollies' },
    { why: 'does not roll, no keys', v: { rolls: false, steers: false, brakes: false, keys: 'no' as const }, label: 'Flatbed or dollies' },
    { why: 'does not brake', v: { rolls: true, steers: true, brakes: false, keys: 'yes' as const }, label: 'Flatbed' },
    { why: 'keys not known count as none', v: { rolls: true, steers: true, brakes: true, keys: 'unknown' as const }, label: 'Wheel-lift + dollies' },
  ])('pickupBadge $why is $label', ({ v, label }) => {
    expect(pickupBadge(v)?.label).toBe(label)
  })

  it('pickupBadge_beforeRollsSteersAndBrakesAreAllMarked_isNull', () => {
    expect(pickupBadge({ rolls: false, steers: null, brakes: true, keys: 'yes' })).toBeNull()
  })
})

describe('torqueInBothUnits — 1 ft·lbf = 1.3558179483314004 N·m exactly (NIST SP 811 by definition)', () => {
  it.each([
    [80, '80 ft·lbf = 108.5 N·m'], // 108.465 435 866 5 N·m
    [100, '100 ft·lbf = 135.6 N·m'], // 135.581 794 833 1 N·m
    [140, '140 ft·lbf = 189.8 N·m'], // 189.814 512 766 4 N·m
  ])('torqueInBothUnits_%s', (ftLbf, shown) => {
    expect(torqueInBothUnits(ftLbf)).toBe(shown)
  })
})
