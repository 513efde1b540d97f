import { z } from 'zod'
import { normalizeVin, vin as readVin } from '../domain/vehicle/vin'
import { msg } from './field-messages'

/** Where decoded values come from, said beside them wherever they are shown. */
export const VPIC_SOURCE = 'NHTSA vPIC'

/**
 * A VIN worth decoding: seventeen legal characters (the decoder's database adapter pastes its
 * parameters into SQL, so nothing else may reach it) with a correct check digit — 49 CFR 565
 * decides validity, and a VIN that fails it is not decoded as if it were fine.
 */
export const vinDecodeParamsSchema = z.object({
  vin: z
    .string({ error: msg('vinDecode.enterVinDecode', 'Enter the VIN to decode.') })
    .max(40, msg('common.vinHas17Characters', 'A VIN has 17 characters.'))
    .transform(normalizeVin)
    .pipe(z.string().regex(/^[A-HJ-NPR-Z0-9]{17}$/, msg('vinDecode.only17CharacterVin', 'Only a 17-character VIN can be decoded: letters and digits, never I, O or Q.')))
    .superRefine((v, ctx) => {
      const problem = readVin(v).problems.find((p) => p.code === 'check-digit')
      if (problem) ctx.addIssue({ code: 'custom', message: problem.message })
    }),
})

/** A GVWR class as vPIC publishes it: a band of pounds, e.g. Class 2F, 7,001–8,000 lb. */
export const gvwrSchema = z.object({
  /** "2F", or "2E–2F" when vPIC gives the rating as a range of classes. */
  class: z.string(),
  fromLb: z.number().int().nonnegative(),
  /** Null for the open top class (Class 8, 33,001 lb and above). */
  toLb: z.number().int().positive().nullable(),
})
export type Gvwr = z.infer<typeof gvwrSchema>

/** What vPIC says about a VIN; every field may be missing, and none of it overrules the dispatcher. */
export const vinDecodeSchema = z.object({
  vin: z.string(),
  /** False when vPIC knows no manufacturer for the first three characters (the WMI). */
  found: z.boolean(),
  wmi: z.string(),
  manufacturer: z.string().nullable(),
  make: z.string().nullable(),
  model: z.string().nullable(),
  modelYear: z.number().int().nullable(),
  /** vPIC's own words, e.g. "Sport Utility Vehicle (SUV)/Multi-Purpose Vehicle (MPV)". */
  bodyClass: z.string().nullable(),
  /** The same as a short word for the Body field, e.g. "SUV". */
  body: z.string().nullable(),
  vehicleType: z.string().nullable(),
  gvwr: gvwrSchema.nullable(),
  source: z.literal(VPIC_SOURCE),
})
export type VinDecode = z.infer<typeof vinDecodeSchema>
