import { z } from 'zod'
import { DISPOSITIONS, VEHICLE_STATES } from '../domain/lifecycle/columns'
import { boardCardSchema } from './board'
import { text } from './fields'
import { msg } from './field-messages'

export const moveRequestSchema = z.object({
  to: z.enum(VEHICLE_STATES, { error: msg('moves.chooseWhereVehicleGoes', 'Choose where the vehicle goes.') }),
  version: z
    .number({ error: msg('moves.sendVersionCardYou', 'Send the version of the card you saw; reload the board if it is missing.') })
    .int(msg('moves.versionWholeNumber', 'The version is a whole number.'))
    .positive(msg('moves.versionPositiveNumber', 'The version is a positive number.')),
  reason: text({ error: msg('moves.reasonText', 'The reason is text.') })
    .trim()
    .max(500, msg('moves.keepReasonUnder500', 'Keep the reason under 500 characters.'))
    .nullish()
    .transform((v) => v || null),
  disposition: z.enum(DISPOSITIONS, { error: msg('moves.chooseHowVehicleLeaves', 'Choose how the vehicle leaves the yard.') }).nullish().transform((v) => v ?? null),
  // Issue 16: a move into Teardown under a law-enforcement hold is refused (409) unless the person was
  // asked and said yes.
  confirmHold: z.boolean({ error: msg('moves.confirmHoldYesNo', 'Confirming a move under a hold is true or false.') }).optional().transform((v) => v ?? false),
})
export type MoveRequest = z.input<typeof moveRequestSchema>

export const reasonSchema = z.object({
  code: z.string(),
  message: z.string(),
  // The words in the reader's language (refusals.reasons.<key> in shared/messages) and their parameters.
  key: z.string().optional(),
  params: z.record(z.string(), z.union([z.string(), z.number()])).optional(),
})

/** 403 or 422: the move was refused and nothing was written. */
export const moveRefusalSchema = z.object({ error: z.string(), reasons: z.array(reasonSchema) })

/** 409: someone moved the card first; `current` is where it is now. */
export const moveConflictSchema = z.object({ error: z.string(), current: boardCardSchema })
