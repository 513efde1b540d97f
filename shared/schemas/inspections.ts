import { z } from 'zod'
import { ruleSetTitleSchema } from './rule-sets'
import { holdRecordSchema } from './holds'
import { VEHICLE_STATES } from '../domain/lifecycle/columns'
import { FINDING_STATUSES, ITEM_CODES } from '../domain/inspection/inspection-checklist'
import { hoursToHundredths, LIMITS } from '../domain/inspection/inspection-estimate'
import { formatCents } from '../domain/billing/money'
import { optionalText, requiredText } from './fields'
import { fileRecordSchema } from './files'
import { type FieldWhat, msg, whatWords } from './field-messages'

const dollars = (cents: number) => formatCents(cents).replace(/\.00$/, '')

// ---- requests ----

export const itemCodeSchema = z.enum(ITEM_CODES as [string, ...string[]], { error: msg('inspections.thatNotItemChecklist', 'That is not an item on the checklist.') })

export const itemFindingSchema = z.object({
  status: z.enum(FINDING_STATUSES, { error: msg('inspections.chooseOkWornBroken', 'Choose OK, worn, broken or not checked.') }),
  note: optionalText(500),
})
export type ItemFinding = z.input<typeof itemFindingSchema>

const priceCents = (what: FieldWhat, max: number, { words, Words } = whatWords(what)) =>
  z
    .number({ error: msg('common.enterWhat', `Enter ${words}.`, { what }) })
    .int(msg('common.enterInWholeCents', `Enter ${words} in whole cents.`, { what }))
    .min(0, msg('common.cannotBeNegative', `${Words} cannot be negative.`, { what }))
    .max(max, msg('inspections.cannotBeMoreThan', `${Words} cannot be more than ${dollars(max)}.`, { what, max: dollars(max) }))

export const estimateLineSchema = z.object({
  itemCode: itemCodeSchema.nullish().transform((v) => v ?? null),
  part: requiredText(120, msg('inspections.sayWhatPartJob', 'Say what the part or job is.')),
  quantity: z
    .number({ error: msg('common.enterHowMany', 'Enter how many.') })
    .int(msg('inspections.enterHowManyAs', 'Enter how many as a whole number.'))
    .min(1, msg('inspections.quantityAtLeast1', 'The quantity is at least 1.'))
    .max(LIMITS.maxQuantity, msg('inspections.quantityAtMost', `The quantity cannot be more than ${LIMITS.maxQuantity}.`, { max: LIMITS.maxQuantity })),
  unitPriceCents: priceCents('partPrice', LIMITS.maxUnitPriceCents),
  labourHours: z
    .number({ error: msg('inspections.enterLabourHours0', 'Enter the labour hours (0 if none).') })
    .min(0, msg('inspections.labourHoursCannotNegative', 'Labour hours cannot be negative.'))
    .max(LIMITS.maxLabourHours, msg('inspections.labourHoursAtMost', `Labour hours cannot be more than ${LIMITS.maxLabourHours} on one line.`, { max: LIMITS.maxLabourHours }))
    .refine((h) => hoursToHundredths(h) !== undefined, msg('inspections.giveLabourHoursAt', 'Give labour hours to at most two decimals, such as 1.25.')),
})
export type EstimateLineInput = z.input<typeof estimateLineSchema>

const source = (what: FieldWhat) => requiredText(200, msg('inspections.sayWhereFrom', `Say where ${whatWords(what).words} came from.`, { what }))

export const valuesSchema = z
  .object({
    actualCashValueCents: priceCents('vehicleValue', LIMITS.maxValueCents).min(1, msg('inspections.vehicleValueMustMore', "The vehicle's value must be more than $0.")),
    actualCashValueSource: source('value'),
    salvageValueCents: priceCents('salvageValue', LIMITS.maxValueCents),
    salvageValueSource: source('salvageValue'),
  })
  .refine((v) => v.salvageValueCents <= v.actualCashValueCents, {
    message: msg('inspections.salvageValueCannotMore', "The salvage value cannot be more than the vehicle's value."),
    path: ['salvageValueCents'],
  })
export type ValuesInput = z.input<typeof valuesSchema>

const yesNo = (what: FieldWhat) => z.boolean({ error: msg('inspections.answer', `Answer: ${whatWords(what).words}`, { what }) }).optional()

