import { z } from 'zod'
import { msg } from './field-messages'
import { calendarKeySchema } from './rule-sets'

/**
 * A holiday calendar the server's holiday source knows: a country, or one of its states, with its names in
 * English and, beside them, in Spanish where known (`shared/messages/rule-words.ts` picks the reader's).
 */
export const holidayCalendarOptionSchema = calendarKeySchema.extend({
  countryName: z.string(),
  stateName: z.string().optional(),
  es: z.object({ countryName: z.string().optional(), stateName: z.string().optional() }).optional(),
})
export type HolidayCalendarOption = z.infer<typeof holidayCalendarOptionSchema>
export const holidayCalendarListSchema = z.object({ calendars: z.array(holidayCalendarOptionSchema) })

/** A holiday: its date and its name, with the Spanish beside the English where the holiday source has one. */
export const holidaySchema = z.object({ date: z.string(), name: z.string(), es: z.object({ name: z.string() }).optional() })

/** The days a business-day count skips, as the server works them out. */
export const holidayListSchema = z.object({ holidays: z.array(holidaySchema) })

const calendarParam = /^[A-Z]{2}(\/[A-Za-z0-9-]+)?$/
/**
 * The holidays closed by every calendar listed ("US/CA,US"), for years from…to: the editor's preview
 * counts a draft's business days with the calendars as typed, before anything is saved.
 */
export const draftHolidaysQuerySchema = z
  .object({
    calendars: z
      .string()
      .max(200)
      .transform((s) => s.split(',').filter(Boolean))
      .pipe(z.array(z.string().regex(calendarParam)).min(1).max(8)),
    from: z.coerce.number().int().min(1990).max(2100),
    to: z.coerce.number().int().min(1990).max(2100),
  })
  .refine((q) => q.to >= q.from && q.to - q.from <= 10, { message: msg('ruleSetEditor.yearsRange', 'Ask for at most ten years, from ≤ to.'), path: ['to'] })
