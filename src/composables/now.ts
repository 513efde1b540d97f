import { onScopeDispose, type Ref, ref } from 'vue'

// One clock for every component that counts minutes down (the police clock on many cards): one timer, not one each.
const now = ref(Date.now())
let users = 0
let timer: ReturnType<typeof setInterval> | undefined

/** The time now, moved on every 15 seconds while any component uses it. */
export function useNow(): Readonly<Ref<number>> {
  if (users++ === 0) {
    now.value = Date.now()
    timer = setInterval(() => (now.value = Date.now()), 15_000)
  }
  onScopeDispose(() => {
    if (--users === 0) clearInterval(timer)
  })
  return now
}

/** Whole minutes from now to an instant; negative once it has passed. */
export const minutesUntil = (iso: string, at: number) => Math.floor((Date.parse(iso) - at) / 60_000)

/** A span of minutes in the largest unit that reads at a glance: "40 min", "6 h", "3 d" (the catalog's police.span). */
export function spanWords(minutes: number, t: (key: string, named: Record<string, unknown>) => string): string {
  const m = Math.abs(minutes)
  if (m < 120) return t('police.span.minutes', { n: m })
  if (m < 48 * 60) return t('police.span.hours', { n: Math.floor(m / 60) })
  return t('police.span.days', { n: Math.floor(m / 1440) })
}
