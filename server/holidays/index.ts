export { holidayCalendar, ruleSetCalendars } from './holiday-calendar'
export { holidaysRouter } from './holidays.routes'
export { isKnownCalendar, knownCalendars } from './known-calendars'
