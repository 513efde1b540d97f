import { z } from 'zod'
import { ruleSetTitleSchema } from './rule-sets'
import { DISPOSITIONS, VEHICLE_STATES } from '../domain/lifecycle/columns'
import { TOW_REASONS } from '../domain/tow/tow-reasons'
import { vehicleSummarySchema } from './charges'
import { fileRecordSchema } from './files'
import { historyEventSchema } from './history'
import { holdRecordSchema } from './holds'
import { towLineSchema } from './tows'
import { KEYS } from './vehicles'

const text = z.string().nullable()
const when = z.string().nullable()

export const vehicleRecordSchema = z.object({
  id: z.uuid(),
  stockNumber: z.string(),
  state: z.enum(VEHICLE_STATES),
  disposition: z.enum(DISPOSITIONS).nullable(),
  version: z.number(),
  arrivedAt: z.string(),
  closedAt: when,
  vin: text,
  vinOverrideReason: text,
  plate: text,
  plateState: text,
  year: z.number().nullable(),
  make: text,
  model: text,
  colour: text,
  body: text,
  vehicleClass: z.string(),
  vehicleClassLabel: z.string(),
  /** The class's label in Spanish, where the rule set has it. */
  es: z.object({ vehicleClassLabel: z.string().optional() }).optional(),
  odometer: z.number().nullable(),
  odometerUnreadable: z.boolean(),
  keys: z.enum(KEYS),
  keysWhere: text,
  drivableAsFound: z.boolean().nullable(),
  ownerName: text,
  /** The value the lien clocks branch on, and where it came from; null until someone records it. */
  estimatedValueCents: z.number().nullable(),
  estimatedValueSource: text,
  rolls: z.boolean().nullable(),
  steers: z.boolean().nullable(),
  brakes: z.boolean().nullable(),
  conditionNotes: text,
  checkedBy: z.object({ id: z.uuid(), name: z.string() }).nullable(),
  space: z.object({ id: z.uuid(), label: z.string() }).nullable(),
})
export type VehicleRecord = z.infer<typeof vehicleRecordSchema>

export const towRecordSchema = z.object({
  pickupLat: z.number().nullable(),
  pickupLng: z.number().nullable(),
  pickupAddress: text,
  reason: z.enum(TOW_REASONS),
  reasonNote: text,
  requesterName: text,
  requesterAgency: text,
  requesterReference: text,
  calledAt: when,
  hookedAt: when,
  arrivedAt: z.string(),
  truck: text,
  driver: text,
  straightMiles: z.number().nullable(),
  roadMiles: z.number().nullable(),
  winchingUnits: z.number(),
  dollies: z.boolean(),
  afterHours: z.boolean(),
  chargeCents: z.number(),
  chargeLines: z.array(towLineSchema),
})
export type TowRecord = z.infer<typeof towRecordSchema>

export const vehiclePageSchema = z.object({
  vehicle: vehicleRecordSchema,
  tow: towRecordSchema.nullable(),
  yard: z.object({ name: z.string(), code: z.string(), timeZone: z.string(), lat: z.number(), lng: z.number() }),
  ruleSet: ruleSetTitleSchema.extend({ version: z.number() }).nullable(),
  holds: z.array(holdRecordSchema),
  files: z.array(fileRecordSchema),
  property: z.array(z.object({ id: z.uuid(), item: z.string(), location: text, count: z.number() })),
  history: z.array(historyEventSchema),
  /** The running bill and next legal date (server/charges); null when no rule set can bill it. */
  summary: vehicleSummarySchema.nullable(),
  /** Why no bill could be worked out for this record, in the core's words (then `summary` is null). */
  billProblem: z.string().nullable(),
})
export type VehiclePage = z.infer<typeof vehiclePageSchema>
