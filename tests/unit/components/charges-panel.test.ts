// @vitest-environment happy-dom
import { mount } from '@vue/test-utils'
import { describe, expect, it } from 'vitest'
import VehiclesChargesPanel from '../../../src/components/vehicles/VehiclesChargesPanel.vue'

const ruleSet = { name: 'California (sample)', version: 1, caution: 'Sample — verify with your local code.' }

describe('the bill panel on the vehicle page', () => {
  it('chargesPanel_recordTheCoreCannotBill_saysWhyAndAsksForACorrection', () => {
    const w = mount(VehiclesChargesPanel, { props: { summary: null, ruleSet, problem: 'The stay is longer than 20 years: check the arrival date.' } })
    expect(w.get('[role="alert"]').text()).toBe('No bill can be worked out: The stay is longer than 20 years: check the arrival date. Correct the record to bill it.')
    expect(w.text()).not.toContain('No rule set')
  })

  it('chargesPanel_noRuleSetAndNoProblem_asksForARuleSet', () => {
    const w = mount(VehiclesChargesPanel, { props: { summary: null, ruleSet: null, problem: null } })
    expect(w.text()).toContain('No rule set to bill this vehicle by')
    expect(w.find('[role="alert"]').exists()).toBe(false)
  })
})
