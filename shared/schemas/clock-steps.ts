import { z } from 'zod'
import { msg } from './field-messages'
import { optionalText, text } from './fields'
import { spanishWordsSchema } from './rule-sets'

/**
 * The lien-sale steps only the office can witness, recorded by hand (issue 10): the yard's application
 * for the lien sale, the state's own notice to the owners (California's DMV, Cal. Civ. Code § 3071) and
 * the notice of sale posted at the yard (§ 3072). Each is the clock event of the same name.
 */
export const OFFICE_STEP_EVENTS = ['lien-sale-application-filed', 'state-notice-mailed', 'sale-notice-posted'] as const
export type OfficeStepEvent = (typeof OFFICE_STEP_EVENTS)[number]

export const clockStepInputSchema = z.object({
  event: z.enum(OFFICE_STEP_EVENTS, { error: msg('clockSteps.chooseStep', 'Choose the step to record.') }),
  /** The yard's calendar day it happened. */
  day: text({ error: msg('clockSteps.enterDay', 'Enter the day it happened.') }).regex(/^\d{4}-\d{2}-\d{2}$/, msg('clockSteps.enterDay', 'Enter the day it happened.')),
  /** A DMV reference, where the notice was posted. */
  note: optionalText(300),
})
export type ClockStepInput = z.input<typeof clockStepInputSchema>

/** One step of the vehicle's clocks that such an event starts or meets. */
export const clockStepDeadlineSchema = z.object({
  code: z.string(),
  label: z.string(),
  /** "starts": the event starts this step's count; "meets": the event is what the step asks for. */
  role: z.enum(['starts', 'meets']),
  status: z.enum(['upcoming', 'met', 'missed', 'reached', 'not-started', 'needs-information']),
  dueDate: z.string().nullable(),
  citation: z.string(),
  es: spanishWordsSchema.optional(),
})

export const clockStepsPageSchema = z.object({
  vehicleId: z.uuid(),
  steps: z.array(
    z.object({
      event: z.enum(OFFICE_STEP_EVENTS),
      /** The day on record (the yard's calendar), if any. */
      recordedDay: z.string().nullable(),
      deadlines: z.array(clockStepDeadlineSchema),
    }),
  ),
})
export type ClockStepsPage = z.infer<typeof clockStepsPageSchema>
