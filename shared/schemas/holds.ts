import { z } from 'zod'
import { HOLD_KINDS } from '../domain/lifecycle/hold-kinds'
import { alongsideFieldIssues, optionalInstant, optionalText, requiredText } from './fields'
import { msg } from './field-messages'

export const holdInputSchema = z
  .object({
    kind: z.enum(HOLD_KINDS, { error: msg('holds.chooseKindHold', 'Choose the kind of hold.') }),
    agency: optionalText(120),
    caseNumber: optionalText(60),
    until: optionalInstant,
    note: optionalText(500),
  })
  .superRefine((h, ctx) => {
    if (h.kind === 'law_enforcement') {
      if (!h.agency) ctx.addIssue({ code: 'custom', path: ['agency'], message: msg('holds.nameAgencyThatPlaced', 'Name the agency that placed the hold.') })
      if (!h.caseNumber) ctx.addIssue({ code: 'custom', path: ['caseNumber'], message: msg('holds.enterAgencyCaseNumber', "Enter the agency's case number.") })
    }
    // A few minutes' slack for a clock that runs behind; a hold that has already ended need not be set.
    if (h.until && Date.parse(h.until) < Date.now() - 10 * 60_000) {
      ctx.addIssue({ code: 'custom', path: ['until'], message: msg('holds.thisDateHasPassed', 'This date has passed: a hold that has already ended need not be set.') })
    }
    if (h.kind === 'other' && !h.note) ctx.addIssue({ code: 'custom', path: ['note'], message: msg('holds.sayWhatHoldFor', 'Say what the hold is for.') })
  }, alongsideFieldIssues)
export type HoldInput = z.input<typeof holdInputSchema>
export type Hold = z.output<typeof holdInputSchema>

export const liftHoldSchema = z.object({
  reason: requiredText(500, msg('holds.sayWhyHoldLifted', 'Say why the hold is lifted, e.g. the release letter and who signed it.')),
})
export type LiftHold = z.infer<typeof liftHoldSchema>

export const holdRecordSchema = z.object({
  id: z.uuid(),
  kind: z.enum(HOLD_KINDS),
  agency: z.string().nullable(),
  caseNumber: z.string().nullable(),
  until: z.string().nullable(),
  note: z.string().nullable(),
  setBy: z.string().nullable(),
  setAt: z.string(),
  liftedBy: z.string().nullable(),
  liftedAt: z.string().nullable(),
  liftReason: z.string().nullable(),
})
export type HoldRecord = z.infer<typeof holdRecordSchema>
