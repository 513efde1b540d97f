import { z } from 'zod'
import { normalizeVin, vin as readVin } from '../domain/vehicle/vin'
import { formatCents } from '../domain/billing/money'
import { alongsideFieldIssues, optionalInt, optionalText, requiredText, text } from './fields'
import { msg } from './field-messages'

export const KEYS = ['yes', 'no', 'unknown'] as const
export const KEYS_LABELS: Record<(typeof KEYS)[number], string> = { yes: 'Yes', no: 'No', unknown: 'Not known' }

/** Words the trade uses for a body; the field takes any text, these are offered first. */
export const BODY_TYPES = ['Sedan', 'Coupe', 'Hatchback', 'Wagon', 'SUV', 'Pickup', 'Van', 'Motorcycle', 'Box truck', 'Trailer', 'Motor home']

const latestModelYear = () => new Date().getFullYear() + 2

/** A rule-set class code such as "standard" or "heavy". */
export const vehicleClassCode = z
  .string({ error: msg('vehicles.chooseClassForBilling', 'Choose the class for billing.') })
  .regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, msg('vehicles.chooseClassForBilling', 'Choose the class for billing.'))

/** The vehicle as found: identity, class for billing, odometer, keys. */
export const vehicleSchema = z
  .object({
    vin: text().max(40, msg('common.vinHas17Characters', 'A VIN has 17 characters.')).nullish().transform((v) => (v ? normalizeVin(v) || null : null)),
    /** Why a missing or failing VIN is recorded anyway (plate-only, damaged or unreadable VIN plate). */
    vinOverrideReason: optionalText(200),
    plate: optionalText(12).transform((v) => v?.toUpperCase() ?? null),
    plateState: z
      .string()
      .trim()
      .toUpperCase()
      .nullish()
      .transform((v) => v || null)
      .refine((v) => v === null || /^[A-Z]{2,3}$/.test(v), msg('vehicles.useTwoLetterState', 'Use the two-letter state code, e.g. CA.')),
    year: optionalInt(1900, latestModelYear(), 'year'),
    make: requiredText(40, msg('vehicles.enterMakeUnknown', 'Enter the make, or "Unknown".')),
    model: optionalText(60),
    colour: requiredText(30, msg('vehicles.enterColour', 'Enter the colour.')),
    body: optionalText(30),
    vehicleClass: vehicleClassCode,
    odometer: optionalInt(0, 3_000_000, 'odometer'),
    odometerUnreadable: z.boolean().default(false),
    keys: z.enum(KEYS, { error: msg('vehicles.sayWhetherKeysCame', 'Say whether the keys came with it.') }),
    keysWhere: optionalText(120),
    drivableAsFound: z.boolean().nullish().transform((v) => v ?? null),
    ownerName: optionalText(120),
  })
  .superRefine(
    (v, ctx) => {
      for (const issue of vinIssues(v)) ctx.addIssue({ code: 'custom', ...issue })
      if (v.odometerUnreadable !== true && v.odometer == null) {
        ctx.addIssue({ code: 'custom', path: ['odometer'], message: msg('vehicles.enterOdometerReadingMark', 'Enter the odometer reading, or mark it "Not readable".') })
      }
    },
    alongsideFieldIssues,
  )
  // A reading and "not readable" together would say two things; the box wins.
  .transform((v) => (v.odometerUnreadable ? { ...v, odometer: null } : v))
export type VehicleInput = z.input<typeof vehicleSchema>
export type Vehicle = z.output<typeof vehicleSchema>

const FIRST_17_CHARACTER_YEAR = 1981

type VinFields = { vin: string | null; vinOverrideReason: string | null; year: number | null; vehicleClass: string }

/**
 * A VIN that fails its check (49 CFR 565) is refused unless the dispatcher says why it is recorded
 * as read; no VIN at all needs the same reason (plate-only, VIN plate missing or burnt).
 */
