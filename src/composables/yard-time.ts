import { computed, toValue, type MaybeRefOrGetter } from 'vue'
import { useCurrentYardQuery } from '@/api/yards'
import { useSessionStore } from '@/stores/session'

// The one look of each on every screen, always on the yard's clock: "1 Dec 2026",
// "Tue, 1 Dec 2026, 14:05", "14:05". The date-time pickers show the same (PICKER_DISPLAY_FORMAT).
const LOOKS = {
  date: { day: 'numeric', month: 'short', year: 'numeric' },
  dateTime: { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' },
  time: { hour: '2-digit', minute: '2-digit' },
} as const satisfies Record<string, Intl.DateTimeFormatOptions>
type Look = keyof typeof LOOKS

const made = new Map<string, Intl.DateTimeFormat>()
function formatter(look: Look, timeZone: string): Intl.DateTimeFormat {
  const key = `${look} ${timeZone}`
  let f = made.get(key)
  if (!f) {
    f = new Intl.DateTimeFormat('en-GB', { ...LOOKS[look], timeZone })
    made.set(key, f)
  }
  return f
}

/** An instant: an ISO 8601 string with its offset, as every schema carries it, or a Date. */
export type Instant = string | Date

/** The three looks on one zone's clock; nothing recorded shows as "—". */
export function yardFormat(timeZone: string) {
  const as = (look: Look) => (at: Instant | null | undefined) => (at == null || at === '' ? '—' : formatter(look, timeZone).format(new Date(at)))
  return { date: as('date'), dateTime: as('dateTime'), time: as('time') }
}

/** A calendar day the server already counted on the yard's clock ("2026-12-30", a legal deadline), in the date look. */
export function calendarDate(day: string): string {
  const [y, m, d] = day.split('-').map(Number) as [number, number, number]
  return formatter('date', 'UTC').format(new Date(Date.UTC(y, m - 1, d)))
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
