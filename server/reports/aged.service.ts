import type { BoardCard } from '@shared/schemas/board'
import { isoDate, localDay } from '@shared/domain/time'
import { AGE_THRESHOLDS, type Aged, type AgedQuery, type AgedRow } from '@shared/schemas/reports'
import { receivableOf } from './receivables.service'
import { vehicleName } from './lot'

/**
 * Vehicles on the lot over 30, 60 or 90 calendar days (the yard's calendar, arrival day to today),
 * oldest first, each with whether the law already allows a lien sale or disposal and since when —
 * the board's own eligibility (the gate open and nobody has claimed it), never worked out again here.
 */
export function agedInventory(cards: readonly BoardCard[], q: AgedQuery, timeZone: string, asOf: Date): Aged {
  const todayNum = localDay(timeZone, asOf.getTime())
  const rows: AgedRow[] = []
  let eligible = 0
  for (const c of cards) {
    const days = todayNum - localDay(timeZone, Date.parse(c.arrivedAt))
    if (c.summary?.eligible) eligible++
    const over = [...AGE_THRESHOLDS].reverse().find((t) => days > t)
    if (!over) continue
    const s = c.summary
    rows.push({
      vehicleId: c.id,
      stockNumber: c.stockNumber,
      vehicle: vehicleName(c),
      plate: c.plate,
      state: c.state as AgedRow['state'],
      arrivedAt: c.arrivedAt,
      days,
      over,
      dueCents: s ? (receivableOf(c)?.dueCents ?? 0) : null,
      eligible: s?.eligible ?? null,
      lienSale: s && !s.eligible ? { code: s.lienSale.code, date: s.lienSale.date } : null,
    })
  }
  rows.sort((a, b) => b.days - a.days || a.stockNumber.localeCompare(b.stockNumber))
  const count = (t: number) => rows.filter((r) => r.days > t).length
  const shown = rows.filter((r) => r.days > q.over)
  const start = (q.page - 1) * q.pageSize
  return {
    asOf: asOf.toISOString(),
    over: q.over,
    page: q.page,
    pageSize: q.pageSize,
    total: shown.length,
    today: isoDate(todayNum),
    timeZone,
    counts: { over30: count(30), over60: count(60), over90: count(90), eligible, onLot: cards.length },
    rows: shown.slice(start, start + q.pageSize),
  }
}
