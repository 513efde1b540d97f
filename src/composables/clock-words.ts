import { ruleWord } from '@shared/messages/rule-words'
import type { ClockExplanationView } from '@shared/schemas/clock-explanations'
import { i18n } from '@/i18n'
import { INTL_TAGS, isLocale, type Locale } from '@/i18n/locales'
import { calendarDate, yardFormat } from './yard-time'

const chosen = (): Locale => {
  const l = i18n.global.locale.value
  return isLocale(l) ? l : 'en'
}

/**
 * A deadline's explanation in the reader's language, from the facts the clocks give
 * (shared/domain/clocks: `explained`): "7 días hábiles después del ingreso del vehículo al almacenaje
 * (1 dic 2026): vence el 10 dic 2026, sin contar 2 días de fin de semana". A holiday reads by its Spanish
 * name where the server's holiday source gives one, else its English. An answer without them
 * (an older server) shows the core's English as it came. Police times read on the yard's clock.
 */
export function clockExplanation(explained: ClockExplanationView | undefined, english: string, timeZone?: string | null): string {
  if (!explained) return english
  const t = i18n.global.t
  const locale = chosen()
  if (explained.code === 'police') {
    if (!timeZone) return english
    const at = yardFormat(timeZone, locale).dateTime
    const minutes = Math.round(explained.hours * 60)
    const hours = explained.hours < 1 ? t('clocks.explain.minutes', { n: minutes }, minutes) : t('clocks.explain.hours', { n: explained.hours }, explained.hours)
    return t('clocks.explain.police', { hours, start: t(`clocks.explain.policeStart.${explained.start}`), startAt: at(explained.startAt), dueAt: at(explained.dueAt) })
  }
  if (explained.code !== 'step') return t(`clocks.explain.${explained.code}`, { date: calendarDate(explained.date, locale) })
  const e = explained
  const counting = t(`clocks.explain.count.${e.dayKind}.${e.direction}`, { n: e.days, from: t(`clocks.explain.from.${e.from}`) }, e.days)
  if (!e.start || !e.date) return t('clocks.explain.sentence', { text: counting })
  const date = calendarDate(e.date, locale)
  let text = e.counted
    ? t('clocks.explain.counted', { counting, start: calendarDate(e.start, locale), counted: calendarDate(e.counted, locale) })
    : t(`clocks.explain.${e.kind === 'deadline' ? 'dueBy' : 'notBeforeDay'}`, { counting, start: calendarDate(e.start, locale), date })
  const skipped = [
    ...(e.weekendDays ? [t('clocks.explain.weekendDays', { n: e.weekendDays }, e.weekendDays)] : []),
    ...(e.holidays ?? []).map((h) => t('clocks.explain.holiday', { name: ruleWord(h, 'name', locale), date: calendarDate(h.date, locale) })),
  ]
  if (skipped.length > 0) text = t('clocks.explain.skipping', { text, skipped: new Intl.ListFormat(INTL_TAGS[locale].dates, { type: 'conjunction' }).format(skipped) })
  if (e.counted) {
    const why = (e.closed && ruleWord(e.closed, 'holiday', locale)) ?? t(`clocks.explain.weekday.${e.closed?.weekday ?? 0}`)
    text = t('clocks.explain.mailing', { text, counted: calendarDate(e.counted, locale), why, date })
  }
  return t('clocks.explain.sentence', { text })
}
