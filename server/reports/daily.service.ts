import { and, asc, eq, gte, isNull, lt, or } from 'drizzle-orm'
import type { Database } from '@db/client'
import { payments, tows, vehicles } from '@db/schema'
import { storageBill } from '@shared/domain/billing'
import { DomainError } from '@shared/domain/errors'
import { dayFromIsoDate, isoDate, localDay, startOfLocalDay } from '@shared/domain/time'
import type { DailyReport } from '@shared/schemas/reports'
import type { User } from '@shared/schemas/users'
import { drawerOf } from '../billing/index'
import { boardYardOf } from '../board/index'
import { ruleSetsOf } from '../charges/index'
import { vehicleName } from './lot'

/**
 * One day of the yard's calendar: arrivals and releases, payments and refunds by method, what the
 * lot's bills grew by that day (each vehicle there billed by the core at the day's end, or when it
 * left, less its bill at the day's start), and the cash drawer's close-out (server/billing).
 */
export async function dailyReport(db: Database, user: User, date?: string, now = new Date()): Promise<DailyReport> {
  const yard = await boardYardOf(db, user.id)
  const today = isoDate(localDay(yard.timeZone, now.getTime()))
  const day = date ?? today
  const dayNum = dayFromIsoDate(day, 'date')
  const from = new Date(startOfLocalDay(yard.timeZone, dayNum))
  const to = new Date(startOfLocalDay(yard.timeZone, dayNum + 1))

  const arrived = await db
    .select({ v: vehicles, towReason: tows.reason })
    .from(vehicles)
    .leftJoin(tows, eq(tows.vehicleId, vehicles.id))
    .where(and(eq(vehicles.yardId, yard.id), gte(vehicles.arrivedAt, from), lt(vehicles.arrivedAt, to)))
    .orderBy(asc(vehicles.arrivedAt))
  const left = await db
    .select()
    .from(vehicles)
    .where(and(eq(vehicles.yardId, yard.id), gte(vehicles.closedAt, from), lt(vehicles.closedAt, to)))
    .orderBy(asc(vehicles.closedAt))
  const name = (v: typeof vehicles.$inferSelect) => ({ vehicleId: v.id, stockNumber: v.stockNumber, vehicle: vehicleName(v), plate: v.plate })

  const money = await db
    .select({ kind: payments.kind, method: payments.method, cents: payments.amountCents })
    .from(payments)
    .innerJoin(vehicles, eq(vehicles.id, payments.vehicleId))
    .where(and(eq(vehicles.yardId, yard.id), gte(payments.takenAt, from), lt(payments.takenAt, to)))
  const byMethod = new Map<string, DailyReport['payments'][number]>()
  for (const p of money) {
    const m = byMethod.get(p.method) ?? { method: p.method, count: 0, paymentsCents: 0, refundsCents: 0, netCents: 0 }
    m.count++
    if (p.kind === 'payment') m.paymentsCents += p.cents
    else m.refundsCents += p.cents
    m.netCents = m.paymentsCents - m.refundsCents
    byMethod.set(p.method, m)
  }
  const methods = [...byMethod.values()].sort((a, b) => a.method.localeCompare(b.method))

  // Every vehicle on the lot at some moment of the day: arrived before its end, not gone before its start.
  const present = await db
    .select()
    .from(vehicles)
    .where(and(eq(vehicles.yardId, yard.id), lt(vehicles.arrivedAt, to), or(isNull(vehicles.closedAt), gte(vehicles.closedAt, from))))
  const ruleSets = await ruleSetsOf(db, yard, present)
  const end = Math.min(to.getTime(), now.getTime())
  let storageEarnedCents = 0
  let storageVehicles = 0
  for (const v of present) {
    const ruleSet = ruleSets.get(v.id)
    if (!ruleSet || !ruleSet.vehicleClasses.some((c) => c.code === v.vehicleClass) || end <= v.arrivedAt.getTime()) continue
    const stay = { arrivedAt: v.arrivedAt.toISOString(), releasedAt: v.closedAt?.toISOString() ?? null, vehicleClass: v.vehicleClass }
    const billAt = (ms: number) => storageBill(stay, ruleSet, new Date(ms).toISOString(), { timeZone: yard.timeZone }).totalCents
    try {
      const before = from.getTime() > v.arrivedAt.getTime() ? billAt(from.getTime()) : 0
      storageEarnedCents += billAt(end) - before
      storageVehicles++
    } catch (err) {
      if (!(err instanceof DomainError)) throw err
    }
  }

  const drawer = await drawerOf(db, user, day)
  const c = drawer.closeout
  return {
    date: day,
    today,
    timeZone: yard.timeZone,
    arrivals: arrived.map(({ v, towReason }) => ({ ...name(v), at: v.arrivedAt.toISOString(), towReason })),
    releases: left.map((v) => ({ ...name(v), at: v.closedAt!.toISOString(), disposition: v.disposition })),
    payments: methods,
    paymentsNetCents: methods.reduce((n, m) => n + m.netCents, 0),
    storageEarnedCents,
    storageVehicles,
    closeout: c ? { openingFloatCents: c.openingFloatCents, recordedCents: c.recordedCents, expectedCents: c.expectedCents, countedCents: c.countedCents, overShortCents: c.overShortCents, closedBy: c.closedBy, closedAt: c.closedAt } : null,
    cashRecordedCents: drawer.recordedCents,
  }
}
