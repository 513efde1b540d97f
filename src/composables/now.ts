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
