import { stepWords } from '@shared/messages/rule-words'
import type { Database } from '@db/client'
import { dayFromIsoDate, isoDate, localDay, startOfLocalDay } from '@shared/domain/time'
import type { OwnerDeadline, OwnerPage, OwnerQuote } from '@shared/schemas/owner'
import { AppError, badRequest, fieldIssue, said } from '../errors'
import { summarizeVehicles } from '../charges/index'
import { filesOf } from '../files/index'
import { vehicleClocks } from '../clock-events/index'
import { inspectionOf } from '../inspections/index'
import type { MapConfig } from '../map/index'
import { latestVersionOf } from '../rule-sets/index'
import { vehicleById, type VehicleRow, type YardRow } from '../vehicles/index'
import { checklistItem } from '@shared/domain/inspection'
import { invoiceOf } from '../billing/index'
import { ownerRelease } from '../releases/index'
import { decisionsOf } from './owner.queries'

/** How far ahead the owner may ask what collecting would cost. */
export const QUOTE_DAYS_AHEAD = 366

/**
 * Everything the owner's page shows of the one vehicle its link reaches: the vehicle, its photos,
 * the findings, estimate and recommendation, the bill so far, the deadlines that concern the owner,
 * where the yard is. No staff names, no IDs or papers, no other vehicle.
 */
export async function ownerPage(db: Database, vehicleId: string, key: string, map: MapConfig, expiresAt: Date, now = new Date(), cardsReady = false): Promise<OwnerPage> {
  const { vehicle: v, yard } = await vehicleById(db, vehicleId)
  const { ruleSet, inspection, recommendation } = await inspectionOf(db, v)
  const inspectionPhotoIds = new Set(inspection?.items.flatMap((i) => i.photos.map((p) => p.id)) ?? [])
  const photos = (await filesOf(db, v.id))
    .filter((f) => f.kind === 'photo')
    .map((f) => ({
      id: f.id,
      stage: inspectionPhotoIds.has(f.id) ? ('inspection' as const) : ('intake' as const),
      label: f.label,
      url: `/api/owner/${encodeURIComponent(key)}/files/${f.id}`,
      thumbUrl: f.thumbUrl ? `/api/owner/${encodeURIComponent(key)}/files/${f.id}/thumb` : null,
    }))
  const [decision] = await decisionsOf(db, v.id, 1)
  const billRuleSet = ruleSet ?? (yard.ruleSetId ? (await latestVersionOf(db, yard.ruleSetId))?.ruleSet : undefined)
  return {
    vehicle: {
      stockNumber: v.stockNumber,
      year: v.year,
      make: v.make,
      model: v.model,
      colour: v.colour,
      plate: v.plate,
      plateState: v.plateState,
      state: v.state,
      arrivedAt: v.arrivedAt.toISOString(),
    },
    yard: {
      name: yard.name,
      address: yard.address,
      phone: yard.phone,
      hours: yard.hours,
      timeZone: yard.timeZone,
      lat: yard.lat,
      lng: yard.lng,
      today: isoDate(localDay(yard.timeZone, now.getTime())),
    },
    map: { tileUrl: map.tileUrl, tileAttribution: map.tileAttribution, maxZoom: map.maxZoom },
    photos,
    inspection: inspection && {
      finished: inspection.finished !== null,
      findings: inspection.items
        .filter((i) => i.status !== 'not_checked' && i.status !== 'ok')
        .map((i) => ({ code: i.code, label: checklistItem(i.code)?.label ?? i.code, status: i.status, note: i.note })),
      lines: inspection.lines.map((l) => ({ part: l.part, quantity: l.quantity, totalCents: l.totalCents })),
      totalCents: inspection.totals.totalCents,
    },
    recommendation: recommendation && {
      recommendation: recommendation.recommendation,
      rule: recommendation.rule,
      percent: ruleSet?.totalLoss.rule === 'percent-of-value' ? ruleSet.totalLoss.percent : null,
      ...recommendation.numbers,
      citation: recommendation.source.citation,
    },
    bill: await quoteAt(db, v, yard, now, isoDate(localDay(yard.timeZone, now.getTime())), false),
    money: await moneyOf(db, v, yard, now, cardsReady),
    release: await ownerRelease(db, v.id, v.state),
    deadlines: await deadlinesOf(db, v, yard, now),
    caution: billRuleSet?.caution ?? null,
    ...(billRuleSet?.es?.caution ? { es: { caution: billRuleSet.es.caution } } : {}),
    decision: decision ? { choice: decision.choice, signOverTo: decision.signOverTo, fullName: decision.fullName, phone: decision.phone, note: decision.note, at: decision.at } : null,
    expiresAt: expiresAt.toISOString(),
  }
}

