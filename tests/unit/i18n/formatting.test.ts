import { describe, expect, it } from 'vitest'
import { money, number } from '../../../src/composables/money'
import { calendarDate, yardFormat } from '../../../src/composables/yard-time'

// Expected strings are what Node 20's ICU (CLDR) prints for these Intl tags; en-GB keeps Holdfast's
// English look, es-US is the Spanish of the United States (CLDR "es_US": abbreviated months in lower
// case, "de" between day, month and year in the long form, US dollar amounts written as in English).
const EVENING_AT_THE_YARD = '2026-12-01T22:05:00Z' // 14:05 on Tue 1 Dec 2026 in America/Los_Angeles (PST, UTC−8)

describe('dates on the yard clock, in the reader’s language', () => {
  it('yardFormat_spanish_saysTheYardsDayAndTimeInSpanishOnA24HourClock', () => {
    const es = yardFormat('America/Los_Angeles', 'es')
    expect(es.date(EVENING_AT_THE_YARD)).toBe('1 dic 2026')
    expect(es.time(EVENING_AT_THE_YARD)).toBe('14:05 PST')
    expect(es.dateTime(EVENING_AT_THE_YARD)).toBe('1 dic 2026, 14:05 PST')
  })

  it('yardFormat_english_keepsTheLookItAlwaysHad', () => {
    const en = yardFormat('America/Los_Angeles', 'en')
    expect(en.dateTime(EVENING_AT_THE_YARD)).toBe('1 Dec 2026, 14:05 PST')
  })

  it('calendarDate_spanish_keepsTheDayTheServerCounted', () => {
    expect(calendarDate('2026-12-30', 'es')).toBe('30 dic 2026')
    expect(calendarDate('2026-12-30', 'en')).toBe('30 Dec 2026')
  })
})

describe('money and numbers in the reader’s language', () => {
  it.each([
    ['en', 123456, '$1,234.56'],
    ['es', 123456, '$1,234.56'],
    ['en', 5, '$0.05'],
    ['es', 0, '$0.00'],
    // Nothing paid, shown as a deduction (-0 cents): no minus sign before nothing.
    ['en', -0, '$0.00'],
    ['en', -1250, '-$12.50'],
  ] as const)('money in %s of %i cents is %s', (locale, cents, expected) => {
    expect(money(cents, locale)).toBe(expected)
  })

  it('number_withDecimals_keepsThePlacesAsked', () => {
    expect(number(3, 1, 'en')).toBe('3.0')
    expect(number(12345.67, undefined, 'es')).toBe('12,345.67')
  })
})