export function vinIssues(fields: VinFields): { path: string[]; message: string }[] {
  // The fields may not have parsed yet (alongsideFieldIssues): anything not of its type counts as empty.
  const v = {
    vin: typeof fields.vin === 'string' ? fields.vin : null,
    vinOverrideReason: typeof fields.vinOverrideReason === 'string' ? fields.vinOverrideReason : null,
    year: typeof fields.year === 'number' ? fields.year : null,
    vehicleClass: fields.vehicleClass,
  }
  const override = v.vinOverrideReason !== null
  if (v.vin === null) {
    return override ? [] : [{ path: ['vin'], message: msg('vehicles.enterVinGiveReason', 'Enter the VIN, or give the reason it cannot be read (plate-only, VIN plate missing or damaged).') }]
  }
  const reading = readVin(v.vin, v.vehicleClass === 'heavy' ? 'heavy-or-trailer' : 'light')
  if (!reading.ok) {
    const problem = reading.problems[0]!
    // `problemCode` and the problem's own parameters let a reader's language word the problem too (vin.problems in shared/messages).
    const params = { problem: problem.message, problemCode: problem.code, ...problem.params }
    return override ? [] : [{ path: ['vin'], message: msg('vehicles.vinProblem', `${problem.message} Correct it, or record it as read and give the reason.`, params) }]
  }
  // 49 CFR 565 has required 17 characters since model year 1981: a shorter VIN on a newer vehicle is a misread.
  if (!override && reading.normalized.length < 17 && (v.year === null || v.year >= FIRST_17_CHARACTER_YEAR)) {
    const n = reading.normalized.length
    return [
      {
        path: ['vin'],
        message:
          v.year === null
            ? msg('vehicles.vinShortNoYear', `This VIN has ${n} characters, not 17. Only vehicles made before 1981 have shorter VINs: enter the model year, correct the VIN, or record it as read and give the reason.`, { n })
            : msg('vehicles.vinShortForYear', `A ${v.year} vehicle has a 17-character VIN; this one has ${n}. Correct it, or record it as read and give the reason.`, { year: v.year, n }),
      },
    ]
  }
  const vinYear = reading.modelYear?.readable ? reading.modelYear.year : undefined
  if (!override && vinYear !== undefined && v.year !== null && v.year !== vinYear) {
    return [{ path: ['year'], message: msg('vehicles.vinYearDiffers', `The VIN gives model year ${vinYear}, not ${v.year}. Correct the year or the VIN.`, { vinYear, year: v.year }) }]
  }
  return []
}

export const propertyItemSchema = z.object({
  item: requiredText(120, msg('vehicles.nameItem', 'Name the item.')),
  location: optionalText(80),
  count: z.number({ error: msg('common.enterHowMany', 'Enter how many.') }).int(msg('vehicles.enterWholeNumber', 'Enter a whole number.')).min(1, msg('vehicles.atLeastOne', 'At least one.')).max(999).default(1),
})
export type PropertyItemInput = z.input<typeof propertyItemSchema>

/** The condition at intake and who checked it: the first link of the chain of custody. */
export const conditionSchema = z.object({
  damageNotes: optionalText(2000),
  checkedById: z.uuid({ error: msg('vehicles.chooseWhoCheckedVehicle', 'Choose who checked the vehicle.') }),
  property: z.array(propertyItemSchema).max(100, msg('vehicles.atMost100Items', 'At most 100 items; group small ones.')).default([]),
})
export type ConditionInput = z.input<typeof conditionSchema>

/** The one route parameter that names a vehicle: `/api/vehicles/:vehicleId/…`. */
export const vehicleParamsSchema = z.object({ vehicleId: z.uuid({ error: msg('common.thatNotVehicleId', 'That is not a vehicle id.') }) })

/** The most a vehicle's recorded value may be: $10,000,000 (a typing slip, not a vehicle, beyond it). */
export const MAX_VEHICLE_VALUE_CENTS = 1_000_000_000

/** Where a value usually comes from; the field takes any words, these are offered first. */
export const VALUE_SOURCES = ['Price guide', 'Appraisal', 'The inspection', 'Public agency’s estimate'] as const

/**
 * The vehicle's value for the lien clocks, and where it came from, recorded outside any inspection
 * (PUT /api/vehicles/:vehicleId/value). $0 is a value: a hulk worth nothing still takes the low-value branch.
 */
export const vehicleValueSchema = z.object({
  version: z.number({ error: msg('common.reloadVehicleTryAgain', 'Reload the vehicle and try again.') }).int().positive(),
  valueCents: z
    .number({ error: msg('vehicles.enterVehicleValue', "Enter the vehicle's value.") })
    .int(msg('vehicles.enterVehicleValueWhole', "Enter the vehicle's value in whole cents."))
    .min(0, msg('vehicles.vehicleValueCannotNegative', "The vehicle's value cannot be negative."))
    .max(MAX_VEHICLE_VALUE_CENTS, msg('vehicles.valueAtMost', `The vehicle's value cannot be more than ${formatCents(MAX_VEHICLE_VALUE_CENTS).replace(/\.00$/, '')}.`, { max: formatCents(MAX_VEHICLE_VALUE_CENTS).replace(/\.00$/, '') })),
  source: requiredText(200, msg('vehicles.sayWhereValueCame', 'Say where the value came from (a price guide, an appraisal, the inspection).')),
})
export type VehicleValueInput = z.input<typeof vehicleValueSchema>

export const vehicleValueReplySchema = z.object({
  version: z.number(),
  valueCents: z.number(),
  source: z.string(),
})
export type VehicleValueReply = z.infer<typeof vehicleValueReplySchema>
