import { eq, inArray } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { policeNotices, tows } from '@db/schema'
import { type LegalClocks, type LienSaleGate, lienSaleGate, needsPoliceNotice, type PoliceNoticeClock, policeNoticeClock, type PoliceNotification, type TowTimes } from '@shared/domain/clocks'
import type { LienSaleEligible, VehicleSummary } from '@shared/schemas/charges'
import type { RuleSet } from '@shared/schemas/rule-sets'
import { DomainError } from '@shared/domain/errors'
import { clockEventsOf } from '../clock-events/index'
import { ruleSetCalendars } from '../holidays/index'
import { latestVersionOf, versionsById } from '../rule-sets/index'
import { eligibleSince, summarizeVehicle, vehicleClocks } from './vehicle-summary'

export interface SummarizedVehicle {
  id: string
  arrivedAt: Date
  closedAt: Date | null
  vehicleClass: string
  year: number | null
  estimatedValueCents: number | null
  ruleSetVersionId: string | null
  /** The tow charge, when the caller has read it already: the board reads 2,000 at once. */
  towCents?: number
  /** The tow's reason when the caller has read it: only the reasons a police clock applies to are read further. */
  towReason?: string | null
  /** The owner's choice on their page: collecting or a repair is a claim, which keeps the vehicle from sale. */
  ownerChoice?: string | null
}

/** Owner choices that claim the vehicle back. */
const CLAIMS: ReadonlySet<string> = new Set(['collect', 'repair'])
const claimed = (v: SummarizedVehicle) => !!v.ownerChoice && CLAIMS.has(v.ownerChoice)

export interface YardForCharges {
  timeZone: string
  ruleSetId: string | null
}

/**
 * Running bills and next legal dates for many vehicles at once: one query for their tow charges,
 * one per rule-set version not yet parsed. A vehicle is billed under the version it arrived under;
 * one without (or whose class the rule set does not know) gets no summary rather than a wrong one.
 * One whose record the core refuses to bill (an arrival decades ago) gets none either, and the
 * core's reason goes into `problems` when the caller passes it: one bad record never stops a board.
 */
export async function summarizeVehicles(
  db: Executor,
  yard: YardForCharges,
  vehicles: SummarizedVehicle[],
  asOf = new Date(),
  problems?: Map<string, string>,
): Promise<Map<string, VehicleSummary | null>> {
  const out = new Map<string, VehicleSummary | null>()
  if (vehicles.length === 0) return out
  const ruleSets = await ruleSetsOf(db, yard, vehicles)
  const police = await policeFacts(db, vehicles, ruleSets)
  const unread = vehicles.filter((v) => v.towCents === undefined).map((v) => v.id)
  const towRows = unread.length > 0 ? await db.select({ vehicleId: tows.vehicleId, cents: tows.chargeCents }).from(tows).where(inArray(tows.vehicleId, unread)) : []
  const towCents = new Map(towRows.map((t) => [t.vehicleId, t.cents]))
  const recorded = await clockEventsOf(db, vehicles.map((v) => v.id))
  for (const v of vehicles) {
    const ruleSet = ruleSets.get(v.id)
    if (!ruleSet || !ruleSet.vehicleClasses.some((c) => c.code === v.vehicleClass)) {
      out.set(v.id, null)
      continue
    }
    const input = {
      arrivedAt: v.arrivedAt,
      closedAt: v.closedAt,
      vehicleClass: v.vehicleClass,
      modelYear: v.year,
      valueCents: v.estimatedValueCents,
      towCents: v.towCents ?? towCents.get(v.id) ?? 0,
      clockEvents: recorded.get(v.id) ?? [],
      tow: police.get(v.id)?.tow ?? null,
      policeNotification: police.get(v.id)?.notification ?? null,
      claimed: claimed(v),
    }
    try {
      out.set(v.id, summarizeVehicle(input, ruleSet, ruleSetCalendars(ruleSet), asOf, yard.timeZone))
    } catch (err) {
      if (!(err instanceof DomainError)) throw err
      out.set(v.id, null)
      problems?.set(v.id, err.message)
    }
  }
  return out
}

/** Every legal clock of one vehicle, with what the screens make of them. */
export interface VehicleClocks {
  clocks: LegalClocks
  eligible: LienSaleEligible | null
  lienSale: LienSaleGate
  /** The owner chose to collect it or have it repaired: no sale is offered. */
  claimed: boolean
  policeNotice: PoliceNoticeClock | null
}

