import { beforeAll, describe, expect, it } from 'vitest'
import floridaJson from '../../../server/rule-sets/samples/florida.json' with { type: 'json' }
import { type ClockEvent, legalClocks } from '@shared/domain/clocks'
import { dayFromCivil } from '@shared/domain/time'
import { ruleWord, ruleWords } from '@shared/messages/rule-words'
import { ruleSetSchema } from '@shared/schemas/rule-sets'
import type { ClockExplanationView } from '@shared/schemas/clock-explanations'
import { holidayCalendar, knownCalendars, ruleSetCalendars } from '../../../server/holidays'
import { clockExplanation } from '@/composables/clock-words'
import { i18n, loadMessages } from '@/i18n'

// Holiday and calendar names in the reader's language (issue 14). The names are the holiday source's:
// date-holidays 3.37.0's data (its `es` names, e.g. "Día de la Independencia", "día sustituto" for an
// observed day), and CLDR's Spanish country names as the runtime's Intl.DisplayNames gives them.
const florida = ruleSetSchema.parse(floridaJson)
const stored: ClockEvent = { kind: 'stored', at: '2026-06-30T15:00:00-04:00' }
// Florida's notice of lien, stored Tue 30 Jun 2026: 7 business days on the sample's own calendars (Florida's
// and the federal one), skipping a weekend and Independence Day observed on Fri 3 Jul (Sat 4 Jul 2026).
const notice = () => legalClocks({ modelYear: 2018 }, [stored], florida, ruleSetCalendars(florida), '2026-07-01T00:00:00Z').deadlines.find((d) => d.code === 'notice-of-lien')!

