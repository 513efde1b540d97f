import { count, eq, inArray } from 'drizzle-orm'
import { hashPassword } from '../users/index'
import { loadSampleRuleSets } from '../rule-sets/index'
import { BOARD_COLUMNS, type VehicleState } from '@shared/domain/lifecycle'
import { formatStockNumber, vinWithCheckDigit, yearInZone } from '@shared/domain/vehicle'
import { towCharge } from '@shared/domain/tow'
import type { Database } from '@db/client'
import { demoTeardown, insertDemoTeardowns, withTeardown } from './inspections'
import { DEMO_VEHICLES, type DemoVehicle } from './vehicles'
import { DEMO_COMPANY, DEMO_DRIVERS, DEMO_PASSWORD, DEMO_SPACES, DEMO_STAFF, DEMO_YARD } from './scenario'
import { chainFromStart, type HistoryKey, type NewHistoryEvent } from '@db/history'
import * as t from '@db/schema'

const HOUR = 3_600_000

export interface DemoLoaded {
  password: string
  users: { email: string; role: string }[]
}

/** Loads the demo yard when the database has no yard yet; returns null when it already has one. */
/** The demo sign-ins while the demo's staff still sign in with the demo password's accounts; none for a real yard. */
export async function demoSignIns(db: Database): Promise<DemoLoaded | null> {
  const rows = await db.select({ email: t.users.email }).from(t.users).where(inArray(t.users.email, DEMO_STAFF.map((s) => s.email)))
  const present = DEMO_STAFF.filter((s) => rows.some((r) => r.email === s.email))
  return present.length > 0 ? { password: DEMO_PASSWORD, users: present.map(({ email, role }) => ({ email, role })) } : null
}

/** The demo yard, when the database has no yard yet; its history is sealed with the server's history key. */
export async function loadDemoIfEmpty(db: Database, historyKey: HistoryKey, now = new Date(), ruleSetsFolder?: string): Promise<DemoLoaded | null> {
  const [row] = await db.select({ n: count() }).from(t.yards)
  if ((row?.n ?? 0) > 0) return null
  await db.transaction((tx) => loadDemo(tx as unknown as Database, historyKey, now, ruleSetsFolder))
  return { password: DEMO_PASSWORD, users: DEMO_STAFF.map(({ email, role }) => ({ email, role })) }
}

