import { z } from 'zod'
import { text } from './fields'
import { createUserSchema, passwordSchema } from './users'
import { ruleSetChoice, spaceBlockSchema, yardFieldsSchema } from './yard-settings'
import { msg } from './field-messages'

/**
 * POST /api/first-run: a fresh install's first manager sets up the company, its first yard and its
 * spaces (rows A… × numbers 1…), and their own account — the same rules as Settings → Yards and as
 * adding a person on the Staff page. Flat, so each refusal names the form's own field.
 */
export const firstRunSchema = z.object({
  companyName: text().trim().min(1, msg('firstRun.enterCompanyName', 'Enter the company name.')).max(120, msg('firstRun.keepCompanyNameUnder', 'Keep the company name under 120 characters.')),
  yardName: yardFieldsSchema.shape.name,
  code: yardFieldsSchema.shape.code,
  address: yardFieldsSchema.shape.address,
  lat: yardFieldsSchema.shape.lat,
  lng: yardFieldsSchema.shape.lng,
  timeZone: yardFieldsSchema.shape.timeZone,
  ruleSet: z.string().min(1).max(80).default('california-sample'),
  rows: spaceBlockSchema.shape.rows,
  perRow: spaceBlockSchema.shape.perRow,
  name: createUserSchema.shape.name,
  email: createUserSchema.shape.email,
  password: passwordSchema,
})
export type FirstRun = z.input<typeof firstRunSchema>

/** The first run as sent, with the sample rule sets this install ships: any other id is refused naming `ruleSet`. */
export const firstRunWith = (sampleIds: readonly string[]) => firstRunSchema.extend({ ruleSet: ruleSetChoice(sampleIds) })

/** A shipped sample a first yard may start from, with its own caution (and the Spanish of its name and caution). */
export const sampleChoiceSchema = z.object({
  id: z.string(),
  name: z.string(),
  jurisdiction: z.string(),
  timeZone: z.string(),
  caution: z.string(),
  cautionEs: z.string().nullable(),
  nameEs: z.string().nullable(),
})
export type SampleChoice = z.infer<typeof sampleChoiceSchema>

/**
 * GET /api/first-run/choices: the samples to start from, and where the first-run map gets its tiles and
 * addresses and where it opens (no yard exists yet to centre it on).
 */
export const firstRunChoicesSchema = z.object({
  ruleSets: z.array(sampleChoiceSchema),
  map: z.object({
    tileUrl: z.string(),
    tileAttribution: z.string(),
    maxZoom: z.number(),
    geocoderUrl: z.string(),
    start: z.object({ lat: z.number(), lng: z.number(), zoom: z.number() }),
  }),
})
export type FirstRunChoices = z.infer<typeof firstRunChoicesSchema>

export { firstRunStateSchema, type FirstRunState } from './first-run-state'
