import { computed, toValue, type MaybeRefOrGetter } from 'vue'
import { wallClock } from '@shared/domain/time'
import { useCurrentYardQuery } from '@/api/yards'
import { i18n } from '@/i18n'
import { INTL_TAGS, type Locale } from '@/i18n/locales'
import { useSessionStore } from '@/stores/session'

// The one look of each on every screen, always on the yard's clock, in the reader's language:
// "1 Dec 2026", "Tue, 1 Dec 2026, 14:05", "14:05" ("1 dic 2026", "mar, 1 de dic de 2026, 14:05").
// A 24-hour clock in both, as the date-time pickers show it (PICKER_DISPLAY_FORMAT).
const LOOKS = {
  date: { day: 'numeric', month: 'short', year: 'numeric' },
  dateTime: { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' },
  time: { hour: '2-digit', minute: '2-digit', hourCycle: 'h23' },
} as const satisfies Record<string, Intl.DateTimeFormatOptions>
type Look = keyof typeof LOOKS

const made = new Map<string, Intl.DateTimeFormat>()
function formatter(look: Look, timeZone: string, locale: Locale): Intl.DateTimeFormat {
  const key = `${look} ${timeZone} ${locale}`
  let f = made.get(key)
  if (!f) {
    f = new Intl.DateTimeFormat(INTL_TAGS[locale].dates, { ...LOOKS[look], timeZone })
    made.set(key, f)
  }
  return f
}

/** An instant: an ISO 8601 string with its offset, as every schema carries it, or a Date. */
export type Instant = string | Date

// Read inside a render, the chosen language is a dependency: switching it re-renders every date.
const chosen = (): Locale => i18n.global.locale.value

/** The three looks on one zone's clock, in the given language, else the one chosen; nothing recorded shows as "—". */
export function yardFormat(timeZone: string, locale?: Locale) {
  const as = (look: Look) => (at: Instant | null | undefined) =>
    at == null || at === '' ? '—' : formatter(look, timeZone, locale ?? chosen()).format(new Date(at))
  return { date: as('date'), dateTime: as('dateTime'), time: as('time') }
}

/** A calendar day the server already counted on the yard's clock ("2026-12-30", a legal deadline), in the date look. */
export function calendarDate(day: string, locale: Locale = chosen()): string {
  const [y, m, d] = day.split('-').map(Number) as [number, number, number]
  return formatter('date', 'UTC', locale).format(new Date(Date.UTC(y, m - 1, d)))
}

/**
 * Dates and times as the yard's clock shows them, whatever zone the browser is in. Without an
 * argument, the signed-in user's yard (GET /api/yards/current); a page about one yard's record
 * passes that yard's zone (a vehicle page names its yard). Until the zone is known each gives "",
 * never the browser's own clock.
 */
export function useYardTime(timeZone?: MaybeRefOrGetter<string | null | undefined>) {
  const zone = timeZone === undefined ? useCurrentYardZone() : computed(() => toValue(timeZone) ?? null)
  const format = computed(() => (zone.value ? yardFormat(zone.value) : null))
  return {
    zone,
    date: (at: Instant | null | undefined) => format.value?.date(at) ?? '',
    dateTime: (at: Instant | null | undefined) => format.value?.dateTime(at) ?? '',
    time: (at: Instant | null | undefined) => format.value?.time(at) ?? '',
  }
}

function useCurrentYardZone() {
  const session = useSessionStore()
  const yard = useCurrentYardQuery(() => session.user?.id)
  return computed(() => yard.data.value?.timeZone ?? null)
}

/** The zone's name in the reader's language ("Pacific Time", "hora del Pacífico"), to label a time typed on the yard's clock. */
export function zoneName(timeZone: string, locale: Locale = chosen()): string {
  return (
    new Intl.DateTimeFormat(INTL_TAGS[locale].dates, { timeZone, timeZoneName: 'longGeneric' }).formatToParts(new Date()).find((p) => p.type === 'timeZoneName')
      ?.value ?? timeZone
  )
}

/** Today (or the day of `at`) on a yard's calendar as "2026-12-02", the value a date field sends. */
export function yardDay(timeZone: string, at: Date = new Date()): string {
  return wallClock(timeZone, at.getTime()).slice(0, 10)
}
