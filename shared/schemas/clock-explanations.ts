import { z } from 'zod'
import { holidaySchema } from './holidays'
import { clockEventKindSchema } from './rule-sets'

/**
 * A deadline's explanation as data (shared/domain/clocks: `StepExplanation`, `ClockExplanation`),
 * which the screens word in the reader's language; the English `explanation` beside it stays for the
 * calendar feed and older readers.
 */
export const stepExplanationSchema = z.object({
  code: z.literal('step'),
  kind: z.enum(['deadline', 'earliest']),
  days: z.number(),
  dayKind: z.enum(['calendar', 'business']),
  direction: z.enum(['after', 'before']),
  from: clockEventKindSchema,
  start: z.string().optional(),
  date: z.string().optional(),
  counted: z.string().optional(),
  closed: z.object({ holiday: z.string().optional(), es: z.object({ holiday: z.string() }).optional(), weekday: z.number().optional() }).optional(),
  weekendDays: z.number().optional(),
  holidays: z.array(holidaySchema).readonly().optional(),
})

export const clockExplanationSchema = z.discriminatedUnion('code', [
  stepExplanationSchema,
  z.object({ code: z.literal('police'), hours: z.number(), start: z.enum(['called', 'hooked', 'arrived']), startAt: z.string(), dueAt: z.string() }),
  z.object({ code: z.enum(['eligible-since', 'not-before']), date: z.string() }),
])
export type ClockExplanationView = z.infer<typeof clockExplanationSchema>
