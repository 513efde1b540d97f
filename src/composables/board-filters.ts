import { computed } from 'vue'
import { useRoute, useRouter, type LocationQuery } from 'vue-router'
import { HOLD_KINDS, type HoldKind } from '@shared/domain/lifecycle'
import type { BoardCard } from '@shared/schemas/board'

export type HoldFilter = '' | 'any' | 'none' | HoldKind

export interface BoardFilters {
  q: string
  reason: string
  hold: HoldFilter
  minDays: number | null
  overdue: boolean
}

export const DAY_STEPS = [3, 7, 14, 30, 60] as const
const EMPTY: BoardFilters = { q: '', reason: '', hold: '', minDays: null, overdue: false }
const HOLD_FILTERS: readonly string[] = ['any', 'none', ...HOLD_KINDS]

const text = (v: unknown) => (typeof v === 'string' ? v : '')

export function filtersFromQuery(query: LocationQuery): BoardFilters {
  const days = Number(text(query.days))
  const hold = text(query.hold)
  return {
    q: text(query.q).slice(0, 60),
    reason: text(query.reason),
    hold: (HOLD_FILTERS.includes(hold) ? hold : '') as HoldFilter,
    minDays: Number.isInteger(days) && days > 0 ? days : null,
    overdue: text(query.overdue) === '1',
  }
}

const OWN_KEYS = ['q', 'reason', 'hold', 'days', 'overdue']

function toQuery(f: BoardFilters, keep: LocationQuery): LocationQuery {
  const rest = Object.fromEntries(Object.entries(keep).filter(([k]) => !OWN_KEYS.includes(k)))
  return {
    ...rest,
    ...(f.q.trim() ? { q: f.q } : {}),
    ...(f.reason ? { reason: f.reason } : {}),
    ...(f.hold ? { hold: f.hold } : {}),
    ...(f.minDays ? { days: String(f.minDays) } : {}),
    ...(f.overdue ? { overdue: '1' } : {}),
  }
}

export function cardMatches(card: BoardCard, f: BoardFilters): boolean {
  if (f.reason && card.towReason !== f.reason) return false
  if (f.hold === 'any' && card.holds.length === 0) return false
  if (f.hold === 'none' && card.holds.length > 0) return false
  if (f.hold && f.hold !== 'any' && f.hold !== 'none' && !card.holds.some((h) => h.kind === f.hold)) return false
  if (f.minDays && (card.summary?.daysOnLot ?? 0) < f.minDays) return false
  if (f.overdue && card.summary?.nextDeadline?.status !== 'missed') return false
  const q = f.q.trim().toLowerCase()
  if (!q) return true
  const words = [card.stockNumber, card.vin, card.plate, card.year, card.make, card.model, card.colour, card.space].filter(Boolean).join(' ').toLowerCase()
  return q.split(/\s+/).every((part) => words.includes(part))
}

/** The board's filters, kept in the address so a filtered board can be bookmarked or shared. */
export function useBoardFilters() {
  const route = useRoute()
  const router = useRouter()
  const filters = computed(() => filtersFromQuery(route.query))
  const active = computed(() => JSON.stringify(filters.value) !== JSON.stringify(EMPTY))
  const set = (patch: Partial<BoardFilters>) => router.replace({ query: toQuery({ ...filters.value, ...patch }, route.query) })
  const clear = () => set(EMPTY)
  return { filters, active, set, clear }
}