/** Any of the marks, on their own: each tap on the phone saves one. */
export const rollAbilitySchema = z
  .object({
    rolls: yesNo('rolls'),
    steers: yesNo('steers'),
    brakes: yesNo('brakes'),
    keys: yesNo('keys'),
    wheelRefitted: yesNo('wheelRefitted'),
    lugTorqueFtLbf: z
      .number({ error: msg('inspections.enterLugNutTorque', 'Enter the lug-nut torque in ft·lbf.') })
      .int(msg('inspections.enterTorqueWhole', 'Enter the lug-nut torque in whole ft·lbf.'))
      .min(LIMITS.minLugTorqueFtLbf, msg('inspections.torqueBelow', `A lug-nut torque below ${LIMITS.minLugTorqueFtLbf} ft·lbf is not a real figure; check the maker's specification.`, { min: LIMITS.minLugTorqueFtLbf }))
      .max(LIMITS.maxLugTorqueFtLbf, msg('inspections.torqueAbove', `A lug-nut torque above ${LIMITS.maxLugTorqueFtLbf} ft·lbf is not a real figure; check the maker's specification.`, { max: LIMITS.maxLugTorqueFtLbf }))
      .nullish(),
  })
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: msg('inspections.nothingSave', 'Nothing to save.'), path: ['(body)'] })
export type RollAbilityInput = z.input<typeof rollAbilitySchema>

// ---- answers ----

const actorAt = z.object({ by: z.string(), at: z.string() }).nullable()

export const itemViewSchema = z.object({
  code: z.string(),
  status: z.enum(FINDING_STATUSES),
  note: z.string().nullable(),
  photos: z.array(fileRecordSchema),
})

export const lineViewSchema = z.object({
  id: z.uuid(),
  itemCode: z.string().nullable(),
  part: z.string(),
  quantity: z.number(),
  unitPriceCents: z.number(),
  labourHours: z.number(),
  labourRateCents: z.number(),
  partsCents: z.number(),
  labourCents: z.number(),
  totalCents: z.number(),
})
export type LineView = z.infer<typeof lineViewSchema>

const totalsSchema = z.object({ partsCents: z.number(), labourCents: z.number(), totalCents: z.number() })

export const valuesViewSchema = z.object({
  actualCashValueCents: z.number(),
  actualCashValueSource: z.string(),
  salvageValueCents: z.number(),
  salvageValueSource: z.string(),
  entered: actorAt,
})

export const inspectionSchema = z.object({
  id: z.uuid(),
  started: z.object({ by: z.string(), at: z.string() }),
  safetyAcknowledged: actorAt,
  finished: actorAt,
  wheelRefitted: z.boolean().nullable(),
  lugTorqueFtLbf: z.number().nullable(),
  items: z.array(itemViewSchema),
  lines: z.array(lineViewSchema),
  totals: totalsSchema,
  values: valuesViewSchema.nullable(),
})
export type Inspection = z.infer<typeof inspectionSchema>

export const pickupBadgeSchema = z.object({
  equipment: z.array(z.enum(['wheel-lift', 'flatbed', 'dollies-or-skates'])),
  label: z.string(),
  /** The badge and its reasons by code, worded in the reader's language (`label` and `reasons` keep the English). */
  code: z.enum(['wheel-lift', 'flatbed', 'dollies', 'flatbed-or-dollies', 'wheel-lift-dollies', 'flatbed-dollies']).optional(),
  reasons: z.array(z.string()),
  reasonCodes: z.array(z.enum(['no-roll', 'no-steer', 'no-brake', 'no-keys', 'wheel-lift-will-do'])).optional(),
  technicianFirst: z.boolean(),
})

export const recommendationSchema = z.object({
  recommendation: z.enum(['repair', 'salvage']),
  rule: z.enum(['percent-of-value', 'total-loss-formula']),
  numbers: z.object({ estimateCents: z.number(), actualCashValueCents: z.number(), salvageValueCents: z.number(), thresholdCents: z.number() }),
  /** The share of the value that makes a total loss (percent-of-value); the screen words the explanation from the numbers. */
  percent: z.number().optional(),
  explanation: z.array(z.string()),
  source: z.object({ citation: z.string(), confidence: z.string(), note: z.string().optional(), es: z.object({ citation: z.string().optional(), note: z.string().optional() }).optional() }),
})
export type Recommendation = z.infer<typeof recommendationSchema>

export const inspectionPageSchema = z.object({
  vehicle: z.object({
    id: z.uuid(),
    stockNumber: z.string(),
    title: z.string(),
    state: z.enum(VEHICLE_STATES),
    version: z.number(),
    rolls: z.boolean().nullable(),
    steers: z.boolean().nullable(),
    brakes: z.boolean().nullable(),
    keys: z.enum(['yes', 'no', 'unknown']),
    conditionNotes: z.string().nullable(),
  }),
  /** The yard's time zone, for showing when each step was done. */
  timeZone: z.string(),
  /** The yard's rate per hour now; each line keeps the rate it was written at. */
  labourRateCents: z.number(),
  ruleSet: ruleSetTitleSchema.nullable(),
  inspection: inspectionSchema.nullable(),
  recommendation: recommendationSchema.nullable(),
  /** Why there is no recommendation yet, in plain words. */
  recommendationMissing: z.string().nullable(),
  pickup: pickupBadgeSchema.nullable(),
  /** Holds in force: an evidence hold usually means "do not touch", so the teardown shows them and asks first. */
  holds: z.array(holdRecordSchema),
})
export type InspectionPage = z.infer<typeof inspectionPageSchema>
