// @vitest-environment happy-dom
import { mount } from '@vue/test-utils'
import { ElButton } from 'element-plus'
import { afterEach, beforeAll, describe, expect, it } from 'vitest'
import type { VehicleSummary } from '@shared/schemas/charges'
import { i18n, loadMessages } from '@/i18n'
import VehiclesChargesPanel from '../../../src/components/vehicles/VehiclesChargesPanel.vue'
import { withI18n } from '../../helpers/i18n'

const ruleSet = { name: 'California (sample)', version: 1, caution: 'Sample — verify with your local code.' }
const noValue = { value: { cents: null, source: null }, canRecordValue: false }
const global = { plugins: [i18n], components: { ElButton } }
// Catalogs past the sign-in page arrive in one chunk per language, as after signing in.
beforeAll(() => Promise.all([loadMessages('en'), loadMessages('es')]))
afterEach(() => {
  i18n.global.locale.value = 'en'
})

/** A California vehicle with no value: the records request runs, the value branches wait (server/charges). */
const waitingForValue: VehicleSummary = {
  daysOnLot: 3,
  storageCents: 29_000,
  towCents: 24_500,
  balanceCents: 53_500,
  nextDeadline: {
    code: 'records-request', label: 'Request owner and lienholder records', kind: 'deadline', status: 'upcoming',
    dueDate: '2026-03-17', dueAt: null, daysLeft: 13, explanation: '15 calendar days after the lien arose.', citation: 'Cal. Civ. Code § 3072',
  },
  lienSale: { open: false, date: null, why: 'Enter the value to see this deadline.', code: 'needs-value' },
  clockAlerts: [{ code: 'needs-value', message: 'Enter the value to see the deadlines that depend on it.' }],
  warnings: [],
}

describe('the bill panel on the vehicle page', () => {
  it('chargesPanel_recordTheCoreCannotBill_saysWhyAndAsksForACorrection', () => {
    const w = mount(VehiclesChargesPanel, { props: { summary: null, ruleSet, problem: 'The stay is longer than 20 years: check the arrival date.', ...noValue }, global })
    expect(w.get('[role="alert"]').text()).toBe('No bill can be worked out: The stay is longer than 20 years: check the arrival date. Correct the record to bill it.')
    expect(w.text()).not.toContain('No rule set')
  })

  it('chargesPanel_noRuleSetAndNoProblem_asksForARuleSet', () => {
    const w = mount(VehiclesChargesPanel, { props: { summary: null, ruleSet: null, problem: null, ...noValue }, global })
    expect(w.text()).toContain('No rule set to bill this vehicle by')
    expect(w.find('[role="alert"]').exists()).toBe(false)
  })

  it('chargesPanel_vehicleThatLeft_showsTheFinalChargesWithoutDayNOrAnOpenDeadline', () => {
    const closed: VehicleSummary = { ...waitingForValue, nextDeadline: null, clockAlerts: [] }
    const w = mount(VehiclesChargesPanel, { props: { summary: closed, ruleSet, problem: null, closed: true, ...noValue }, global })
    expect(w.text()).toContain('charged in all · 3 days of storage, stopped when it left')
    expect(w.text()).not.toMatch(/day 3|so far|No legal deadline/)
  })

  it('chargesPanel_noValueOnRecord_showsTheNextDateAndNeedsTheValueInsteadOfNothing', () => {
    const w = mount(VehiclesChargesPanel, { props: { summary: waitingForValue, ruleSet, problem: null, ...noValue }, global })
    expect(w.text()).toContain('Next: Request owner and lienholder records')
    expect(w.get('[data-code="needs-value"]').text()).toBe('Needs the value: enter the value to see this deadline.')
    expect(w.get('[data-testid="vehicle-value"]').text()).toContain('No value on record.')
    expect(w.text()).not.toContain('Record the value')
  })

  it('chargesPanel_inSpanish_saysNeedsTheValueInSpanish', () => {
    i18n.global.locale.value = 'es'
    const w = mount(VehiclesChargesPanel, { props: { summary: waitingForValue, ruleSet, problem: null, ...noValue }, global })
    expect(w.get('[data-code="needs-value"]').text()).toBe('Falta el valor: anótelo para ver este plazo.')
  })

  it('chargesPanel_officeWithAValue_showsItsSourceAndOffersToRecordIt', async () => {
    const summary = { ...waitingForValue, clockAlerts: [], lienSale: { open: false, date: null, why: 'Waiting.', code: 'waiting' as const } }
    const w = mount(VehiclesChargesPanel, { props: { summary, ruleSet, problem: null, value: { cents: 42_000, source: 'Price guide' }, canRecordValue: true }, global })
    expect(w.find('[data-testid="clock-alerts"]').exists()).toBe(false)
    expect(w.get('[data-testid="vehicle-value"]').text()).toContain('$420.00, from: Price guide')
    await w.get('[data-testid="vehicle-value"] button').trigger('click')
    expect(w.emitted('recordValue')).toHaveLength(1)
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
      lienSale: null,
      clockAlerts: [],
      warnings: [],
    }
    const w = mount(VehiclesChargesPanel, { props: { summary, ruleSet, problem: null, ...noValue } as never, global: { ...global, plugins: [withI18n('es')] } })
    // es-US writes US dollars as English does ("$1,234.56"; Intl with CLDR es-US, Node 20's ICU).
    expect(w.text()).toContain('$1,234.56')
    expect(w.text()).toContain('cargado hasta hoy · día 4 de almacenaje')
    expect(w.text()).toContain('Almacenaje y cargos $1,000.00 · arrastre $234.56')
    expect(w.text()).toContain('Todavía no corre ningún plazo legal.')
    withI18n('en')
  })

  it('chargesPanel_ruleSetWithASpanishName_readInSpanish_namesItInSpanish_andInEnglishAsWritten', () => {
    const named = { ...ruleSet, es: { name: 'California (ejemplo)', caution: 'Ejemplo — verifique con su código local.' } }
    const props = { summary: null, ruleSet: named, problem: null, ...noValue }
    i18n.global.locale.value = 'es'
    const es = mount(VehiclesChargesPanel, { props, global })
    expect(es.get('.charges-panel__rules').text()).toBe('Se cobra según California (ejemplo), versión 1. Ejemplo — verifique con su código local.')
    i18n.global.locale.value = 'en'
    const en = mount(VehiclesChargesPanel, { props, global })
    expect(en.get('.charges-panel__rules').text()).toBe('Billed under California (sample), version 1. Sample — verify with your local code.')
  })
})
