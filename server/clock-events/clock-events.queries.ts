import { asc, inArray } from 'drizzle-orm'
import type { Executor, Tx } from '@db/client'
import { clockEvents } from '@db/schema'
import type { ClockEvent } from '@shared/domain/clocks'
import type { ClockEventKind } from '@shared/schemas/rule-sets'

/** Every recorded clock event of these vehicles, in one query, by vehicle (the board reads thousands at once). */
export async function clockEventsOf(db: Executor, vehicleIds: readonly string[]): Promise<Map<string, ClockEvent[]>> {
  const out = new Map<string, ClockEvent[]>()
  if (vehicleIds.length === 0) return out
  const rows = await db
    .select({ vehicleId: clockEvents.vehicleId, kind: clockEvents.kind, at: clockEvents.at })
    .from(clockEvents)
    .where(inArray(clockEvents.vehicleId, [...vehicleIds]))
    .orderBy(asc(clockEvents.at))
  for (const r of rows) {
    const list = out.get(r.vehicleId) ?? []
    list.push({ kind: r.kind, at: r.at.toISOString() })
    out.set(r.vehicleId, list)
  }
  return out
}

export interface NewClockEvent {
  vehicleId: string
  kind: ClockEventKind
  at: Date
  source: 'records-request' | 'notice-sending' | 'publication' | 'sale-date' | 'office-step'
  sourceId: string | null
  recordedById: string | null
}

/** Records a clock event inside the vehicle's change (the caller records its history event). */
export async function addClockEvent(tx: Tx, event: NewClockEvent): Promise<void> {
  await tx.insert(clockEvents).values(event)
}
