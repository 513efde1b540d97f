import { describe, expect, it } from 'vitest'
import { pickupNeeds } from '@shared/domain/inspection'

// Common trade practice (REFERENCES.md, "A fact of the trade"): no published source.
describe('pickupNeeds — common trade practice', () => {
  it.each([
    { condition: { rolls: true, steers: true, brakes: true, keys: true }, equipment: ['wheel-lift'], why: 'a sound vehicle with keys goes on a wheel-lift' },
    { condition: { rolls: false, steers: true, brakes: true, keys: true }, equipment: ['flatbed', 'dollies-or-skates'], why: 'one that does not roll needs a flatbed, dollies or skates' },
    { condition: { rolls: true, steers: false, brakes: true, keys: true }, equipment: ['flatbed'], why: 'one that does not steer is carried' },
    { condition: { rolls: true, steers: true, brakes: false, keys: true }, equipment: ['flatbed'], why: 'one that does not brake is carried on the winch line' },
    { condition: { rolls: true, steers: true, brakes: true, keys: false }, equipment: ['wheel-lift', 'dollies-or-skates'], why: 'without keys dollies go under the wheels left down' },
  ])('pickupNeeds_$why', ({ condition, equipment }) => {
    expect(pickupNeeds(condition).equipment).toEqual(equipment)
  })

  it('pickupNeeds_doesNotRoll_asksATechnicianFirstAndSaysItCanOftenBeMadeToRoll', () => {
    const needs = pickupNeeds({ rolls: false, steers: false, brakes: true, keys: true })
    expect(needs.technicianFirst).toBe(true)
    expect(needs.reasons[0]).toContain('refit the joint and wheel')
    expect(needs.reasons).toHaveLength(2)
  })
})
