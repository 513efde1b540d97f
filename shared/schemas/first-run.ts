import { z } from 'zod'
import { text } from './fields'
import { createUserSchema, passwordSchema } from './users'
import { spaceBlockSchema, yardFieldsSchema } from './yard-settings'
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

export { firstRunStateSchema, type FirstRunState } from './first-run-state'
