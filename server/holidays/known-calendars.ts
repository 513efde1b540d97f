import { createRequire } from 'node:module'
import type HolidaysType from 'date-holidays'
import type { HolidayCalendarOption } from '@shared/schemas/holidays'
import type { CalendarKey } from './holiday-calendar'

let list: HolidayCalendarOption[] | undefined

/** Every country date-holidays knows and each of its states (about 570), in English, worked out once. */
export function knownCalendars(): HolidayCalendarOption[] {
  if (list) return list
  const Holidays = createRequire(import.meta.url)('date-holidays') as typeof HolidaysType
  const source = new Holidays()
  const found: HolidayCalendarOption[] = []
  for (const [country, countryName] of Object.entries(source.getCountries('en'))) {
    found.push({ country, countryName })
    for (const [state, stateName] of Object.entries(source.getStates(country, 'en') ?? {})) found.push({ country, state, countryName, stateName })
  }
  return (list = found)
}

/** Whether the holiday source knows this calendar (a made-up one would count no holidays at all). */
export const isKnownCalendar = (key: CalendarKey) => knownCalendars().some((c) => c.country === key.country && c.state === key.state)
