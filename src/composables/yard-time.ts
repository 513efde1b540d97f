import { computed, toValue, type MaybeRefOrGetter } from 'vue'
import { wallClock } from '@shared/domain/time'
import { useCurrentYardQuery } from '@/api/yards'
import { i18n } from '@/i18n'
import { INTL_TAGS, type Locale } from '@/i18n/locales'
import { useSessionStore } from '@/stores/session'

// The one look of each on every screen, always on the yard's clock, in the reader's language:
// "1 Dec 2026", "1 Dec 2026, 14:05 PST", "14:05 PST" ("1 dic 2026", "1 dic 2026, 14:05 PST").
// A 24-hour clock in both; a time carries the yard's zone (issue 16 item 15: a time read in another zone
// was taken for the reader's own). The pickers type the same looks (pickerFormat), without the zone,
// which the date-time field names beside itself. No weekday: dayjs cannot read one back from a typed
// field, and a field that shows one look and reads another is what issue 16 item 8 was about.
const LOOKS = {
  date: { day: 'numeric', month: 'short', year: 'numeric' },
  dateTime: { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' },
  time: { hour: '2-digit', minute: '2-digit', hourCycle: 'h23' },
  month: { month: 'long', year: 'numeric' },
} as const satisfies Record<string, Intl.DateTimeFormatOptions>
type Look = keyof typeof LOOKS
const ZONED: ReadonlySet<Look> = new Set(['dateTime', 'time'])

// The zone's short name as a US yard reads it in either language ("PST", "PDT"; CLDR's en-US and es-US
// both say so). A zone with no such name in CLDR reads as its offset ("GMT+1").
const ZONE_TAGS: Record<Locale, string> = { en: 'en-US', es: 'es-US' }
const zoneShort = new Map<string, Intl.DateTimeFormat>()
/** The yard's zone as it stood at `at` ("PST" in December, "PDT" in July, for Los Angeles). */
export function zoneAbbreviation(timeZone: string, at: Instant, locale: Locale = chosen()): string {
  const key = `${timeZone} ${locale}`
  let f = zoneShort.get(key)
  if (!f) {
    f = new Intl.DateTimeFormat(ZONE_TAGS[locale], { timeZone, timeZoneName: 'short' })
    zoneShort.set(key, f)
  }
  return f.formatToParts(new Date(at)).find((p) => p.type === 'timeZoneName')?.value ?? timeZone
}

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
  const as = (look: Look) => (at: Instant | null | undefined) => {
    if (at == null || at === '') return '—'
    const shown = formatter(look, timeZone, locale ?? chosen()).format(new Date(at))
    return ZONED.has(look) ? `${shown} ${zoneAbbreviation(timeZone, at, locale ?? chosen())}` : shown
  }
  return { date: as('date'), dateTime: as('dateTime'), time: as('time') }
}

/** A calendar day the server already counted on the yard's clock ("2026-12-30", a legal deadline), in the date look. */
export function calendarDate(day: string, locale: Locale = chosen()): string {
  const [y, m, d] = day.split('-').map(Number) as [number, number, number]
  return formatter('date', 'UTC', locale).format(new Date(Date.UTC(y, m - 1, d)))
}

// dayjs's tokens for each part Intl names; a literal is bracketed so dayjs neither formats nor parses it.
const TOKENS: Partial<Record<Intl.DateTimeFormatPartTypes, (o: Intl.DateTimeFormatOptions) => string>> = {
  day: (o) => (o.day === '2-digit' ? 'DD' : 'D'),
  month: (o) => (o.month === 'long' ? 'MMMM' : 'MMM'),
  year: () => 'YYYY',
  hour: () => 'HH',
  minute: () => 'mm',
}

/**
 * What a picker (Element Plus, dayjs) shows and reads, in dayjs's tokens: the same look as the screens
 * show, in the reader's language, taken from Intl's own order of the parts ("D MMM YYYY, HH:mm";
 * "MMMM YYYY" in English, "MMMM [de] YYYY" in Spanish).
 */
export function pickerFormat(look: 'date' | 'dateTime' | 'month', locale: Locale = chosen()): string {
  const options = LOOKS[look]
  return formatter(look, 'UTC', locale)
    .formatToParts(new Date(Date.UTC(2026, 11, 1, 14, 5)))
    .map((p) => TOKENS[p.type]?.(options) ?? (p.type === 'literal' ? `[${p.value}]` : ''))
    .join('')
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
