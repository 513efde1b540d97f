import { createRequire } from 'node:module'
import type HolidaysType from 'date-holidays'
import type { HolidayCalendarOption } from '@shared/schemas/holidays'
import type { CalendarKey } from './holiday-calendar'

let list: HolidayCalendarOption[] | undefined

/**
 * Every country date-holidays knows and each of its states (about 570), in English with the Spanish beside
 * it, worked out once. A country's Spanish name is CLDR's (the runtime's `Intl.DisplayNames`): date-holidays
 * answers `getCountries('es')` with a country's own name where it has no Spanish ("Deutschland").
 * A state's is date-holidays' `getStates(country, 'es')` where that differs from both the English and the
 * state's own name (the library's answer when it has no Spanish); otherwise none, and the reader reads the English.
 */
export function knownCalendars(): HolidayCalendarOption[] {
  if (list) return list
  const Holidays = createRequire(import.meta.url)('date-holidays') as typeof HolidaysType
  const source = new Holidays()
  const regions = new Intl.DisplayNames(['es'], { type: 'region', fallback: 'none' })
  const found: HolidayCalendarOption[] = []
  for (const [country, countryName] of Object.entries(source.getCountries('en'))) {
    const countryEs = spanishCountry(regions, country, countryName)
    found.push({ country, countryName, ...(countryEs ? { es: { countryName: countryEs } } : {}) })
    const own = source.getStates(country) ?? {}
    const spanish = source.getStates(country, 'es') ?? {}
    for (const [state, stateName] of Object.entries(source.getStates(country, 'en') ?? {})) {
      const stateEs = spanish[state] && spanish[state] !== stateName && spanish[state] !== own[state] ? spanish[state] : undefined
      const es = { ...(countryEs ? { countryName: countryEs } : {}), ...(stateEs ? { stateName: stateEs } : {}) }
      found.push({ country, state, countryName, stateName, ...(countryEs || stateEs ? { es } : {}) })
    }
  }
  return (list = found)
}

function spanishCountry(regions: Intl.DisplayNames, country: string, english: string): string | undefined {
  let name: string | undefined
  try {
    name = regions.of(country)
  } catch {
    name = undefined
  }
  return name && name !== english ? name : undefined
}

/** Whether the holiday source knows this calendar (a made-up one would count no holidays at all). */
export const isKnownCalendar = (key: CalendarKey) => knownCalendars().some((c) => c.country === key.country && c.state === key.state)
