import { z } from 'zod'
import { policeNoticeClockSchema } from './police-notices'
import { policeNoticeSchema, ruleSetTitleSchema } from './rule-sets'
import { optionalText, text } from './fields'
import { holdInputSchema } from './holds'
import { towRatesSchema, towSchema } from './tows'
import { conditionSchema, vehicleSchema } from './vehicles'
import { msg } from './field-messages'

/** Everything the dispatcher records when a vehicle comes through the gate; photos travel beside it. */
export const towInSchema = z.object({
  tow: towSchema,
  vehicle: vehicleSchema,
  holds: z.array(holdInputSchema).max(10, msg('towIn.atMost10Holds', 'At most 10 holds.')).default([]),
  condition: conditionSchema,
  spaceId: z.uuid({ error: msg('common.chooseSpaceFromList', 'Choose a space from the list.') }).nullish().transform((v) => v ?? null),
  /** Why this is logged although a vehicle with the same VIN or plate is still in the yard (a 409 asks). */
  duplicateReason: optionalText(300),
})

/** The 409 a tow-in gets when it looks like a vehicle already on the lot: which ones, and what matched. */
export const duplicateTowInSchema = z.object({
  error: z.string(),
  duplicates: z.array(z.object({ id: z.uuid(), stockNumber: z.string(), matches: z.array(z.enum(['vin', 'plate'])) })).min(1),
})
export type TowInInput = z.input<typeof towInSchema>
export type TowIn = z.output<typeof towInSchema>

export const towInCreatedSchema = z.object({
  id: z.uuid(),
  stockNumber: z.string(),
  /** The police-notification clock this tow starts (a private-property tow), shown to the dispatcher at once. */
  policeNotice: policeNoticeClockSchema.nullish(),
})

/** What the tow-in form offers: the yard (for distance and charge), billing classes, staff, spaces. */
export const intakeOptionsSchema = z.object({
  yard: z.object({
    id: z.uuid(),
    name: z.string(),
    code: z.string(),
    lat: z.number(),
    lng: z.number(),
    timeZone: z.string(),
    towRates: towRatesSchema,
    /** False until a manager sets the yard's tow rates: the charge shows as not set, not as $0. */
    ratesSet: z.boolean(),
  }),
  ruleSet: ruleSetTitleSchema.nullable(),
  /** The rule set's duty to tell the police of some tows, shown as soon as such a reason is chosen. */
  policeNotice: policeNoticeSchema.nullish(),
  vehicleClasses: z.array(z.object({ code: z.string(), label: z.string(), es: z.object({ label: z.string().optional() }).optional() })),
  staff: z.array(z.object({ id: z.uuid(), name: z.string(), role: z.string() })),
})
export type IntakeOptions = z.infer<typeof intakeOptionsSchema>

/** A correction names the version it was made against and why; only the fields that differ are recorded. */
export const correctVehicleSchema = z.object({
  version: z.number().int().positive(),
  reason: text({ error: msg('towIn.sayWhyRecordCorrected', 'Say why the record is corrected.') }).trim().min(3, msg('towIn.sayWhyRecordCorrected', 'Say why the record is corrected.')).max(500),
  vehicle: vehicleSchema.optional(),
  tow: towSchema.optional(),
  conditionNotes: text().trim().max(2000).nullish().transform((v) => v || null).optional(),
})
export type CorrectVehicleInput = z.input<typeof correctVehicleSchema>
