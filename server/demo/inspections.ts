// Finished teardowns for a few demo vehicles past Teardown, matching their intake notes. Every
// part, price and figure is invented; labour is priced at the demo yard's rate.
import { randomUUID } from 'node:crypto'
import { CAUTIONS, estimateTotals, type FindingStatus, hoursToHundredths, itemName, pickupBadge } from '@shared/domain/inspection'
import type { Database } from '@db/client'
import type { NewHistoryEvent } from '@db/history'
import * as schema from '@db/schema'
import type { DemoVehicle } from './vehicles'

interface DemoInspection {
  findings: { item: string; status: FindingStatus; note?: string }[]
  lines: { item?: string; part: string; quantity: number; unitPriceCents: number; labourHours: number }[]
  salvageValueCents: number
  valueSource: string
  salvageSource: string
}

const GUIDE = 'Tule Valley dealers’ price guide, fair condition'

const BY_VEHICLE: Record<string, DemoInspection> = {
  'Halvard Wren': {
    findings: [
      { item: 'drive-shafts', status: 'broken', note: 'Right front shaft snapped at the inner joint' },
      { item: 'cv-joints', status: 'worn', note: 'Left outer boot split' },
      { item: 'ball-joints', status: 'ok' },
      { item: 'tyres', status: 'ok' },
      { item: 'brakes-front', status: 'worn' },
    ],
    lines: [
      { item: 'drive-shafts', part: 'Drive shaft, right front (Corrant remanufactured)', quantity: 1, unitPriceCents: 28_900, labourHours: 2.5 },
      { item: 'cv-joints', part: 'CV boot kit', quantity: 1, unitPriceCents: 3_450, labourHours: 1 },
    ],
    salvageValueCents: 85_000,
    valueSource: GUIDE,
    salvageSource: 'Scrap weight at today’s price',
  },
  'Veyland Brio': {
    findings: [
      { item: 'ball-joints', status: 'broken', note: 'Lower joint separated, left front; wheel tucked under' },
      { item: 'control-arms', status: 'broken', note: 'Left lower arm bent where the joint let go' },
      { item: 'tie-rods', status: 'worn' },
      { item: 'wheels', status: 'ok' },
    ],
    lines: [
      { item: 'ball-joints', part: 'Lower ball joint (Hollinmark)', quantity: 1, unitPriceCents: 6_450, labourHours: 1.5 },
      { item: 'control-arms', part: 'Lower control arm, left', quantity: 1, unitPriceCents: 11_800, labourHours: 1.5 },
      { part: 'Wheel alignment', quantity: 1, unitPriceCents: 0, labourHours: 1 },
    ],
    salvageValueCents: 70_000,
    valueSource: GUIDE,
    salvageSource: 'Buyer’s offer',
  },
  'Stanmore Haymaker 15': {
    findings: [
      { item: 'front-body', status: 'broken', note: 'Bumper cover torn, hood buckled at the latch' },
      { item: 'headlamps', status: 'broken', note: 'Right lamp smashed' },
      { item: 'cooling', status: 'broken', note: 'Radiator pushed into the fan, leaking' },
      { item: 'frame-rails', status: 'ok', note: 'Hammer test sound both sides' },
      { item: 'engine', status: 'ok' },
    ],
    lines: [
      { item: 'front-body', part: 'Front bumper cover', quantity: 1, unitPriceCents: 41_000, labourHours: 2 },
      { item: 'headlamps', part: 'Headlamp unit, right', quantity: 1, unitPriceCents: 26_500, labourHours: 0.5 },
      { item: 'cooling', part: 'Radiator (Teal Ridge)', quantity: 1, unitPriceCents: 33_000, labourHours: 3 },
      { part: 'Coolant, gallon', quantity: 2, unitPriceCents: 1_899, labourHours: 0 },
    ],
    salvageValueCents: 160_000,
    valueSource: 'Insurer’s valuation',
    salvageSource: 'Buyer’s offer',
  },
  'Nordsund S6': {
    findings: [
      { item: 'front-body', status: 'broken', note: 'Front end pushed back to the strut towers' },
      { item: 'struts-shocks', status: 'broken', note: 'Left strut bent' },
      { item: 'drive-shafts', status: 'broken', note: 'Left shaft pulled out of the hub' },
      { item: 'frame-rails', status: 'broken', note: 'Left rail kinked behind the bumper mount' },
      { item: 'windshield', status: 'broken' },
    ],
    lines: [
      { item: 'frame-rails', part: 'Frame rail repair section, left', quantity: 1, unitPriceCents: 64_000, labourHours: 12 },
      { item: 'front-body', part: 'Front bumper cover, hood and fender', quantity: 1, unitPriceCents: 138_000, labourHours: 6 },
      { item: 'struts-shocks', part: 'Strut assembly, left front', quantity: 1, unitPriceCents: 21_500, labourHours: 1.5 },
      { item: 'drive-shafts', part: 'Drive shaft, left front', quantity: 1, unitPriceCents: 31_000, labourHours: 2 },
      { item: 'windshield', part: 'Windshield', quantity: 1, unitPriceCents: 36_000, labourHours: 1.5 },
    ],
    salvageValueCents: 90_000,
    valueSource: GUIDE,
    salvageSource: 'Parts resale',
  },
  'Marrow Homestead': {
    findings: [
      { item: 'engine', status: 'broken', note: 'Knocks at idle, oil full of metal' },
      { item: 'fluid-leaks', status: 'worn', note: 'Oil weeping from the rear main seal' },
      { item: 'spring-hangers', status: 'worn', note: 'Surface rust; hammer test sound' },
      { item: 'tyres', status: 'ok' },
    ],
    lines: [
      { item: 'engine', part: 'Used engine, low miles (Orrin Flats Salvage)', quantity: 1, unitPriceCents: 275_000, labourHours: 16 },
      { part: 'Gaskets, fluids and filters', quantity: 1, unitPriceCents: 26_500, labourHours: 0 },
    ],
    salvageValueCents: 60_000,
    valueSource: GUIDE,
    salvageSource: 'Scrap weight at today’s price',
  },
}

