import { z } from 'zod'
import { clockExplanationSchema } from './clock-explanations'
import { policeNoticeClockSchema } from './police-notices'
import { spanishWordsSchema } from './rule-sets'

/** A sample amount not yet set (shared/domain/billing: `SampleWarning`). */
export const sampleWarningSchema = z.discriminatedUnion('code', [
  z.object({ code: z.enum(['sample-storage', 'sample-fee']), label: z.string(), es: z.object({ label: z.string().optional() }).optional() }),
  z.object({ code: z.literal('sample-tax') }),
])
export type SampleWarningView = z.infer<typeof sampleWarningSchema>

/** The next legal date that matters for a vehicle, as a card or page shows it. */
export const nextDeadlineSchema = z.object({
  code: z.string(),
  label: z.string(),
  kind: z.enum(['deadline', 'earliest']),
  status: z.enum(['upcoming', 'met', 'missed', 'reached', 'not-started', 'needs-information']),
  dueDate: z.string(),
  dueAt: z.string().nullable(),
  /** Whole days from the as-of date to the due date in the yard's calendar; negative when past. */
  daysLeft: z.number(),
  explanation: z.string(),
  citation: z.string(),
  /** The explanation as data, worded in the reader's language (`explanation` is the English). */
  explained: clockExplanationSchema.optional(),
  /** Its words in Spanish, where the rule set has them (shared/messages/rule-words.ts picks the reader's). */
  es: spanishWordsSchema.optional(),
  /** The rule set's own counting rules this date followed (business days, a mailing on a closed post-office day), each cited. */
  rules: z.array(z.object({ code: z.enum(['business-days', 'mailing-day']), rule: z.string(), citation: z.string(), es: z.object({ citation: z.string() }).optional(), calendars: z.string().optional() })).optional(),
})
export type NextDeadline = z.infer<typeof nextDeadlineSchema>

/** Whether the law already allows a lien sale or disposal (shared/domain/clocks/lien-sale-gate.ts). */
export const lienSaleGateSchema = z.object({
  open: z.boolean(),
  date: z.string().nullable(),
  why: z.string(),
  code: z.enum(['open', 'not-before', 'waiting', 'too-early', 'expired', 'needs-value', 'needs-model-year', 'no-branch', 'no-sale-date']),
  /** The step that sets the date, and its citation, once there is a date. */
  step: z.string().optional(),
  citation: z.string().optional(),
  es: z.object({ step: z.string().optional(), citation: z.string().optional() }).optional(),
})

/**
 * Eligible for lien sale or disposal: the gate is open and nobody has claimed the vehicle (its owner
 * has not chosen to collect it or have it repaired). The date and the rule that set it.
 */
export const lienSaleEligibleSchema = z.object({
  since: z.string(),
  step: z.string(),
  citation: z.string(),
  es: z.object({ step: z.string().optional(), citation: z.string().optional() }).optional(),
})
export type LienSaleEligible = z.infer<typeof lienSaleEligibleSchema>

/**
 * What the card and the vehicle page show instead of nothing when the clocks cannot all be worked
 * out: "needs-value" ("enter the value to see this deadline"), "needs-model-year", "no-branch".
 */
export const clockAlertSchema = z.object({ code: z.enum(['needs-value', 'needs-model-year', 'no-branch']), message: z.string() })
export type ClockAlertView = z.infer<typeof clockAlertSchema>

export const vehicleSummarySchema = z.object({
  /** Storage days counted so far by the rule set's own day rule. */
  daysOnLot: z.number(),
  storageCents: z.number(),
  towCents: z.number(),
  balanceCents: z.number(),
  nextDeadline: nextDeadlineSchema.nullable(),
  lienSale: lienSaleGateSchema,
  clockAlerts: z.array(clockAlertSchema),
  /** Eligible for lien sale or disposal, or null (absent from summaries made before it existed). */
  eligible: lienSaleEligibleSchema.nullish(),
  /** The police-notification clock of a tow the rule set asks it of; null otherwise. */
  policeNotice: policeNoticeClockSchema.nullish(),
  warnings: z.array(z.string()),
  /** The warnings as data, worded in the reader's language (`warnings` is the English). */
  sampleWarnings: z.array(sampleWarningSchema).optional(),
})
export type VehicleSummary = z.infer<typeof vehicleSummarySchema>
