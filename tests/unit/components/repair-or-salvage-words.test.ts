// @vitest-environment happy-dom
import { mount } from '@vue/test-utils'
import { afterEach, beforeAll, describe, expect, it } from 'vitest'
import { repairOrSalvage } from '@shared/domain/inspection'
import type { InspectionPage } from '@shared/schemas/inspections'
import { i18n, loadMessages } from '@/i18n'
import InspectionsRecommendation from '../../../src/components/inspections/InspectionsRecommendation.vue'

// The repair-or-salvage advice is worded from the core's numbers (issue 14), not shown as its English.
// Invented figures; the two rules are the rule sets' own (a share of the value, or the Total Loss Formula).
const source = { citation: 'test rule', confidence: 'C' as const }
const percent = repairOrSalvage(600_000, 800_000, 100_000, { totalLoss: { rule: 'percent-of-value', percent: 75, source } })
const formula = repairOrSalvage(300_000, 800_000, 100_000, { totalLoss: { rule: 'total-loss-formula', source } })
const global = { plugins: [i18n] }
beforeAll(() => Promise.all([loadMessages('en'), loadMessages('es')]))
afterEach(() => {
  i18n.global.locale.value = 'en'
})
const lines = (recommendation: ReturnType<typeof repairOrSalvage>) =>
  mount(InspectionsRecommendation, { props: { page: { recommendation, ruleSet: null } as unknown as InspectionPage }, global }).findAll('.advice__line').map((p) => p.text())

describe('the repair-or-salvage explanation in the reader’s language', () => {
  it('reads in English as the core’s own explanation, under either rule', () => {
    expect(lines(percent)).toEqual(percent.explanation)
    expect(lines(formula)).toEqual(formula.explanation)
  })

  it('reads in Spanish from the numbers: $6,000 reaches 75 % of $8,000, so salvage', () => {
    i18n.global.locale.value = 'es'
    expect(lines(percent)).toEqual([
      'El presupuesto de reparación es de $6,000.00; el vehículo valía unos $8,000.00 antes del daño.',
      'Aquí un vehículo es pérdida total cuando la reparación cuesta el 75 % de su valor o más: $6,000.00.',
      'El presupuesto llega a esa cifra, así que repararlo cuesta más de lo que permite la regla: se recomienda salvamento.',
    ])
    expect(lines(formula)[2]).toBe('Eso es menos que el valor del vehículo, así que vale la pena considerar la reparación.')
  })
})
