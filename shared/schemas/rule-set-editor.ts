import { z } from 'zod'
import { alongsideFieldIssues, optionalText, requiredText } from './fields'
import { ruleSetSchema, ruleSetTitleSchema, type ClockEventKind, type RuleSetInput } from './rule-sets'
import { msg } from './field-messages'

/** Events that happen at the arrival itself: nothing can be due before them, and only they are recorded by it. */
export const ARRIVAL_EVENT_KINDS = ['stored', 'lien-arose'] as const satisfies readonly ClockEventKind[]
const ARRIVAL_EVENTS = new Set<string>(ARRIVAL_EVENT_KINDS)
/** The sale ends the timeline: no other event comes after it. */
const LAST_EVENT = 'lien-sale-held'
const BANDS = ['valueCents', 'ageYears'] as const

/**
 * A rule set as a manager saves it: every check of `ruleSetSchema`, plus the ones that catch a
 * value that parses but cannot be meant — judged the same way in the editor and on the server.
 */
export const ruleSetEditSchema = ruleSetSchema.superRefine((parsed, ctx) => {
    const draft = parsed as Partial<RuleSetInput>
    const classes = Array.isArray(draft.vehicleClasses) ? draft.vehicleClasses : []
    const cap = draft.storage?.cap as { maxStorageCents?: unknown } | undefined
    if (cap && typeof cap.maxStorageCents === 'number') {
      const dearest = classes.reduce<{ label: string; rate: number } | undefined>(
        (top, c) => (typeof c?.dailyRateCents === 'number' && (!top || c.dailyRateCents > top.rate) ? { label: c.label, rate: c.dailyRateCents } : top),
        undefined,
      )
      if (dearest && (cap.maxStorageCents as number) < dearest.rate) {
        ctx.addIssue({
          code: 'custom',
          path: ['storage', 'cap', 'maxStorageCents'],
          message: msg('ruleSetEditor.capBelowRate', `The storage cap is below one day's rate for ${dearest.label}: raise the cap or lower the rate.`, { vehicleClass: dearest.label }),
        })
      }
    }
    const steps = Array.isArray(draft.timeline) ? draft.timeline : []
    steps.forEach((step, i) => {
      if (!step) return
      if (step.direction === 'before' && ARRIVAL_EVENTS.has(step.from) && typeof step.days === 'number' && step.days > 0) {
        ctx.addIssue({ code: 'custom', path: ['timeline', i, 'direction'], message: msg('ruleSetEditor.thisDateWouldFall', 'This date would fall before the vehicle arrived: count it after its start.') })
      }
      if (step.from === step.doneBy) {
        ctx.addIssue({ code: 'custom', path: ['timeline', i, 'doneBy'], message: msg('ruleSetEditor.stepCannotDoneBy', 'A step cannot be done by the same event it starts from.') })
      } else if (ARRIVAL_EVENTS.has(step.doneBy) && !ARRIVAL_EVENTS.has(step.from)) {
        // Met by the arrival, which came before the step's own start: the date could never be met or missed.
        ctx.addIssue({ code: 'custom', path: ['timeline', i, 'doneBy'], message: msg('ruleSetEditor.metBeforeStart', 'The arrival meets this step before it even starts: choose the event that meets it.') })
      } else if (step.direction === 'before' && step.doneBy === LAST_EVENT && typeof step.days === 'number' && step.days > 0) {
        ctx.addIssue({ code: 'custom', path: ['timeline', i, 'direction'], message: msg('ruleSetEditor.saleIsLast', 'The sale comes after every other event: it cannot be due before this step\'s start. Count it after its start.') })
      }
      for (const band of BANDS) {
        const range = step.when?.[band]
        if (range && typeof range.over === 'number' && typeof range.atMost === 'number' && range.atMost <= range.over) {
          ctx.addIssue({ code: 'custom', path: ['timeline', i, 'when', band, 'atMost'], message: msg('ruleSetEditor.emptyBand', 'No vehicle falls in this band: the upper end must be above the lower one.') })
        }
      }
    })
    const arrival = draft.arrivalEvents?.kinds
    if (Array.isArray(arrival) && arrival.some((k) => !ARRIVAL_EVENTS.has(k))) {
      ctx.addIssue({ code: 'custom', path: ['arrivalEvents', 'kinds'], message: msg('ruleSetEditor.arrivalOnly', 'The arrival can record only the storage and the lien that arises with it.') })
    }
}, alongsideFieldIssues)

export const ruleSetSummarySchema = z.object({
  id: z.string(),
  version: z.number().int(),
  name: z.string(),
  jurisdiction: z.string(),
  sample: z.boolean(),
  caution: z.string(),
  /** The name and caution in Spanish, where the rule set has them. */
  es: ruleSetTitleSchema.shape.es,
  /** The company's own copy (editable); false for a shipped sample. */
  own: z.boolean().default(false),
  /** The rule set the signed-in user's yard bills new tow-ins under. */
  inUse: z.boolean().default(false),
})
export type RuleSetSummary = z.infer<typeof ruleSetSummarySchema>

export const ruleSetListSchema = z.object({ ruleSets: z.array(ruleSetSummarySchema) })

export const ruleSetDetailSchema = z.object({
  id: z.string(),
  version: z.number().int(),
  own: z.boolean().default(false),
  inUse: z.boolean().default(false),
  ruleSet: ruleSetSchema,
})
export type RuleSetDetail = z.infer<typeof ruleSetDetailSchema>

export const copyRuleSetSchema = z.object({
  name: requiredText(120, msg('ruleSetEditor.giveCopyName', 'Give the copy a name.')),
})
export type CopyRuleSet = z.infer<typeof copyRuleSetSchema>

export const saveRuleSetSchema = z.object({
  /** The version the manager started from: another one saved meanwhile is a conflict. */
  version: z.number({ error: msg('ruleSetEditor.reloadRuleSetTry', 'Reload the rule set and try again.') }).int().positive(),
  ruleSet: ruleSetEditSchema,
  reason: optionalText(500),
})
export type SaveRuleSet = z.input<typeof saveRuleSetSchema>

export const chooseRuleSetSchema = z.object({
  ruleSetId: z.string({ error: msg('ruleSetEditor.chooseRuleSet', 'Choose a rule set.') }).min(1, msg('ruleSetEditor.chooseRuleSet', 'Choose a rule set.')).max(80),
  reason: optionalText(500),
})
export type ChooseRuleSet = z.input<typeof chooseRuleSetSchema>

/** Moves one vehicle to the latest version of its yard's rule set. */
export const moveToLatestVersionSchema = z.object({
  version: z.number({ error: msg('common.reloadVehicleTryAgain', 'Reload the vehicle and try again.') }).int().positive(),
  reason: requiredText(500, msg('ruleSetEditor.sayWhyThisVehicle', 'Say why this vehicle moves to the new version.')),
})
export type MoveToLatestVersion = z.input<typeof moveToLatestVersionSchema>

/** Vehicles on the lot billed under an older version of a rule set. */
export const olderVersionVehiclesSchema = z.object({
  latest: z.number().int(),
  vehicles: z.array(
    z.object({ id: z.uuid(), stockNumber: z.string(), description: z.string(), version: z.number().int(), vehicleVersion: z.number().int() }),
  ),
})
export type OlderVersionVehicles = z.infer<typeof olderVersionVehiclesSchema>