/**
 * Every legal clock of many vehicles at once, for the Deadlines page and its calendar: the same rule
 * sets, tow facts and clock engine as the board's summaries (summarizeVehicles), without the bill.
 * A vehicle without a rule set, or whose record the core refuses, has none.
 */
export async function clocksOfVehicles(db: Executor, yard: YardForCharges, vehicles: SummarizedVehicle[], asOf = new Date()): Promise<Map<string, VehicleClocks>> {
  const out = new Map<string, VehicleClocks>()
  if (vehicles.length === 0) return out
  const ruleSets = await ruleSetsOf(db, yard, vehicles)
  const police = await policeFacts(db, vehicles, ruleSets)
  // What the office recorded (records requests, mailings) meets or starts clocks here as on the board.
  const recorded = await clockEventsOf(db, vehicles.map((v) => v.id))
  for (const v of vehicles) {
    const ruleSet = ruleSets.get(v.id)
    if (!ruleSet) continue
    const at = asOf.getTime() < v.arrivedAt.getTime() ? v.arrivedAt : asOf
    try {
      const clocks = vehicleClocks({ arrivedAt: v.arrivedAt, modelYear: v.year, valueCents: v.estimatedValueCents, clockEvents: recorded.get(v.id) ?? [] }, ruleSet, ruleSetCalendars(ruleSet), at, yard.timeZone)
      const gate = lienSaleGate(clocks.deadlines, clocks.alerts)
      const facts = police.get(v.id)
      out.set(v.id, {
        clocks,
        eligible: claimed(v) ? null : eligibleSince(gate),
        lienSale: gate,
        claimed: claimed(v),
        policeNotice: policeNoticeClock(ruleSet.policeNotice, facts?.tow ?? null, facts?.notification ?? null, asOf.toISOString()),
      })
    } catch (err) {
      if (!(err instanceof DomainError)) throw err
    }
  }
  return out
}

/**
 * The rule set each vehicle's clocks run under: the version it arrived under, else the yard's
 * current one (a vehicle that arrived without a version of its own), else none.
 */
export async function ruleSetsOf(db: Executor, yard: YardForCharges, vehicles: readonly Pick<SummarizedVehicle, 'id' | 'ruleSetVersionId'>[]) {
  const versions = await versionsById(db, vehicles.flatMap((v) => (v.ruleSetVersionId ? [v.ruleSetVersionId] : [])))
  const needFallback = yard.ruleSetId !== null && vehicles.some((v) => !v.ruleSetVersionId || !versions.has(v.ruleSetVersionId))
  const fallback: RuleSet | undefined = needFallback ? (await latestVersionOf(db, yard.ruleSetId!))?.ruleSet : undefined
  const out = new Map<string, RuleSet | undefined>()
  for (const v of vehicles) out.set(v.id, (v.ruleSetVersionId && versions.get(v.ruleSetVersionId)) || fallback)
  return out
}

type PoliceFacts = { tow: TowTimes; notification: PoliceNotification | null }

/**
 * The tow times and recorded notification of the vehicles whose rule set asks the police be told of
 * their tow — one query, and only for the tows whose reason calls for it (a board reads 2,000 cards).
 */
async function policeFacts(db: Executor, vehicles: readonly SummarizedVehicle[], ruleSets: Map<string, RuleSet | undefined>) {
  const out = new Map<string, PoliceFacts>()
  const ids = vehicles
    .filter((v) => {
      const rule = ruleSets.get(v.id)?.policeNotice
      return rule && (v.towReason === undefined || needsPoliceNotice(rule, v.towReason))
    })
    .map((v) => v.id)
  if (ids.length === 0) return out
  const rows = await db
    .select({
      tow: { vehicleId: tows.vehicleId, reason: tows.reason, calledAt: tows.calledAt, hookedAt: tows.hookedAt, arrivedAt: tows.arrivedAt },
      notice: { notifiedAt: policeNotices.notifiedAt, agency: policeNotices.agency, person: policeNotices.person, reportNumber: policeNotices.reportNumber },
    })
    .from(tows)
    .leftJoin(policeNotices, eq(policeNotices.vehicleId, tows.vehicleId))
    .where(inArray(tows.vehicleId, ids))
  for (const { tow: t, notice: n } of rows) {
    out.set(t.vehicleId, {
      tow: { reason: t.reason, calledAt: t.calledAt?.toISOString() ?? null, hookedAt: t.hookedAt?.toISOString() ?? null, arrivedAt: t.arrivedAt.toISOString() },
      notification: n ? { notifiedAt: n.notifiedAt.toISOString(), agency: n.agency, person: n.person, reportNumber: n.reportNumber } : null,
    })
  }
  return out
}
