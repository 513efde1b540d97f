import { and, asc, eq, gte, isNull, lt, or } from 'drizzle-orm'
import type { Database } from '@db/client'
import { vehicles, yardSpaces } from '@db/schema'
import { storageBill } from '@shared/domain/billing'
import { DomainError } from '@shared/domain/errors'
import { BOARD_COLUMNS } from '@shared/domain/lifecycle'
import { isoDate, localDay, MS_PER_DAY, startOfLocalDay, weekday } from '@shared/domain/time'
import type { BoardCard } from '@shared/schemas/board'
import { AGE_BANDS, type Glance, type GlanceQuery, type GlanceSpace } from '@shared/schemas/glance'
import { spaceLabel } from '@shared/schemas/spaces'
import { boardYardOf, type BoardHub } from '../board/index'
import { ruleSetsOf } from '../charges/index'

type Yard = Awaited<ReturnType<typeof boardYardOf>>

/**
 * The yard at a glance for its manager: every space with what is in it (read from the board's own
 * cards, so it says what the board says), the lot by column and by age, what the bills earned week by
 * week, and how the vehicles that left in those weeks left.
 */
export async function yardGlance(db: Database, hub: BoardHub, userId: string, q: GlanceQuery): Promise<Glance> {
  const yard = await boardYardOf(db, userId)
  const { asOf, cards } = await hub.cards(yard)
  const todayNum = localDay(yard.timeZone, asOf.getTime())
  const daysOf = (c: BoardCard) => todayNum - localDay(yard.timeZone, Date.parse(c.arrivedAt))

  const spaceRows = await db.select().from(yardSpaces).where(eq(yardSpaces.yardId, yard.id)).orderBy(asc(yardSpaces.row), asc(yardSpaces.number))
  const bySpace = new Map<string, BoardCard>()
  for (const c of cards) if (c.space) bySpace.set(c.space, c)
  const spaces = spaceRows.map((s): GlanceSpace => {
    const label = spaceLabel(s)
    const c = bySpace.get(label)
    return {
      id: s.id,
      row: s.row,
      number: s.number,
      label,
      size: s.size,
      state: !c ? 'free' : c.holds.length > 0 ? 'held' : 'occupied',
      column: c ? (c.state as GlanceSpace['column']) : null,
      vehicleId: c?.id ?? null,
      stockNumber: c?.stockNumber ?? null,
      days: c ? daysOf(c) : null,
    }
  })

  // This week starts on the Monday of today's week; the chart covers q.weeks weeks up to this one.
  const thisMonday = todayNum - ((weekday(todayNum) + 6) % 7)
  const firstMonday = thisMonday - 7 * (q.weeks - 1)
  const from = startOfLocalDay(yard.timeZone, firstMonday)
  const closed = await db.select().from(vehicles).where(and(eq(vehicles.yardId, yard.id), gte(vehicles.closedAt, new Date(from)), lt(vehicles.closedAt, asOf)))
  const durations = closed.map((v) => (v.closedAt!.getTime() - v.arrivedAt.getTime()) / MS_PER_DAY)
  const lienSales = closed.filter((v) => v.disposition === 'lien_sale').length

  return {
    asOf: asOf.toISOString(),
    timeZone: yard.timeZone,
    today: isoDate(todayNum),
    spaces,
    unplaced: cards.filter((c) => !c.space).length,
    columns: BOARD_COLUMNS.map((column) => ({ column, count: cards.filter((c) => c.state === column).length })),
    ages: AGE_BANDS.map(({ band, max }, i) => {
      const min = i === 0 ? 0 : AGE_BANDS[i - 1]!.max + 1
      return { band, count: cards.filter((c) => daysOf(c) >= min && daysOf(c) <= max).length }
    }),
    weeks: await weeklyStorage(db, yard, firstMonday, q.weeks, asOf),
    closed: {
      from: isoDate(firstMonday),
      count: closed.length,
      averageDays: durations.length ? Math.round((durations.reduce((a, b) => a + b, 0) / durations.length) * 10) / 10 : null,
      lienSales,
      lienSaleShare: closed.length ? lienSales / closed.length : null,
    },
  }
}

/**
 * What the bills of the vehicles on the lot grew by in each week: for each vehicle there at some time
 * of the weeks, the core's bill at each week's end (or now, or when it left) less its bill at the
 * week's start — the daily report's storage earned, a week at a time.
 */
async function weeklyStorage(db: Database, yard: Yard, firstMonday: number, weeks: number, asOf: Date) {
  const bounds = Array.from({ length: weeks + 1 }, (_, i) => startOfLocalDay(yard.timeZone, firstMonday + 7 * i))
  const totals = Array.from({ length: weeks }, () => 0)
  const present = await db
    .select()
    .from(vehicles)
    .where(and(eq(vehicles.yardId, yard.id), lt(vehicles.arrivedAt, asOf), or(isNull(vehicles.closedAt), gte(vehicles.closedAt, new Date(bounds[0]!)))))
  const ruleSets = await ruleSetsOf(db, yard, present)
  const now = asOf.getTime()
  for (const v of present) {
    const ruleSet = ruleSets.get(v.id)
    if (!ruleSet || !ruleSet.vehicleClasses.some((c) => c.code === v.vehicleClass)) continue
    const stay = { arrivedAt: v.arrivedAt.toISOString(), releasedAt: v.closedAt?.toISOString() ?? null, vehicleClass: v.vehicleClass }
    const arrived = v.arrivedAt.getTime()
    const billAt = (ms: number) => (ms <= arrived ? 0 : storageBill(stay, ruleSet, new Date(ms).toISOString(), { timeZone: yard.timeZone }).totalCents)
    try {
      for (let i = 0; i < weeks; i++) {
        const start = bounds[i]!
        const end = Math.min(bounds[i + 1]!, now)
        if (end <= start || end <= arrived || (v.closedAt && v.closedAt.getTime() <= start)) continue
        totals[i]! += billAt(end) - billAt(start)
      }
    } catch (err) {
      if (!(err instanceof DomainError)) throw err
    }
  }
  return totals.map((storageCents, i) => ({ start: isoDate(firstMonday + 7 * i), storageCents }))
}