async function loadDemo(db: Database, historyKey: HistoryKey, now: Date, ruleSetsFolder: string | undefined): Promise<void> {
  const [company] = await db.insert(t.companies).values(DEMO_COMPANY).returning()
  const ruleSetVersions = await loadSampleRuleSets(db, ruleSetsFolder)
  const california = ruleSetVersions.get('california-sample')
  const [ruleSet] = california
    ? await db.select({ id: t.ruleSetVersions.ruleSetId }).from(t.ruleSetVersions).where(eq(t.ruleSetVersions.id, california))
    : []
  const [yard] = await db
    .insert(t.yards)
    .values({ ...DEMO_YARD, companyId: company!.id, ruleSetId: ruleSet?.id ?? null })
    .returning()
  const spaces = await db
    .insert(t.yardSpaces)
    .values(DEMO_SPACES.map((s) => ({ ...s, yardId: yard!.id })))
    .returning()

  const passwordHash = await hashPassword(DEMO_PASSWORD)
  const staff = await db
    .insert(t.users)
    .values(DEMO_STAFF.map((s) => ({ ...s, companyId: company!.id, passwordHash })))
    .returning()
  const byRole = Object.fromEntries(staff.map((u) => [u.role, u]))

  const free = { standard: spaces.filter((s) => s.size === 'standard'), heavy: spaces.filter((s) => s.size === 'wide'), motorcycle: spaces.filter((s) => s.size === 'motorcycle') }
  const sorted = [...DEMO_VEHICLES].sort((a, b) => b.hoursAgo - a.hoursAgo)
  const sequences = new Map<number, number>()

  // One statement per table: the demo must load within the start-up budget.
  const rows = sorted.map((v, i) => {
    const arrivedAt = new Date(now.getTime() - v.hoursAgo * HOUR)
    const year = yearInZone(arrivedAt, yard!.timeZone)
    const seq = (sequences.get(year) ?? 0) + 1
    sequences.set(year, seq)
    const closed = v.state === 'closed'
    const space = closed ? undefined : free[v.vehicleClass].shift()
    const inspectedAt = demoInspectedAt(v, arrivedAt, now)
    return {
      yardId: yard!.id,
      stockNumber: formatStockNumber(yard!.code, year, seq),
      vin: demoVin(v, i),
      plate: v.plate,
      plateState: v.plate ? 'CA' : null,
      year: v.year,
      make: v.make,
      model: v.model,
      colour: v.colour,
      body: v.body,
      vehicleClass: v.vehicleClass,
      odometer: v.odometer,
      odometerUnreadable: v.odometer === null,
      keys: v.keys,
      keysWhere: v.keys === 'yes' ? `Key cabinet, hook ${i + 1}` : null,
      drivableAsFound: v.reason === 'private_property' || v.reason === 'law_enforcement',
      rolls: v.rolls ?? null,
      steers: v.rolls ?? null,
      brakes: v.rolls ?? null,
      state: v.state,
      disposition: v.disposition ?? null,
      spaceId: space?.id ?? null,
      conditionNotes: v.notes ?? null,
      checkedById: byRole.dispatcher!.id,
      inspectedAt,
      inspectedById: inspectedAt ? byRole.technician!.id : null,
      ruleSetVersionId: california ?? null,
      ownerName: v.owner,
      estimatedValueCents: v.unvalued ? null : demoValueCents(v),
      estimatedValueSource: v.unvalued ? null : 'Price guide',
      arrivedAt,
      closedAt: closed ? new Date(now.getTime() - (v.hoursAgo - 24 * 6) * HOUR) : null,
    }
  })
  const inserted = await db.insert(t.vehicles).values(rows).returning({ id: t.vehicles.id, stockNumber: t.vehicles.stockNumber })
  const idOf = new Map(inserted.map((r) => [r.stockNumber, r.id]))
  const vehicleIds = rows.map((r) => idOf.get(r.stockNumber)!)

  await db.insert(t.tows).values(
    sorted.map((v, i) => {
      const arrivedAt = rows[i]!.arrivedAt
      return {
        vehicleId: vehicleIds[i]!,
        pickupLat: v.pickup.lat,
        pickupLng: v.pickup.lng,
        pickupAddress: v.pickup.address,
        reason: v.reason,
        requesterName: v.requester,
        requesterAgency: v.agency ?? null,
        requesterReference: v.reference ?? null,
        calledAt: new Date(arrivedAt.getTime() - 1.5 * HOUR),
        hookedAt: new Date(arrivedAt.getTime() - 0.75 * HOUR),
        arrivedAt,
        ...DEMO_DRIVERS[v.vehicleClass === 'heavy' ? 2 : i % 2]!,
        ...demoTowCharge(v),
      }
    }),
  )
  const told = sorted.flatMap((v, i) => (policeToldInDemo(v) ? [{ i, notifiedAt: policeToldAt(rows[i]!.arrivedAt) }] : []))
  if (told.length > 0) {
    await db.insert(t.policeNotices).values(told.map(({ i, notifiedAt }) => ({ vehicleId: vehicleIds[i]!, ...DEMO_POLICE, notifiedAt, reportNumber: `OFPD-${4100 + i}`, recordedById: byRole.dispatcher!.id })))
  }
  const held = sorted.flatMap((v, i) => (v.hold ? [{ v, hold: v.hold, i }] : []))
  await db.insert(t.holds).values(
    held.map(({ hold, i }) => ({
      vehicleId: vehicleIds[i]!,
      kind: hold.kind,
      agency: hold.agency ?? null,
      caseNumber: hold.caseNumber ?? null,
      until: hold.daysLeft ? new Date(now.getTime() + hold.daysLeft * 24 * HOUR) : null,
      note: hold.note ?? null,
      setById: byRole.dispatcher!.id,
      setAt: rows[i]!.arrivedAt,
    })),
  )
  const teardowns = sorted.map((v, i) => {
    const { inspectedAt, estimatedValueCents } = rows[i]!
    return inspectedAt && estimatedValueCents !== null ? demoTeardown(v, vehicleIds[i]!, estimatedValueCents, yard!.labourRateCents, inspectedAt, byRole.technician!) : null
  })
  await insertDemoTeardowns(db, teardowns)
  const chains = sorted.map((v, i) => chainFromStart(historyKey, vehicleIds[i]!, withTeardown(demoHistory(v, rows[i]!.arrivedAt, now, byRole), teardowns[i] ?? null)))
  await db.insert(t.historyEvents).values(chains.flatMap((c) => c.rows))
  await db.insert(t.historyHeads).values(chains.flatMap((c) => (c.head ? [c.head] : [])))
  await db.insert(t.stockCounters).values([...sequences].map(([year, last]) => ({ yardId: yard!.id, year, last })))
}

