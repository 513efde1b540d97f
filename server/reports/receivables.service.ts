import type { BoardCard } from '@shared/schemas/board'
import type { ReceivableRow, ReceivableSort, Receivables, ReceivablesQuery } from '@shared/schemas/reports'
import { vehicleName } from './lot'

/**
 * A card's receivable: the board's balance (the invoice's total, to the cent) less approved credits
 * and payments net of refunds. Null when nothing is owed or no rule set bills the vehicle.
 */
export function receivableOf(c: BoardCard): ReceivableRow | null {
  const s = c.summary
  if (!s) return null
  const { paidCents, creditedCents } = c.handover
  const dueCents = s.balanceCents - creditedCents - paidCents
  if (dueCents <= 0) return null
  const next = s.nextDeadline
  return {
    vehicleId: c.id,
    stockNumber: c.stockNumber,
    vehicle: vehicleName(c),
    plate: c.plate,
    state: c.state as ReceivableRow['state'],
    arrivedAt: c.arrivedAt,
    daysOnLot: s.daysOnLot,
    towCents: s.towCents,
    storageCents: s.storageCents,
    chargesCents: s.balanceCents,
    creditedCents,
    paidCents,
    dueCents,
    nextDeadline: next ? { label: next.label, dueDate: next.dueDate, daysLeft: next.daysLeft } : null,
  }
}

const KEYS: Record<ReceivableSort, (r: ReceivableRow) => string | number> = {
  stockNumber: (r) => r.stockNumber,
  arrivedAt: (r) => r.arrivedAt,
  daysOnLot: (r) => r.daysOnLot,
  storageCents: (r) => r.storageCents,
  paidCents: (r) => r.paidCents,
  dueCents: (r) => r.dueCents,
  // No next deadline sorts last either way.
  nextDeadline: (r) => r.nextDeadline?.dueDate ?? '',
}

/** The rows the filters keep, in the order asked for (ties by stock number, so pages never overlap). */
export function receivableRows(cards: readonly BoardCard[], q: Omit<ReceivablesQuery, 'page' | 'pageSize'>): ReceivableRow[] {
  const needle = q.q?.toLowerCase()
  const rows = cards.flatMap((c) => {
    const r = receivableOf(c)
    if (!r) return []
    if (q.column && r.state !== q.column) return []
    if (r.daysOnLot < q.minDays) return []
    if (needle && ![r.stockNumber, r.plate ?? '', r.vehicle].some((t) => t.toLowerCase().includes(needle))) return []
    return [r]
  })
  const key = KEYS[q.sort]
  const dir = q.order === 'asc' ? 1 : -1
  return rows.sort((a, b) => {
    const ka = key(a)
    const kb = key(b)
    if (ka === '' && kb !== '') return 1
    if (kb === '' && ka !== '') return -1
    const c = ka < kb ? -1 : ka > kb ? 1 : 0
    return c * dir || (a.stockNumber < b.stockNumber ? -1 : a.stockNumber > b.stockNumber ? 1 : 0)
  })
}

export function receivablesPage(rows: readonly ReceivableRow[], q: ReceivablesQuery, asOf: Date, timeZone: string): Receivables {
  const totals = { count: rows.length, chargesCents: 0, storageCents: 0, creditedCents: 0, paidCents: 0, dueCents: 0 }
  for (const r of rows) {
    totals.chargesCents += r.chargesCents
    totals.storageCents += r.storageCents
    totals.creditedCents += r.creditedCents
    totals.paidCents += r.paidCents
    totals.dueCents += r.dueCents
  }
  const start = (q.page - 1) * q.pageSize
  return { asOf: asOf.toISOString(), timeZone, page: q.page, pageSize: q.pageSize, totals, rows: rows.slice(start, start + q.pageSize) }
}
