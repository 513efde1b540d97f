// What the technician finds on the demo vehicles past Teardown, matching their intake notes. Every
// part, price and figure is invented; the estimate's labour is priced at the demo yard's rate by the
// estimate service itself. Vehicles without their own teardown here get a short walk-round.
import type { FindingStatus } from '@shared/domain/inspection'
import type { DemoVehicle } from './vehicles'

export interface DemoInspection {
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

/** The demo teardown of one vehicle: its own when it has one, else a short walk-round by its tow reason. */
export function demoInspection(v: DemoVehicle, valueCents: number): DemoInspection {
  const own = BY_VEHICLE[`${v.make} ${v.model}`]
  if (own) return own
  const walkRound: DemoInspection['findings'] =
    v.reason === 'accident'
      ? [{ item: 'front-body', status: 'broken', note: 'Front bumper cover cracked' }, { item: 'headlamps', status: 'ok' }, { item: 'tyres', status: 'ok' }]
      : v.reason === 'breakdown'
        ? [{ item: 'engine', status: 'worn', note: 'Will not start; owner reports it died on the road' }, { item: 'tyres', status: 'ok' }, { item: 'brakes-front', status: 'ok' }]
        : [{ item: 'tyres', status: 'ok' }, { item: 'brakes-front', status: 'ok' }, { item: 'headlamps', status: 'ok' }]
  return { findings: walkRound, lines: [], salvageValueCents: Math.round(valueCents / 4), valueSource: GUIDE, salvageSource: 'Scrap weight at today’s price' }
}
