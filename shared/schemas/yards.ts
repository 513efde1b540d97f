import { z } from 'zod'
import { text } from './fields'
import { yardFieldsSchema } from './yard-settings'
import { msg } from './field-messages'

/** A yard as the first-run CLI sets it up: Settings → Yards' own fields, the position typed as text, and a sample rule set. */
export const yardSetupSchema = yardFieldsSchema.pick({ name: true, code: true, address: true, timeZone: true }).extend({
  phone: text().trim().max(40).optional(),
  lat: z.coerce.number().min(-90).max(90),
  lng: z.coerce.number().min(-180).max(180),
  ruleSet: z.string().min(1).default('california-sample'),
})
export type YardSetup = z.infer<typeof yardSetupSchema>

/** GET /api/yards/current: the yard the signed-in staff member works in, as the client shows it. */
export const currentYardSchema = z.object({
  yard: z.object({ id: z.uuid(), name: z.string(), code: z.string(), timeZone: z.string() }),
})
export type CurrentYard = z.infer<typeof currentYardSchema>['yard']

/** GET /api/yards/mine: the yards the signed-in person belongs to (the top bar's chooser) and the one chosen. */
export const myYardsSchema = z.object({
  yards: z.array(z.object({ id: z.uuid(), name: z.string(), code: z.string(), timeZone: z.string() })),
  currentId: z.uuid().nullable(),
})
export type MyYards = z.infer<typeof myYardsSchema>

/** PUT /api/yards/current: work in another of one's yards (remembered per person). */
export const chooseYardSchema = z.object({ yardId: z.uuid({ error: msg('common.chooseOneYourYards', 'Choose one of your yards.') }) })
export type ChooseYard = z.infer<typeof chooseYardSchema>
