import { describe, expect, it } from 'vitest'
import californiaJson from '../../../server/rule-sets/samples/california.json' with { type: 'json' }
import floridaJson from '../../../server/rule-sets/samples/florida.json' with { type: 'json' }
import ordinanceJson from '../../../server/rule-sets/samples/ordinance-24h.json' with { type: 'json' }
import { ruleSetSchema, type RuleSetInput } from '@shared/schemas/rule-sets'
import { ruleWord, ruleWords } from '@shared/messages/rule-words'

const samples = [
  { file: 'california.json', ruleSet: ruleSetSchema.parse(californiaJson) },
  { file: 'florida.json', ruleSet: ruleSetSchema.parse(floridaJson) },
  { file: 'ordinance-24h.json', ruleSet: ruleSetSchema.parse(ordinanceJson) },
]

/** The statutes a text names ("Cal. Civ. Code § 3072", "Fla. Stat. § 715.07(2)(a)", "§§ 22851.2"). */
const statutes = (text: string) => text.match(/(?:Cal\. (?:Civ|Veh)\. Code |Fla\. Stat\. )?§§? ?[\d.]+(?:\([a-z0-9]+\))*(?:–\([a-z]\))?/g) ?? []

describe('the sample rule sets in Spanish', () => {
  it.each(samples)('everyStepClassAndFee_$file_hasSpanishWords', ({ ruleSet }) => {
    const items = [...ruleSet.vehicleClasses, ...ruleSet.fees, ...ruleSet.timeline, ...(ruleSet.policeNotice ? [ruleSet.policeNotice] : [])]
    for (const item of items) {
      expect(item.es?.label, item.label).toBeTruthy()
      expect(item.es?.label).not.toBe(item.label)
    }
    expect(ruleSet.es?.caution).toBeTruthy()
  })

  // The samples' own Spanish names (server/rule-sets/samples): "ejemplo" is the glossary's word for a sample.
  it.each([
    ['california.json', 'California (ejemplo)'],
    ['florida.json', 'Florida (ejemplo)'],
    ['ordinance-24h.json', 'Plantilla de ordenanza municipal (cada período de 24 horas)'],
  ])('theSampleName_%s_readInSpanish_is%s', (file, spanish) => {
    const { ruleSet } = samples.find((s) => s.file === file)!
    expect(ruleWord(ruleSet, 'name', 'es')).toBe(spanish)
    expect(ruleWord(ruleSet, 'name', 'en')).toBe(ruleSet.name)
    expect(ruleWord(ruleSet, 'caution', 'es')).toMatch(/^Ejemplo — verifique con su código local\./)
  })

  it.each(samples)('theTotalLossAndCountingCitations_$file_areExplainedInSpanishKeepingTheStatute', ({ ruleSet }) => {
    const sources = [ruleSet.totalLoss.source, ...(ruleSet.businessDays ? [ruleSet.businessDays.source] : []), ...(ruleSet.mailDeadlines ? [ruleSet.mailDeadlines.source] : [])]
    for (const source of sources) {
      expect(source.es?.citation, source.citation).toBeTruthy()
      for (const statute of [...statutes(source.citation), ...(source.citation.match(/5 U\.S\.C\. § 6103/g) ?? [])]) expect(source.es?.citation, source.citation).toContain(statute)
      if (source.note) expect(source.es?.note, source.note).toBeTruthy()
    }
  })

  it('aSpanishNameBox_emptyOrTooLong_meansNoneOrIsRefusedNamingTheField', () => {
    const json = structuredClone(ordinanceJson) as RuleSetInput
    json.es = { ...json.es, name: '   ' }
    expect(ruleSetSchema.parse(json).es?.name).toBeUndefined()
    json.es = { ...json.es, name: 'n'.repeat(121) }
    const refused = ruleSetSchema.safeParse(json)
    expect(refused.success).toBe(false)
    expect(refused.error?.issues.map((i) => [i.path.join('.'), i.message])).toEqual([['es.name', 'Keep the Spanish name to 120 characters or fewer.']])
  })

  it.each(samples)('everyStepCitation_$file_isExplainedInSpanishKeepingTheStatute', ({ ruleSet }) => {
    const sources = [...ruleSet.timeline.map((s) => s.source), ...(ruleSet.policeNotice ? [ruleSet.policeNotice.source] : [])]
    for (const source of sources) {
      const es = source.es?.citation
      expect(es, source.citation).toBeTruthy()
      expect(es).not.toBe(source.citation)
      // A statute's name and section are not translated: every one the English names is in the Spanish as written.
      for (const statute of statutes(source.citation)) expect(es, source.citation).toContain(statute)
      if (source.note) {
        expect(source.es?.note, source.note).toBeTruthy()
        for (const statute of statutes(source.note)) expect(source.es?.note, source.note).toContain(statute)
      }
    }
  })

  it('aStepWithoutSpanish_readInSpanish_showsItsEnglish', () => {
    const step: { label: string; es?: { label?: string } } = { label: 'Notify the registered owner' }
    expect(ruleWord(step, 'label', 'es')).toBe('Notify the registered owner')
  })

  it('aStepWithSpanish_readInEachLanguage_showsThatLanguage', () => {
    const step = { label: 'Earliest lien sale', es: { label: 'Primer día para la venta por gravamen' } }
    expect(ruleWord(step, 'label', 'es')).toBe('Primer día para la venta por gravamen')
    expect(ruleWord(step, 'label', 'en')).toBe('Earliest lien sale')
  })

  it('aSourceWithOnlyASpanishCitation_readInSpanish_keepsItsEnglishNote', () => {
    const source = { citation: 'Fla. Stat. § 713.78: sale after 35 days.', note: 'Re-read it.', es: { citation: 'Fla. Stat. § 713.78: venta después de 35 días.' } }
    expect(ruleWords(source, 'es')).toEqual({ ...source, citation: 'Fla. Stat. § 713.78: venta después de 35 días.' })
  })

  it('aRuleSetWrittenBeforeTheSpanish_parsed_isStillValid', () => {
    const { es: _caution, ...old } = structuredClone(floridaJson) as RuleSetInput & { es?: unknown }
    old.timeline = old.timeline.map(({ es: _label, ...step }) => ({ ...step, source: { citation: step.source.citation, confidence: step.source.confidence } }))
    old.fees = old.fees.map(({ es: _label, ...fee }) => fee)
    const parsed = ruleSetSchema.parse(old)
    expect(parsed.timeline[0]!.es).toBeUndefined()
    expect(ruleWord(parsed.timeline[0]!, 'label', 'es')).toBe(parsed.timeline[0]!.label)
  })

  it('anEmptySpanishBox_parsed_meansNoSpanish', () => {
    const json = structuredClone(ordinanceJson) as RuleSetInput
    json.timeline[0]!.es = { label: '   ' }
    const parsed = ruleSetSchema.parse(json)
    expect(parsed.timeline[0]!.es?.label).toBeUndefined()
    expect(ruleWord(parsed.timeline[0]!, 'label', 'es')).toBe(parsed.timeline[0]!.label)
  })
})
