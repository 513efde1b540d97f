export { holidayCalendar } from './holiday-calendar'
