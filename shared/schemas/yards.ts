import { z } from 'zod'
import { isTimeZone } from '../domain/time/local-time'
import { text } from './fields'

export const yardSetupSchema = z.object({
  name: text().trim().min(1, 'Give the yard a name.').max(120),
  code: z
    .string()
    .trim()
    .toUpperCase()
    .regex(/^[A-Z]{2,4}$/, 'Use 2 to 4 letters: they start every stock number (e.g. TC-2026-00041).'),
  address: text().trim().min(1, 'Enter the yard address.').max(300),
  phone: text().trim().max(40).optional(),
  lat: z.coerce.number().min(-90).max(90),
  lng: z.coerce.number().min(-180).max(180),
  timeZone: z.string().refine(isTimeZone, 'Use an IANA time zone such as America/Chicago.'),
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
export const chooseYardSchema = z.object({ yardId: z.uuid({ error: 'Choose one of your yards.' }) })
export type ChooseYard = z.infer<typeof chooseYardSchema>
