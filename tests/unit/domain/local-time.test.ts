import { describe, expect, it } from 'vitest'
import { assertTimeZone, isTimeZone, toEpochMs } from '@shared/domain/time'

describe('instants', () => {
  it.each([
    { value: '2026-03-08T09:30:00-08:00', ms: Date.UTC(2026, 2, 8, 17, 30) },
    { value: '2026-03-08T17:30Z', ms: Date.UTC(2026, 2, 8, 17, 30) },
    { value: Date.UTC(2026, 2, 8), ms: Date.UTC(2026, 2, 8) },
  ])('toEpochMs_$value_isReadExactly', ({ value, ms }) => {
    expect(toEpochMs(value, 'arrivedAt')).toBe(ms)
  })

  it.each([
    { value: '2026-03-08T09:30:00', why: 'no offset: it would be read in the server’s zone' },
    { value: '8 March 2026', why: 'not ISO 8601' },
    { value: Number.NaN, why: 'not a number' },
    { value: '1850-01-01T00:00:00Z', why: 'before 1900' },
  ])('toEpochMs_$why_throwsInvalidInstant', ({ value }) => {
    expect(() => toEpochMs(value, 'arrivedAt')).toThrow(expect.objectContaining({ code: 'invalid-instant', field: 'arrivedAt' }))
  })
})

describe('time zones', () => {
  it.each([
    { zone: 'America/Los_Angeles', valid: true },
    { zone: 'UTC', valid: true },
    { zone: 'Mars/Olympus_Mons', valid: false },
    { zone: '+05:00', valid: false },
  ])('isTimeZone_$zone_is$valid', ({ zone, valid }) => {
    expect(isTimeZone(zone)).toBe(valid)
  })

  it('assertTimeZone_unknownZone_throwsWithAnExample', () => {
    expect(() => assertTimeZone('Pacific Time')).toThrow(expect.objectContaining({ code: 'invalid-time-zone', message: expect.stringContaining('America/Los_Angeles') }))
  })
})