/**
 * What the stay costs if the vehicle leaves on `date` (the yard's calendar), counted by the same
 * engine as the office's bill to the last moment of that day: the most that day can cost.
 */
export async function ownerQuote(db: Database, vehicleId: string, date: string, now = new Date()): Promise<OwnerQuote> {
  const { vehicle, yard } = await vehicleById(db, vehicleId)
  const today = localDay(yard.timeZone, now.getTime())
  const day = dayFromIsoDate(date)
  if (day < today) throw badRequest('Choose today or a later date.', [fieldIssue('date', 'owner.chooseTodayOrLater', 'Choose today or a later date.')])
  if (day > today + QUOTE_DAYS_AHEAD) throw badRequest('Choose a date within a year.', [fieldIssue('date', 'owner.chooseWithinYear', 'Choose a date within a year.')])
  const quote = await quoteAt(db, vehicle, yard, new Date(startOfLocalDay(yard.timeZone, day + 1) - 1), date, true)
  if (!quote) throw new AppError(400, 'The yard cannot work out this bill here; please call them.', said('quoteUnavailable'))
  return quote
}

/** The counter's own invoice, to now: what was charged, paid and credited, and what is due. */
async function moneyOf(db: Database, v: VehicleRow, yard: YardRow, now: Date, cardsReady: boolean): Promise<OwnerPage['money']> {
  const invoice = await invoiceOf(db, v, yard, now).catch(() => null)
  if (!invoice) return null
  const dueCents = Math.max(0, invoice.dueCents)
  return {
    totalCents: invoice.totalCents,
    paidCents: invoice.netPaidCents,
    creditedCents: invoice.creditedCents,
    dueCents,
    canPayByCard: cardsReady && v.state !== 'closed' && dueCents >= 50,
  }
}

async function quoteAt(db: Database, v: VehicleRow, yard: YardRow, at: Date, date: string, leaving: boolean): Promise<OwnerQuote | null> {
  // Leaving then: billed as released at that moment, the way the office's bill will be.
  const closedAt = v.closedAt ?? (leaving ? at : null)
  const summary = (await summarizeVehicles(db, yard, [{ ...v, closedAt }], at)).get(v.id)
  if (!summary) return null
  return { date, daysOnLot: summary.daysOnLot, storageCents: summary.storageCents, towCents: summary.towCents, balanceCents: summary.balanceCents }
}

/**
 * The legal clocks as the office's pages count them (server/clock-events): the version the vehicle arrived under,
 * the rule set's calendars, and what the office recorded — a records request sent or a notice mailed shows as done,
 * and the steps that start from a mailing get their dates.
 */
async function deadlinesOf(db: Database, v: VehicleRow, yard: YardRow, now: Date): Promise<OwnerDeadline[]> {
  const worked = await vehicleClocks(db, v, yard, now)
  return (worked?.clocks.deadlines ?? []).map((d) => ({
    code: d.code,
    label: d.label,
    kind: d.kind,
    doneBy: d.doneBy.event,
    status: d.status,
    dueDate: d.dueDate ?? null,
    explanation: d.explanation,
    explained: d.explained,
    citation: d.source.citation,
    ...(stepWords(d) ? { es: stepWords(d) } : {}),
  }))
}
