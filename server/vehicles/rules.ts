import type { Executor } from '@db/client'
import type { yards } from '@db/schema'
import type { VehicleClass } from '@shared/schemas/rule-sets'
import { towRatesSchema } from '@shared/schemas/tows'
import { badRequest, fieldIssue } from '../errors'
import { latestVersionOf, versionsById } from '../rule-sets/index'
import { ruleSetTitle } from '@shared/messages/rule-words'

type Yard = typeof yards.$inferSelect

/** Without a rule set a yard still logs vehicles, under one class, and bills nothing until one is chosen. */
const NO_RULE_SET_CLASSES: ClassOption[] = [{ code: 'standard', label: 'Standard' }]

type ClassOption = { code: string; label: string; es?: { label?: string } }
const classOption = (c: VehicleClass): ClassOption => ({ code: c.code, label: c.label, ...(c.es?.label ? { es: { label: c.es.label } } : {}) })

/** The yard's current rule set: what a tow-in is billed under from now on. */
export async function intakeRules(db: Executor, yard: Yard) {
  const current = yard.ruleSetId ? await latestVersionOf(db, yard.ruleSetId) : undefined
  return {
    versionId: current?.versionId ?? null,
    version: current?.version ?? null,
    ruleSet: current ? ruleSetTitle(current.ruleSet) : null,
    policeNotice: current?.ruleSet.policeNotice ?? null,
    classes: current ? current.ruleSet.vehicleClasses.map(classOption) : NO_RULE_SET_CLASSES,
  }
}

/** The classes of the rule-set version a vehicle arrived under (a correction stays within it). */
export async function classesOfVersion(db: Executor, versionId: string | null) {
  if (!versionId) return NO_RULE_SET_CLASSES
  const found = (await versionsById(db, [versionId])).get(versionId)
  return found ? found.vehicleClasses.map(classOption) : NO_RULE_SET_CLASSES
}

export function assertKnownClass(classes: { code: string; label: string }[], code: string, path = 'vehicle.vehicleClass') {
  if (classes.some((c) => c.code === code)) return
  const list = classes.map((c) => c.label).join(', ')
  const message = `Choose one of the rule set's classes: ${list}.`
  throw badRequest(message, [fieldIssue(path, 'vehicles.chooseRuleSetClass', message, { classes: list })])
}

/** The yard's tow rates; a yard whose manager has not set them bills the tow at nothing, and says so. */
export function yardTowRates(yard: Yard) {
  const raw = yard.towRates
  return { rates: towRatesSchema.parse(raw), ratesSet: typeof raw.hookUpCents === 'number' }
}
