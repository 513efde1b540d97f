export { holidayCalendar, ruleSetCalendars } from './holiday-calendar'