type Actor = { id: string; name: string }
type Event = Omit<NewHistoryEvent, 'vehicleId'>

export interface DemoTeardown {
  inspection: typeof schema.inspections.$inferInsert
  items: (typeof schema.inspectionItems.$inferInsert)[]
  lines: (typeof schema.inspectionLines.$inferInsert)[]
  events: Event[]
}

/**
 * The demo teardown of one vehicle, or null if it has none: rows for the three tables and the
 * history entries the API would have written, spread over the 40 minutes before it was finished.
 * The value entered is the vehicle's own demo value, so its lien clocks stay as they are.
 */
export function demoTeardown(v: DemoVehicle, vehicleId: string, valueCents: number, labourRateCents: number, finishedAt: Date, tech: Actor): DemoTeardown | null {
  const demo = BY_VEHICLE[`${v.make} ${v.model}`]
  if (!demo) return null
  const id = randomUUID()
  let minute = -40
  const at = () => new Date(finishedAt.getTime() + minute++ * 60_000)
  const by = { actorId: tech.id, actorLabel: tech.name }
  const startedAt = at()
  const safetyAt = at()
  const events: Event[] = [
    { ...by, kind: 'inspection_started', at: startedAt, after: { inspectionId: id, reinspection: false } },
    { ...by, kind: 'safety_acknowledged', at: safetyAt, after: { inspectionId: id, cautions: CAUTIONS.map((c) => c.text) } },
  ]
  const items = demo.findings.map((f) => {
    const updatedAt = at()
    events.push({ ...by, kind: 'inspection_item_marked', at: updatedAt, after: { inspectionId: id, item: f.item, name: itemName(f.item), status: f.status, note: f.note ?? null } })
    return { inspectionId: id, itemCode: f.item, status: f.status, note: f.note ?? null, updatedById: tech.id, updatedAt }
  })
  const lines = demo.lines.map((l) => {
    const createdAt = at()
    const row = { id: randomUUID(), inspectionId: id, itemCode: l.item ?? null, part: l.part, quantity: l.quantity, unitPriceCents: l.unitPriceCents, labourHundredths: hoursToHundredths(l.labourHours)!, labourRateCents, createdById: tech.id, createdAt }
    events.push({ ...by, kind: 'estimate_line_added', at: createdAt, after: { inspectionId: id, lineId: row.id, part: l.part, quantity: l.quantity, unitPriceCents: l.unitPriceCents, labourHours: l.labourHours, labourRateCents } })
    return row
  })
  const rolls = v.rolls ?? true
  events.push({ ...by, kind: 'roll_ability_marked', at: at(), after: { inspectionId: id, rolls, steers: rolls, brakes: rolls } })
  const values = { actualCashValueCents: valueCents, actualCashValueSource: demo.valueSource, salvageValueCents: Math.min(demo.salvageValueCents, valueCents), salvageValueSource: demo.salvageSource }
  const valuesAt = at()
  events.push({ ...by, kind: 'vehicle_values_entered', at: valuesAt, after: { inspectionId: id, ...values, estimatedValueCents: valueCents } })
  const found = (status: FindingStatus) => demo.findings.filter((f) => f.status === status).map((f) => f.item)
  const pickupNeeds = pickupBadge({ rolls, steers: rolls, brakes: rolls, keys: v.keys })?.label ?? null
  events.push({ ...by, kind: 'inspection_finished', at: finishedAt, after: { inspectionId: id, broken: found('broken'), worn: found('worn'), estimateCents: estimateTotals(lines).totalCents, pickupNeeds } })
  return {
    inspection: { id, vehicleId, startedById: tech.id, startedAt, safetyAcknowledgedById: tech.id, safetyAcknowledgedAt: safetyAt, ...values, valuesEnteredById: tech.id, valuesEnteredAt: valuesAt, finishedById: tech.id, finishedAt },
    items,
    lines,
    events,
  }
}

/** The rows of every demo teardown, one statement per table (the demo must load within the start-up budget). */
export async function insertDemoTeardowns(db: Database, teardowns: (DemoTeardown | null)[]): Promise<void> {
  const all = teardowns.filter((x): x is DemoTeardown => x !== null)
  if (all.length === 0) return
  await db.insert(schema.inspections).values(all.map((x) => x.inspection))
  await db.insert(schema.inspectionItems).values(all.flatMap((x) => x.items))
  await db.insert(schema.inspectionLines).values(all.flatMap((x) => x.lines))
}

/** A vehicle's demo history with its teardown's entries in time order, ready to be chained. */
export function withTeardown(events: Event[], teardown: DemoTeardown | null): Event[] {
  if (!teardown) return events
  return [...events, ...teardown.events].sort((a, b) => a.at!.getTime() - b.at!.getTime())
}
