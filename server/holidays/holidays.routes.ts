import { Router } from 'express'
import { dayFromCivil, closedByEvery, holidayNames } from '@shared/domain/time'
import { draftHolidaysQuerySchema } from '@shared/schemas/holidays'
import { holidayCalendar } from './holiday-calendar'
import { knownCalendars } from './known-calendars'

/**
 * For the rule-set editor: the calendars a manager may choose, and the holidays a draft's calendars close
 * (so the preview follows a calendar change before it is saved). date-holidays stays on the server.
 */
export function holidaysRouter(): Router {
  const router = Router()
  router.get('/holiday-calendars', (_req, res) => {
    res.json({ calendars: knownCalendars() })
  })
  router.get('/holidays', (req, res) => {
    const { calendars, from, to } = draftHolidaysQuerySchema.parse(req.query)
    const keys = calendars.map((c) => {
      const [country = '', state] = c.split('/')
      return state ? { country, state } : { country }
    })
    const closed = closedByEvery(keys.map(holidayCalendar)).between(dayFromCivil(from, 1, 1), dayFromCivil(to, 12, 31))
    res.json({ holidays: closed.map(holidayNames) })
  })
  return router
}
