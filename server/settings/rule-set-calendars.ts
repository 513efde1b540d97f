import type { RuleSet } from '@shared/schemas/rule-sets'
import { AppError, fieldIssue, said, type Issue } from '../errors'
import { isKnownCalendar } from '../holidays/index'

const UNKNOWN = 'Choose a holiday calendar from the list: this one is not known, so it would skip no holidays.'

/**
 * A calendar the holiday source does not know would count every weekday as open without a word: the
 * save is refused naming the field (the shared schema cannot tell, date-holidays being server-only).
 */
export function assertKnownCalendars(ruleSet: RuleSet): void {
  const issues: Issue[] = []
  const check = (path: string, ...keys: { country: string; state?: string | undefined }[]) => {
    if (keys.some((k) => !isKnownCalendar(k))) issues.push(fieldIssue(`ruleSet.${path}`, 'ruleSetEditor.unknownCalendar', UNKNOWN))
  }
  check('holidayCalendar', ruleSet.holidayCalendar)
  if (ruleSet.businessDays) check('businessDays.calendars', ...ruleSet.businessDays.calendars)
  if (ruleSet.mailDeadlines) check('mailDeadlines.postOfficeCalendar', ruleSet.mailDeadlines.postOfficeCalendar)
  if (issues.length > 0) throw new AppError(400, UNKNOWN, said('unknownCalendar', undefined, { issues }))
}