type Staff = Record<string, { id: string; name: string }>

// Private-property tows: the police were told 20 minutes after the call (within § 22658's hour), except
// the newest, left untold so the demo shows an overdue police clock.
const DEMO_POLICE = { agency: 'Orrin Flats Police Department', person: 'Desk officer Lena Marsh' }
const policeToldInDemo = (v: DemoVehicle) => v.reason === 'private_property' && v.hoursAgo > 6
const policeToldAt = (arrivedAt: Date) => new Date(arrivedAt.getTime() - 1.5 * HOUR + 20 * 60_000)

function demoHistory(v: DemoVehicle, arrivedAt: Date, now: Date, staff: Staff): Omit<NewHistoryEvent, 'vehicleId'>[] {
  const actor = (role: string) => ({ actorId: staff[role]!.id, actorLabel: staff[role]!.name })
  const events: Omit<NewHistoryEvent, 'vehicleId'>[] = [
    { ...actor('dispatcher'), kind: 'towed_in', toState: 'arrival', at: arrivedAt, reason: v.reason.replaceAll('_', ' ') },
  ]
  if (policeToldInDemo(v)) {
    const notifiedAt = policeToldAt(arrivedAt).toISOString()
    events.push({ ...actor('dispatcher'), kind: 'police_notified', at: new Date(arrivedAt.getTime() + 30_000), after: { ...DEMO_POLICE, notifiedAt } })
  }
  if (v.hold) {
    events.push({ ...actor('dispatcher'), kind: 'hold_set', at: new Date(arrivedAt.getTime() + 60_000), after: { kind: v.hold.kind, caseNumber: v.hold.caseNumber ?? null } })
  }
  const path = demoPath(v)
  const movers: Record<string, string> = { teardown: 'technician', decision: 'technician', storage: 'office', release: 'office', closed: 'office' }
  for (let step = 1; step < path.length; step++) {
    const to = path[step]!
    events.push({
      ...actor(movers[to]!),
      kind: 'moved',
      fromState: path[step - 1]!,
      toState: to,
      at: demoMoveAt(arrivedAt, now, step, path.length),
      reason: to === 'closed' ? v.disposition!.replaceAll('_', ' ') : null,
    })
  }
  return events
}

function demoPath(v: DemoVehicle): VehicleState[] {
  return v.state === 'closed' ? [...BOARD_COLUMNS, 'closed'] : BOARD_COLUMNS.slice(0, BOARD_COLUMNS.indexOf(v.state) + 1)
}

// Moves are spread over the stay, the last one at least an hour before now.
function demoMoveAt(arrivedAt: Date, now: Date, step: number, steps: number): Date {
  const span = Math.max(now.getTime() - HOUR - arrivedAt.getTime(), HOUR)
  return new Date(arrivedAt.getTime() + (span * step) / steps)
}

/** A vehicle past Teardown was inspected: finished a few minutes before it moved on to Owner decision. */
function demoInspectedAt(v: DemoVehicle, arrivedAt: Date, now: Date): Date | null {
  const path = demoPath(v)
  const toDecision = path.indexOf('decision')
  return toDecision < 0 ? null : new Date(demoMoveAt(arrivedAt, now, toDecision, path.length).getTime() - 10 * 60_000)
}

function demoTowCharge(v: DemoVehicle) {
  const charge = towCharge(v.pickup, DEMO_YARD, DEMO_YARD.towRates, {
    dollies: v.rolls === false,
  })
  return { straightMiles: charge.miles, chargeCents: charge.totalCents, chargeLines: charge.lines }
}

// An invented market value by age, so the demo's lien clocks (which depend on value) can run.
function demoValueCents(v: DemoVehicle): number {
  return Math.max(800, (v.year - 1998) * 550 + (v.vehicleClass === 'heavy' ? 6000 : 0)) * 100
}

function demoVin(v: DemoVehicle, i: number): string {
  // Position 7 is numeric for model years 1980–2009 and a letter for 2010–2039 (49 CFR 565.15).
  const vds = v.vds.slice(0, 3) + (v.year >= 2010 ? 'ABCDEFGHJKLMNPRSTVWXYZ'[i % 22] : String(i % 10)) + v.vds.slice(4)
  const yearCode = 'ABCDEFGHJKLMNPRSTVWXY123456789'[(v.year - 1980) % 30]
  const serial = String(100_000 + ((i * 7919) % 900_000)).padStart(6, '0')
  return vinWithCheckDigit(`${v.wmi}${vds}${yearCode}${'KMNRT'[i % 5]}${serial}`)
}
