// @vitest-environment happy-dom
import { mount } from '@vue/test-utils'
import { describe, expect, it } from 'vitest'
import VehiclesChargesPanel from '../../../src/components/vehicles/VehiclesChargesPanel.vue'
import { withI18n } from '../../helpers/i18n'

const ruleSet = { name: 'California (sample)', version: 1, caution: 'Sample — verify with your local code.' }

describe('the bill panel on the vehicle page', () => {
  it('chargesPanel_recordTheCoreCannotBill_saysWhyAndAsksForACorrection', () => {
    const w = mount(VehiclesChargesPanel, {
      props: { summary: null, ruleSet, problem: 'The stay is longer than 20 years: check the arrival date.' },
      global: { plugins: [withI18n()] },
    })
    expect(w.get('[role="alert"]').text()).toBe('No bill can be worked out: The stay is longer than 20 years: check the arrival date. Correct the record to bill it.')
    expect(w.text()).not.toContain('No rule set')
  })

  it('chargesPanel_noRuleSetAndNoProblem_asksForARuleSet', () => {
    const w = mount(VehiclesChargesPanel, { props: { summary: null, ruleSet: null, problem: null }, global: { plugins: [withI18n()] } })
    expect(w.text()).toContain('No rule set to bill this vehicle by')
    expect(w.find('[role="alert"]').exists()).toBe(false)
  })
})

describe('the bill panel in Spanish', () => {
  it('chargesPanel_spanishChosen_saysItInSpanishWithTheAmountsAsAUsYardPrintsThem', () => {
    const summary = {
      balanceCents: 123456,
      storageCents: 100000,
      towCents: 23456,
      daysOnLot: 4,
      nextDeadline: null,
      warnings: [],
    }
    const w = mount(VehiclesChargesPanel, { props: { summary, ruleSet, problem: null } as never, global: { plugins: [withI18n('es')] } })
    // es-US writes US dollars as English does ("$1,234.56"; Intl with CLDR es-US, Node 20's ICU).
    expect(w.text()).toContain('$1,234.56')
    expect(w.text()).toContain('debe hasta hoy · día 4 de almacenaje')
    expect(w.text()).toContain('Almacenaje y cargos $1,000.00 · arrastre $234.56')
    expect(w.text()).toContain('Todavía no corre ningún plazo legal.')
    withI18n('en')
  })
})
