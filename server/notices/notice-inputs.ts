import type { Executor } from '@db/client'
import { NOTICE_EVENTS, nextStepDate, plannedNotices } from '@shared/domain/notices'
import { dayFromIsoDate, isoDate, localDay, startOfLocalDay } from '@shared/domain/time'
import type { VehicleSummary } from '@shared/schemas/charges'
import type { NoticeKind, PlannedNotice } from '@shared/schemas/notices'
import type { RuleSet } from '@shared/schemas/rule-sets'
import { summarizeVehicles } from '../charges/index'
import { vehicleClocks } from '../clock-events/index'
import type { VehicleRow, YardRow } from '../vehicles/index'
import type { LetterCharges } from './notice-letter'

export interface NoticeFacts {
  today: string
  plan: PlannedNotice[]
  ruleSet: RuleSet
}

/** The yard's calendar day of an instant, "2026-12-02". */
export const yardToday = (yard: YardRow, now: Date) => isoDate(localDay(yard.timeZone, now.getTime()))

/** Which notices the vehicle's clocks ask for today; null when it has no rule set. */
export async function noticeFacts(db: Executor, vehicle: VehicleRow, yard: YardRow, now: Date): Promise<NoticeFacts | null> {
  const worked = await vehicleClocks(db, vehicle, yard, now)
  if (!worked) return null
  const today = yardToday(yard, now)
  return { today, plan: plannedNotices(worked.clocks, today), ruleSet: worked.ruleSet }
}

const letterCharges = (s: VehicleSummary | null | undefined): LetterCharges | null =>
  s ? { days: s.daysOnLot, towCents: s.towCents, storageCents: s.storageCents, balanceCents: s.balanceCents } : null

/**
 * What a letter mailed today says will happen and what it costs: the first day of the sale or disposal
 * once this mailing is recorded (the clocks worked out with it), the charges today, and what collecting
 * on that day would cost (billed as released at its last moment, as the owner's page quotes it).
 */
export async function letterFigures(db: Executor, vehicle: VehicleRow, yard: YardRow, kind: NoticeKind, now: Date) {
  const mailing = new Date(startOfLocalDay(yard.timeZone, localDay(yard.timeZone, now.getTime()))).toISOString()
  const withMailing = await vehicleClocks(db, vehicle, yard, now, [{ kind: NOTICE_EVENTS[kind], at: mailing }])
  const nextDate = withMailing ? nextStepDate(withMailing.clocks) : null
  const today = (await summarizeVehicles(db, yard, [vehicle], now)).get(vehicle.id)
  let atNext: VehicleSummary | null | undefined = null
  if (nextDate) {
    const end = new Date(startOfLocalDay(yard.timeZone, dayFromIsoDate(nextDate) + 1) - 1)
    atNext = (await summarizeVehicles(db, yard, [{ ...vehicle, closedAt: vehicle.closedAt ?? end }], end)).get(vehicle.id)
  }
  return { nextDate, chargesToday: letterCharges(today), chargesAtNext: letterCharges(atNext) }
}