describe('holiday names in the reader’s language', () => {
  beforeAll(() => Promise.all([loadMessages('en'), loadMessages('es')]), 60_000)

  it('theHolidaySource_givesAHolidaysSpanishNameBesideItsEnglish_andNoneWhereItHasNone', () => {
    const july = holidayCalendar({ country: 'US', state: 'FL' }).between(dayFromCivil(2026, 7, 1), dayFromCivil(2026, 7, 31))
    expect(july.map(({ date, name, es }) => ({ date, name, es }))).toEqual([
      { date: '2026-07-03', name: 'Independence Day (substitute day)', es: { name: 'Día de la Independencia (día sustituto)' } },
      { date: '2026-07-04', name: 'Independence Day', es: { name: 'Día de la Independencia' } },
    ])
    // date-holidays has no Spanish for Florida's 2026 "Commemoration of America's 250th Birthday": no `es`, the English shows.
    const all = holidayCalendar({ country: 'US', state: 'FL' }).between(dayFromCivil(2026, 1, 1), dayFromCivil(2026, 12, 31))
    const untranslated = all.filter((h) => !h.es)
    expect(untranslated.length).toBeGreaterThan(0)
    for (const h of untranslated) expect(ruleWord(h, 'name', 'es')).toBe(h.name)
  })

  it('aCalendarAskedYearAfterYear_keepsEveryObservedDay_withItsSpanishName (5 U.S.C. 6103(b) and OPM’s weekend rule)', () => {
    // Veterans Day falls on Saturday 11 Nov 2028 (observed Friday 10 Nov) and Sunday 11 Nov 2029 (observed Monday
    // 12 Nov). Asking the holiday source for a year's Spanish names once switched its language for the years after,
    // and the observed days were lost from the second year on: a business-day count would have come out a day early.
    const calendar = holidayCalendar({ country: 'US', state: 'AK' })
    for (const year of [2028, 2029, 2030]) calendar.between(dayFromCivil(year, 1, 1), dayFromCivil(year, 12, 31))
    const observed = (year: number) =>
      calendar.between(dayFromCivil(year, 11, 1), dayFromCivil(year, 11, 30)).filter((h) => h.name.startsWith('Veterans Day')).map(({ date, name, es }) => ({ date, name, es }))
    expect(observed(2028)).toEqual([
      { date: '2028-11-10', name: 'Veterans Day (substitute day)', es: { name: 'Día del Veterano (día sustituto)' } },
      { date: '2028-11-11', name: 'Veterans Day', es: { name: 'Día del Veterano' } },
    ])
    expect(observed(2029)).toEqual([
      { date: '2029-11-11', name: 'Veterans Day', es: { name: 'Día del Veterano' } },
      { date: '2029-11-12', name: 'Veterans Day (substitute day)', es: { name: 'Día del Veterano (día sustituto)' } },
    ])
  })

  it('aDeadlineExplanation_readInSpanish_namesTheSkippedHolidayInSpanish', () => {
    const d = notice()
    expect(d.explained.holidays).toEqual([{ date: '2026-07-03', name: 'Independence Day (substitute day)', es: { name: 'Día de la Independencia (día sustituto)' } }])
    i18n.global.locale.value = 'es'
    expect(clockExplanation(d.explained, d.explanation)).toBe(
      '7 días hábiles después del ingreso del vehículo al almacenaje (30 jun 2026): vence el 10 jul 2026, ' +
        'sin contar 2 días de fin de semana y Día de la Independencia (día sustituto) (3 jul 2026).',
    )
    // The English stays where it was: the core's explanation (the calendar feed, the history) and an English reader.
    expect(d.explanation).toContain('Independence Day (substitute day) (2026-07-03)')
    i18n.global.locale.value = 'en'
    expect(clockExplanation(d.explained, d.explanation)).toContain('Independence Day (substitute day) (3 Jul 2026)')
  })

  it('aMailingMovedOffAPostOfficeHoliday_readInSpanish_namesTheHolidayInSpanish', () => {
    // Columbus Day, Mon 12 Oct 2026, on date-holidays' federal calendar (its Spanish: "Descubrimiento de América").
    const [columbus] = holidayCalendar({ country: 'US' }).between(dayFromCivil(2026, 10, 12), dayFromCivil(2026, 10, 12))
    expect(columbus?.es?.name).toBe('Descubrimiento de América')
    const moved: ClockExplanationView = {
      code: 'step', kind: 'deadline', days: 10, dayKind: 'calendar', direction: 'before', from: 'sale-scheduled',
      start: '2026-10-22', date: '2026-10-09', counted: '2026-10-12', closed: { holiday: columbus!.name, es: { holiday: columbus!.es!.name } },
    }
    i18n.global.locale.value = 'es'
    expect(clockExplanation(moved, 'English')).toContain('el correo está cerrado el 12 oct 2026 (Descubrimiento de América)')
    i18n.global.locale.value = 'en'
    expect(clockExplanation(moved, 'English')).toContain(columbus!.name)
  })
})

describe('holiday calendars in the reader’s language', () => {
  const find = (country: string, state?: string) => knownCalendars().find((c) => c.country === country && c.state === state)!

  it('aCountry_readInSpanish_hasItsSpanishName', () => {
    // CLDR's Spanish names; date-holidays itself answers "Deutschland" for Germany in Spanish.
    expect(ruleWords(find('US'), 'es').countryName).toBe('Estados Unidos')
    expect(ruleWords(find('DE'), 'es').countryName).toBe('Alemania')
    expect(ruleWords(find('US'), 'en').countryName).toBe('United States of America')
  })

  it('aState_readInSpanish_hasTheSourcesSpanishName_orItsEnglish', () => {
    // date-holidays names some states in Spanish (Noord-Holland: "Holanda Septentrional"), none of the US states.
    expect(ruleWords(find('NL', 'NH'), 'es')).toMatchObject({ countryName: 'Países Bajos', stateName: 'Holanda Septentrional' })
    expect(ruleWords(find('US', 'CA'), 'es')).toMatchObject({ countryName: 'Estados Unidos', stateName: 'California' })
    // A state's own-language name is not Spanish: Austria's Kärnten reads as its English, Carinthia.
    expect(ruleWords(find('AT', '2'), 'es').stateName).toBe('Carinthia')
  })
})
