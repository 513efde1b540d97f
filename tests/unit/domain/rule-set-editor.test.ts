import { describe, expect, it } from 'vitest'
import californiaJson from '../../../server/rule-sets/samples/california.json' with { type: 'json' }
import floridaJson from '../../../server/rule-sets/samples/florida.json' with { type: 'json' }
import ordinanceJson from '../../../server/rule-sets/samples/ordinance-24h.json' with { type: 'json' }
import { ruleSetEditSchema } from '@shared/schemas/rule-set-editor'
import type { RuleSetInput } from '@shared/schemas/rule-sets'

const california = () => structuredClone(californiaJson) as unknown as RuleSetInput
const source = { citation: 'test', confidence: 'none' as const }

/** The paths and messages the editor would show beside its fields. */
function refusals(ruleSet: RuleSetInput) {
  const parsed = ruleSetEditSchema.safeParse(ruleSet)
  return parsed.success ? [] : parsed.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message }))
}

describe('ruleSetEditSchema', () => {
  it.each([
    ['california', californiaJson],
    ['florida', floridaJson],
    ['ordinance-24h', ordinanceJson],
  ])('ruleSetEditSchema_theShippedSample%s_passes', (_name, json) => {
    expect(refusals(structuredClone(json) as unknown as RuleSetInput)).toEqual([])
  })

  it.each([
    ['a negative daily rate', (r: RuleSetInput) => (r.vehicleClasses[0]!.dailyRateCents = -1), 'vehicleClasses.0.dailyRateCents', 'An amount cannot be negative.'],
    ['a rate in fractions of a cent', (r: RuleSetInput) => (r.vehicleClasses[1]!.dailyRateCents = 10.5), 'vehicleClasses.1.dailyRateCents', 'Enter the amount in whole cents.'],
    ['a negative fee', (r: RuleSetInput) => (r.fees[0]!.amountCents = -500), 'fees.0.amountCents', 'An amount cannot be negative.'],
    [
      "a cap below the dearest day's rate",
      (r: RuleSetInput) => (r.storage.cap = { maxStorageCents: 12_999, source }),
      'storage.cap.maxStorageCents',
      "The storage cap is below one day's rate for Over 25 ft or heavy duty: raise the cap or lower the rate.",
    ],
    [
      'a deadline counted back from the arrival',
      (r: RuleSetInput) => Object.assign(r.timeline[0]!, { from: 'stored', direction: 'before', days: 3 }),
      'timeline.0.direction',
      'This date would fall before the vehicle arrived: count it after its start.',
    ],
    [
      'a step done by its own start',
      (r: RuleSetInput) => Object.assign(r.timeline[0]!, { from: 'lien-arose', doneBy: 'lien-arose' }),
      'timeline.0.doneBy',
      'A step cannot be done by the same event it starts from.',
    ],
  ])('ruleSetEditSchema_with%s_isRefusedNamingTheField', (_what, spoil, path, message) => {
    const ruleSet = california()
    spoil(ruleSet)
    expect(refusals(ruleSet)).toContainEqual({ path, message })
  })

  it('ruleSetEditSchema_aCapAtTheDearestDaysRate_passes', () => {
    const ruleSet = california()
    ruleSet.storage.cap = { maxStorageCents: 13_000, source }
    expect(refusals(ruleSet)).toEqual([])
  })

  it('ruleSetEditSchema_aNegativeRateAndABadCapTogether_reportsBoth', () => {
    const ruleSet = california()
    ruleSet.vehicleClasses[2]!.dailyRateCents = -1
    ruleSet.storage.cap = { maxStorageCents: 100, source }
    expect(refusals(ruleSet).map((r) => r.path)).toEqual(expect.arrayContaining(['vehicleClasses.2.dailyRateCents', 'storage.cap.maxStorageCents']))
  })
})
