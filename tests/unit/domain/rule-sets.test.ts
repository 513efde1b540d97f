import { describe, expect, it } from 'vitest'
import californiaJson from '../../../server/rule-sets/samples/california.json' with { type: 'json' }
import floridaJson from '../../../server/rule-sets/samples/florida.json' with { type: 'json' }
import ordinanceJson from '../../../server/rule-sets/samples/ordinance-24h.json' with { type: 'json' }
import { ruleSetSchema, type Source } from '@shared/schemas/rule-sets'

const samples = [
  { file: 'california.json', json: californiaJson },
  { file: 'florida.json', json: floridaJson },
  { file: 'ordinance-24h.json', json: ordinanceJson },
]

/** Every { citation, confidence } anywhere in a rule set. */
function sources(value: unknown): Source[] {
  if (Array.isArray(value)) return value.flatMap(sources)
  if (value && typeof value === 'object') {
    const record = value as Record<string, unknown>
    return 'citation' in record ? [record as Source] : Object.values(record).flatMap(sources)
  }
  return []
}

describe('shipped sample rule sets', () => {
  it.each(samples)('ruleSetSchema_$file_parses', ({ json }) => {
    expect(ruleSetSchema.safeParse(json).success).toBe(true)
  })

  it.each(samples)('ruleSet_$file_saysSampleVerifyWithYourLocalCode', ({ json }) => {
    const ruleSet = ruleSetSchema.parse(json)
    expect(ruleSet.sample).toBe(true)
    expect(ruleSet.caution).toMatch(/^Sample — verify with your local code\./)
    expect(ruleSet.caution).toMatch(/vary/)
  })

  it.each(samples)('ruleSet_$file_givesEveryValueACitationAndAConfidence', ({ json }) => {
    const ruleSet = ruleSetSchema.parse(json)
    const cited = [
      ruleSet.storage.counting,
      ruleSet.tax,
      ruleSet.totalLoss,
      ...ruleSet.vehicleClasses,
      ...ruleSet.fees,
      ...ruleSet.timeline,
    ]
    for (const item of cited) expect(item.source.citation.length).toBeGreaterThan(10)
    expect(sources(ruleSet).length).toBeGreaterThanOrEqual(cited.length)
  })

  it.each(samples)('ruleSet_$file_flagsUnsourcedAmountsAsPlaceholders', ({ json }) => {
    const ruleSet = ruleSetSchema.parse(json)
    for (const item of [...ruleSet.vehicleClasses, ...ruleSet.fees, ruleSet.tax, ...ruleSet.timeline]) {
      if (item.source.confidence === 'none') expect(item.placeholder).toBe(true)
    }
  })
})

describe('ruleSetSchema refuses', () => {
  it.each([
    { why: 'an unknown time zone', change: { timeZone: 'Pacific Time' }, path: 'timeZone' },
    { why: 'two classes with one code', change: { vehicleClasses: [californiaJson.vehicleClasses[0], californiaJson.vehicleClasses[0]] }, path: 'vehicleClasses' },
    { why: 'a negative rate', change: { vehicleClasses: [{ ...californiaJson.vehicleClasses[0], dailyRateCents: -1 }] }, path: 'vehicleClasses.0.dailyRateCents' },
    { why: 'a tax rate with five decimals', change: { tax: { ...californiaJson.tax, ratePercent: 7.12345 } }, path: 'tax.ratePercent' },
  ])('ruleSetSchema_$why_isRefusedAtItsField', ({ change, path }) => {
    const result = ruleSetSchema.safeParse({ ...californiaJson, ...change })
    expect(result.success).toBe(false)
    expect(result.error?.issues.map((i) => i.path.join('.'))).toContain(path)
  })
})
