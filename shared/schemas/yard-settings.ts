import { z } from 'zod'
import { SPACE_SIZES } from '../domain/vehicle/space-fit'
import { isTimeZone } from '../domain/time/local-time'
import { text } from './fields'
import { towRatesSchema } from './tows'
import { type FieldWhat, msg, whatWords } from './field-messages'

const cents = (what: FieldWhat, { words } = whatWords(what)) =>
  z
    .number({ error: msg('yardSettings.enterInCents', `Enter ${words} in cents.`, { what }) })
    .int(msg('common.enterInWholeCents', `Enter ${words} in whole cents.`, { what }))
    .nonnegative(msg('yardSettings.cannotBeNegative', `${words} cannot be negative.`, { what }))

/** What a manager sets for a yard in Settings → Yards (the stock-number prefix is `code`). */
export const yardFieldsSchema = z.object({
  name: text().trim().min(1, msg('yardSettings.giveYardName', 'Give the yard a name.')).max(120),
  code: z
    .string()
    .trim()
    .toUpperCase()
    .regex(/^[A-Z]{2,4}$/, msg('yardSettings.use24Letters', 'Use 2 to 4 letters: they start every stock number (e.g. TC-2026-00041).')),
  address: text().trim().min(1, msg('yardSettings.enterYardAddress', 'Enter the yard address.')).max(300),
  phone: text().trim().max(40).nullish(),
  lat: z.number({ error: msg('yardSettings.placeYardMap', 'Place the yard on the map.') }).min(-90).max(90),
  lng: z.number({ error: msg('yardSettings.placeYardMap', 'Place the yard on the map.') }).min(-180).max(180),
  timeZone: z.string().refine(isTimeZone, msg('yardSettings.useIanaTimeZone', 'Use an IANA time zone such as America/Chicago.')),
  labourRateCents: cents('labourRate'),
  towRates: towRatesSchema.strict(),
})
export type YardFields = z.infer<typeof yardFieldsSchema>

/** A block of spaces: rows (A, B, … from `firstRow`) × numbers 1…perRow, all of one size. */
export const spaceBlockSchema = z.object({
  firstRow: z
    .string()
    .trim()
    .toUpperCase()
    .regex(/^[A-Z]$/, msg('yardSettings.startRowsAtLetter', 'Start the rows at a letter, A to Z.'))
    .default('A'),
  rows: z.number({ error: msg('yardSettings.enterHowManyRows', 'Enter how many rows.') }).int().min(1, msg('yardSettings.atLeastOneRow', 'At least one row.')).max(26, msg('yardSettings.atMost26Rows', 'At most 26 rows (A to Z).')),
  perRow: z.number({ error: msg('yardSettings.enterHowManySpaces', 'Enter how many spaces a row has.') }).int().min(1, msg('yardSettings.atLeastOneSpace', 'At least one space a row.')).max(200, msg('yardSettings.atMost200Spaces', 'At most 200 spaces a row.')),
  size: z.enum(SPACE_SIZES).default('standard'),
})
export type SpaceBlock = z.infer<typeof spaceBlockSchema>

export const newYardSchema = yardFieldsSchema.extend({
  ruleSet: z.string().min(1).max(80).default('california-sample'),
  spaces: spaceBlockSchema.optional(),
})
export type NewYard = z.infer<typeof newYardSchema>

/**
 * The rule set a new yard starts from, among the ids offered (the shipped samples, and in Settings the
 * company's own too): the page and the server judge the choice with the same list, so an id nobody
 * offered is a 400 naming `ruleSet` before anything is written.
 */
export const ruleSetChoice = (ids: readonly string[]) =>
  z
    .string({ error: msg('yardSettings.chooseRuleSet', 'Choose the rule set the yard starts from.') })
    .refine((id) => ids.includes(id), msg('yardSettings.unknownRuleSet', 'Choose one of the rule sets listed.'))
    .default('california-sample')

/** Adding a yard in Settings, with the rule sets this company may start it from. */
export const newYardWith = (ruleSetIds: readonly string[]) => newYardSchema.extend({ ruleSet: ruleSetChoice(ruleSetIds) })

export const editYardSchema = yardFieldsSchema.partial().refine((v) => Object.keys(v).length > 0, msg('yardSettings.changeAtLeastOne', 'Change at least one value.'))
export type EditYard = z.infer<typeof editYardSchema>

export const yardSettingsSpaceSchema = z.object({
  id: z.uuid(),
  label: z.string(),
  row: z.string(),
  number: z.number(),
  size: z.enum(SPACE_SIZES),
  retired: z.boolean(),
  occupant: z.string().nullable(),
})

export const yardSettingsSchema = yardFieldsSchema.extend({
  id: z.uuid(),
  phone: z.string().nullable(),
  ruleSetName: z.string().nullable(),
  /** The rule set's name in Spanish, where it has one. */
  es: z.object({ ruleSetName: z.string() }).optional(),
  spaces: z.array(yardSettingsSpaceSchema),
})
export type YardSettings = z.infer<typeof yardSettingsSchema>
export const yardSettingsListSchema = z.object({ yards: z.array(yardSettingsSchema) })

export const yardParamsSchema = z.object({ yardId: z.uuid() })
export const spaceParamsSchema = z.object({ yardId: z.uuid(), spaceId: z.uuid() })
