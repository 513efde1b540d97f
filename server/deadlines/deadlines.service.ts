import type { Executor } from '@db/client'
import { isoDate, localDay } from '@shared/domain/time'
import type { DeadlineKind, DeadlineList } from '@shared/schemas/deadlines'
import { clocksOfVehicles, type YardForCharges } from '../charges/index'
import { byUrgency, entriesOf } from './deadline-entries'
import { activeVehicles } from './deadlines.queries'

export interface DeadlinesYard extends YardForCharges {
  id: string
}

/**
 * Every open deadline across the yard's board, overdue first and then by day, worked out with the
 * same rule sets, tow facts and clock engine as the board's cards (server/charges).
 */
export async function yardDeadlines(db: Executor, yard: DeadlinesYard, kinds: readonly DeadlineKind[], asOf = new Date()): Promise<DeadlineList> {
  const rows = await activeVehicles(db, yard.id)
  const clocks = await clocksOfVehicles(db, yard, rows, asOf)
  const today = isoDate(localDay(yard.timeZone, asOf.getTime()))
  const wanted = new Set(kinds)
  const entries = rows
    .flatMap((v) => {
      const c = clocks.get(v.id)
      return c ? entriesOf(v, c, today, yard.timeZone, asOf.getTime()) : []
    })
    .filter((e) => wanted.has(e.kind))
    .sort(byUrgency)
  return { asOf: asOf.toISOString(), today, timeZone: yard.timeZone, entries }
}
