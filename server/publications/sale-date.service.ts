import { and, desc, eq } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { clockEvents } from '@db/schema'
import { earliestSaleDay, saleDateBlocked, saleDayTooEarly, type ClockEvent } from '@shared/domain/clocks'
import { dayFromIsoDate, isoDate, localDay, startOfLocalDay } from '@shared/domain/time'
import { saleDateInputSchema, type SaleDateInput, type SaleDatePage } from '@shared/schemas/publications'
import type { User } from '@shared/schemas/users'
import { addClockEvent, vehicleClocksWith } from '../clock-events/index'
import { conflict, said, unprocessable } from '../errors'
import { refusal } from '../billing/index'
import { changeVehicle, vehicleForUser, type VehicleChanges, type VehicleRow, type YardRow } from '../vehicles/index'

const SALE_EVENT = 'sale-scheduled' as const

/** The sale day as a clock event: from the start of that day on the yard's clock. */
const saleEvent = (zone: string, day: string): ClockEvent => ({ kind: SALE_EVENT, at: new Date(startOfLocalDay(zone, dayFromIsoDate(day))).toISOString() })

async function scheduledDay(db: Executor, vehicleId: string, zone: string): Promise<string | null> {
  const [row] = await db
    .select({ at: clockEvents.at })
    .from(clockEvents)
    .where(and(eq(clockEvents.vehicleId, vehicleId), eq(clockEvents.kind, SALE_EVENT)))
    .orderBy(desc(clockEvents.at))
    .limit(1)
  return row ? isoDate(localDay(zone, row.at.getTime())) : null
}

/** What the law lets the office do with the sale date now, read by the core (shared/domain/clocks/sale-date). */
async function saleRules(db: Executor, vehicle: VehicleRow, yard: YardRow, now: Date) {
  const zone = yard.timeZone
  const today = isoDate(localDay(zone, now.getTime()))
  const clocksFor = await vehicleClocksWith(db, vehicle, yard, now)
  if (!clocksFor) return { today, blocked: { code: 'no-rule-set' as const, why: "This vehicle's yard has no rule set, so it has no sale date." }, clocksFor: null, earliest: null }
  const gate = saleDateBlocked(clocksFor([]))
  if (gate) return { today, blocked: { code: gate.code as SaleDatePage['blocked'] & string, why: gate.why }, clocksFor, earliest: null }
  const earliest = earliestSaleDay((day) => clocksFor([saleEvent(zone, day)]), today)
  return { today, blocked: null, clocksFor, earliest }
}

export async function saleDatePage(db: Executor, user: User, vehicleId: string, now = new Date()): Promise<SaleDatePage> {
  const { vehicle, yard } = await vehicleForUser(db, user.id, vehicleId)
  const { blocked, earliest } = await saleRules(db, vehicle, yard, now)
  return { vehicleId, applies: blocked === null, blocked: blocked?.code ?? null, scheduled: await scheduledDay(db, vehicleId, yard.timeZone), earliest }
}

/**
 * Sets (or moves) the lien sale's day: refused with 400 on `day` naming the earliest day the law
 * allows when it is earlier (the core's "not before" dates and the days the rule set wants between the
 * notice of sale or the advertisement and the sale); the new day replaces the one on record as the
 * "sale-scheduled" clock event, with its history event, in one change.
 */
export async function setSaleDate(changes: VehicleChanges, actor: User, vehicleId: string, raw: SaleDateInput, now = new Date()) {
  const input = saleDateInputSchema.parse(raw)
  dayFromIsoDate(input.day, 'day')
  return changeVehicle(changes, actor, vehicleId, async (w) => {
    if (w.vehicle.state === 'closed') throw conflict(`${w.vehicle.stockNumber} has left the yard.`, said('closedSaleDate', { stock: w.vehicle.stockNumber }))
    const zone = w.yard.timeZone
    const { today, blocked, clocksFor, earliest } = await saleRules(w.tx, w.vehicle, w.yard, now)
    if (blocked || !clocksFor) throw unprocessable(blocked?.why ?? 'No sale date can be set.', said('saleDateBlocked', { blocked: blocked?.code ?? 'no-sale-date' }))
    const early = saleDayTooEarly(clocksFor([saleEvent(zone, input.day)]), input.day, today)
    if (early) {
      const message = earliest
        ? `The earliest sale date the law allows is ${earliest} (${early.step}${early.citation ? ` — ${early.citation}` : ''}).`
        : `That day is too early (${early.step}); no earlier allowed day can be worked out yet.`
      throw refusal(400, 'day', message, earliest ? said('saleTooEarly', { date: earliest }, { earliest }) : said('saleTooEarlyNoDay', undefined, { earliest }))
    }
    const before = await scheduledDay(w.tx, vehicleId, zone)
    await w.tx.delete(clockEvents).where(and(eq(clockEvents.vehicleId, vehicleId), eq(clockEvents.kind, SALE_EVENT)))
    await addClockEvent(w.tx, { vehicleId, kind: SALE_EVENT, at: new Date(saleEvent(zone, input.day).at), source: 'sale-date', sourceId: null, recordedById: actor.id })
    w.record({ kind: 'sale_date_set', before: before ? { day: before } : null, after: { day: input.day } })
  })
}
