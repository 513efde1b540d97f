import { and, asc, eq, gte, lt } from 'drizzle-orm'
import type { Database, Executor } from '@db/client'
import { cashCloseouts, payments, users, vehicles } from '@db/schema'
import { countDrawer } from '@shared/domain/billing'
import { dayFromIsoDate, isoDate, localDay, startOfLocalDay } from '@shared/domain/time'
import type { CloseoutRecord, Drawer } from '@shared/schemas/billing'
import type { User } from '@shared/schemas/users'
import { AppError, conflict, fieldIssue, notFound, said } from '../errors'
import { yardOfUser } from '../yards/index'
import { paymentRecord } from './billing.queries'

type YardRow = NonNullable<Awaited<ReturnType<typeof yardOfUser>>>

async function yardFor(db: Executor, user: User): Promise<YardRow> {
  const yard = await yardOfUser(db, user.id)
  if (!yard) throw notFound('A yard for your company')
  return yard
}

/** The cash that moved through the yard's drawer on one of its calendar days, change already given back. */
async function cashOfDay(db: Executor, yard: YardRow, businessDate: string) {
  const day = dayFromIsoDate(businessDate, 'businessDate')
  const from = new Date(startOfLocalDay(yard.timeZone, day))
  const to = new Date(startOfLocalDay(yard.timeZone, day + 1))
  const rows = await db
    .select({ p: payments, by: users.name, stockNumber: vehicles.stockNumber })
    .from(payments)
    .innerJoin(vehicles, eq(vehicles.id, payments.vehicleId))
    .innerJoin(users, eq(users.id, payments.takenById))
    .where(and(eq(vehicles.yardId, yard.id), eq(payments.method, 'cash'), gte(payments.takenAt, from), lt(payments.takenAt, to)))
    .orderBy(asc(payments.takenAt), asc(payments.id))
  return rows.map((r) => ({ ...paymentRecord(r.p, r.by), stockNumber: r.stockNumber, vehicleId: r.p.vehicleId }))
}

async function closeoutOf(db: Executor, yardId: string, businessDate: string): Promise<CloseoutRecord | null> {
  const [row] = await db
    .select({ c: cashCloseouts, by: users.name })
    .from(cashCloseouts)
    .innerJoin(users, eq(users.id, cashCloseouts.closedById))
    .where(and(eq(cashCloseouts.yardId, yardId), eq(cashCloseouts.businessDate, businessDate)))
  if (!row) return null
  const { c } = row
  return {
    id: c.id,
    businessDate: c.businessDate,
    openingFloatCents: c.openingFloatCents,
    recordedCents: c.recordedCents,
    expectedCents: c.openingFloatCents + c.recordedCents,
    countedCents: c.countedCents,
    overShortCents: c.overShortCents,
    note: c.note,
    closedBy: row.by,
    closedAt: c.closedAt.toISOString(),
  }
}

const alreadyClosed = () => conflict('This day’s drawer is already closed.', said('drawerClosed', undefined, { issues: [fieldIssue('businessDate', 'billing.alreadyClosed', 'Already closed.')] }))

const todayIn = (zone: string) => isoDate(localDay(zone, Date.now()))

/** The drawer of one yard day (today by default): its cash movements, what they add up to, and its close-out if done. */
export async function drawerOf(db: Database, user: User, businessDate?: string): Promise<Drawer> {
  const yard = await yardFor(db, user)
  const today = todayIn(yard.timeZone)
  const date = businessDate ?? today
  const movements = await cashOfDay(db, yard, date)
  return {
    businessDate: date,
    today,
    timeZone: yard.timeZone,
    movements,
    recordedCents: countDrawer(movements, 0, 0).recordedCents,
    closeout: await closeoutOf(db, yard.id, date),
  }
}

/**
 * Closes a day's drawer: the count against what the payments recorded, over or short, with who
 * closed it and when. Once a day per yard; a day still to come cannot be closed.
 */
export async function closeDrawer(db: Database, user: User, input: { businessDate: string; openingFloatCents: number; countedCents: number; note: string | null }): Promise<Drawer> {
  await db.transaction(async (tx) => {
    const yard = await yardFor(tx, user)
    if (input.businessDate > todayIn(yard.timeZone)) {
      const issues = [fieldIssue('businessDate', 'billing.todayOrBefore', 'Choose today or a day before.')]
      throw new AppError(400, 'That day has not come yet: close the drawer at the end of the day.', said('drawerNotYet', undefined, { issues }))
    }
    if (await closeoutOf(tx, yard.id, input.businessDate)) throw alreadyClosed()
    const count = countDrawer(await cashOfDay(tx, yard, input.businessDate), input.openingFloatCents, input.countedCents)
    // The unique (yard, day) constraint is the last word if two people close the same day at once.
    await tx.insert(cashCloseouts).values({
      yardId: yard.id,
      businessDate: input.businessDate,
      openingFloatCents: input.openingFloatCents,
      recordedCents: count.recordedCents,
      countedCents: count.countedCents,
      overShortCents: count.overShortCents,
      note: input.note,
      closedById: user.id,
    })
  }).catch((err) => {
    // Two people closing the same day at once: the unique (yard, day) constraint refused the second.
    if ((err?.cause?.code ?? err?.code) === '23505') throw alreadyClosed()
    throw err
  })
  return drawerOf(db, user, input.businessDate)
}
