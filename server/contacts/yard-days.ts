import { dayFromIsoDate, localDay, startOfLocalDay } from '@shared/domain/time'
import { type FieldWhat, whatWords } from '@shared/schemas/field-messages'
import { badRequest, fieldIssue } from '../errors'

/**
 * A day the office typed ("2026-12-02") as the instant a clock reads: the start of that day on the
 * yard's calendar. A day after today is refused, naming the field: what has not happened is not recorded.
 */
export function pastDay(day: string, timeZone: string, field: string, what: FieldWhat, now = new Date()): Date {
  const n = dayFromIsoDate(day, field)
  if (n > localDay(timeZone, now.getTime())) {
    const message = `${whatWords(what).Words} cannot be in the future.`
    throw badRequest(message, [fieldIssue(field, 'common.cannotBeInFuture', message, { what })])
  }
  return new Date(startOfLocalDay(timeZone, n))
}
