import { computed, type Ref } from 'vue'
import type { ClockCalendars } from '@shared/domain/clocks'
import { holidayCalendarFromList } from '@shared/domain/time'
import type { RuleSetInput } from '@shared/schemas/rule-sets'
import { useDraftHolidaysQuery } from '@/api/settings'
import { calendarValue } from './rule-set-form'

/**
 * The calendars the preview counts a draft's deadlines with, as the server would once it is saved: the
 * business days of the calendars as typed (the holiday calendar when none is listed) and, where the draft
 * says so, the post offices' closed days that move a mailing deadline earlier. Null until the lists come.
 */
export function usePreviewCalendars(draft: () => RuleSetInput, years: Ref<{ from: number; to: number }>) {
  const business = computed(() => (draft().businessDays?.calendars ?? [draft().holidayCalendar]).map(calendarValue).join(','))
  const postOffice = computed(() => {
    const mail = draft().mailDeadlines
    return mail ? calendarValue(mail.postOfficeCalendar) : ''
  })
  const closed = useDraftHolidaysQuery(business, () => years.value.from, () => years.value.to)
  const mail = useDraftHolidaysQuery(postOffice, () => years.value.from, () => years.value.to)

  return computed<ClockCalendars | null>(() => {
    if (!closed.data.value) return null
    const mailing = draft().mailDeadlines
    if (mailing && !mail.data.value) return null
    return {
      closed: holidayCalendarFromList(closed.data.value),
      postOffice: mailing ? { holidays: holidayCalendarFromList(mail.data.value!), closedWeekdays: [...mailing.closedWeekdays] } : null,
      ofRuleSet: true,
    }
  })
}
