import { and, asc, eq, gte, inArray, isNull, lt } from 'drizzle-orm'
import type { Database } from '@db/client'
import { releases, vehicleContacts, vehicles } from '@db/schema'
import { dayFromCivil, isoDate, localDay, startOfLocalDay } from '@shared/domain/time'
import { SALVAGE_DISPOSITIONS, type Salvage, type SalvageRow } from '@shared/schemas/reports'
import { boardYardOf } from '../board/index'
import { vehicleName } from './lot'

/** The month before the one `now` falls in, on the yard's calendar: what a monthly report is filed for. */
function priorMonth(timeZone: string, now: Date): string {
  const [y, m] = isoDate(localDay(timeZone, now.getTime())).split('-').map(Number) as [number, number]
  return m === 1 ? `${y - 1}-12` : `${y}-${String(m - 1).padStart(2, '0')}`
}

/**
 * The monthly inventory of vehicles obtained as junk or salvage (28 CFR 25.56): each vehicle closed in
 * the month as a title transfer, a lien sale or disposal, or scrapped (SALVAGE_DISPOSITIONS), with its
 * VIN, the day, from whom (the registered owner on record) and its disposition.
 */
export async function salvageInventory(db: Database, userId: string, month?: string, now = new Date()): Promise<Salvage> {
  const yard = await boardYardOf(db, userId)
  const m = month ?? priorMonth(yard.timeZone, now)
  const [y, mo] = m.split('-').map(Number) as [number, number]
  const from = new Date(startOfLocalDay(yard.timeZone, dayFromCivil(y, mo, 1)))
  const to = new Date(startOfLocalDay(yard.timeZone, mo === 12 ? dayFromCivil(y + 1, 1, 1) : dayFromCivil(y, mo + 1, 1)))
  const rows = await db
    .select({ v: vehicles, claimant: releases.claimantName })
    .from(vehicles)
    .leftJoin(releases, eq(releases.vehicleId, vehicles.id))
    .where(and(eq(vehicles.yardId, yard.id), inArray(vehicles.disposition, [...SALVAGE_DISPOSITIONS]), gte(vehicles.closedAt, from), lt(vehicles.closedAt, to)))
    .orderBy(asc(vehicles.closedAt), asc(vehicles.stockNumber))
  const owners = rows.length
    ? await db
        .select({ vehicleId: vehicleContacts.vehicleId, name: vehicleContacts.name })
        .from(vehicleContacts)
        .where(and(inArray(vehicleContacts.vehicleId, rows.map((r) => r.v.id)), eq(vehicleContacts.role, 'registered_owner'), isNull(vehicleContacts.removedAt)))
        .orderBy(asc(vehicleContacts.createdAt))
    : []
  const ownerOf = new Map<string, string>()
  for (const o of owners) if (!ownerOf.has(o.vehicleId)) ownerOf.set(o.vehicleId, o.name)
  return {
    month: m,
    timeZone: yard.timeZone,
    rows: rows.map(({ v, claimant }): SalvageRow => ({
      vehicleId: v.id,
      stockNumber: v.stockNumber,
      vin: v.vin,
      vehicle: vehicleName(v),
      obtainedOn: isoDate(localDay(yard.timeZone, v.closedAt!.getTime())),
      fromWhom: ownerOf.get(v.id) ?? v.ownerName ?? null,
      disposition: v.disposition as SalvageRow['disposition'],
      crushed: v.disposition === 'scrapped',
      toWhom: claimant ?? null,
      forExport: null,
    })),
  }
}
