// @vitest-environment happy-dom
import { mount } from '@vue/test-utils'
import { afterEach, beforeAll, describe, expect, it } from 'vitest'
import californiaJson from '../../../server/rule-sets/samples/california.json' with { type: 'json' }
import { storageBill } from '@shared/domain/billing'
import type { VehicleSummary } from '@shared/schemas/charges'
import { ruleSetSchema } from '@shared/schemas/rule-sets'
import { i18n, loadMessages } from '@/i18n'
import VehiclesChargesPanel from '../../../src/components/vehicles/VehiclesChargesPanel.vue'

// The bill's "sample — set your rate" warnings travel as data (issue 14) and read in the reader's
// language, each class and fee by the rule set's own Spanish name (server/rule-sets/samples/california.json).
const california = ruleSetSchema.parse(californiaJson)
const bill = storageBill({ arrivedAt: '2026-05-04T09:00:00-07:00', vehicleClass: 'standard' }, california, '2026-05-10T00:00:00Z')
const global = { plugins: [i18n] }
beforeAll(() => Promise.all([loadMessages('en'), loadMessages('es')]))
afterEach(() => {
  i18n.global.locale.value = 'en'
})

const summary: VehicleSummary = {
  daysOnLot: bill.days,
  storageCents: bill.totalCents,
  towCents: 0,
  balanceCents: bill.totalCents,
  nextDeadline: null,
  lienSale: { open: false, date: null, why: 'x', code: 'waiting' },
  clockAlerts: [],
  warnings: bill.warnings,
  sampleWarnings: bill.sampleWarnings,
}
const props = { summary, ruleSet: null, problem: null, value: { cents: null, source: null }, canRecordValue: false }
const shown = () => mount(VehiclesChargesPanel, { props, global }).findAll('.charges-panel__warnings li').map((li) => li.text())

describe('the sample-rate warnings in the reader’s language', () => {
  it('the core names each sample by code, the class and fee with their Spanish names', () => {
    const standard = california.vehicleClasses.find((c) => c.code === 'standard')!
    const impound = california.fees.find((f) => f.code === 'impound')!
    expect(bill.sampleWarnings).toEqual([
      { code: 'sample-storage', label: standard.label, es: { label: standard.es!.label } },
      { code: 'sample-fee', label: impound.label, es: { label: impound.es!.label } },
    ])
  })

  it('reads in English as the core’s own warnings', () => {
    expect(shown()).toEqual(bill.warnings)
  })

  it('reads in Spanish, with the rule set’s Spanish names', () => {
    i18n.global.locale.value = 'es'
    const standard = california.vehicleClasses.find((c) => c.code === 'standard')!.es!.label
    const impound = california.fees.find((f) => f.code === 'impound')!.es!.label
    expect(shown()).toEqual([
      `Almacenaje — ${standard}: el monto es un ejemplo — ponga su tarifa.`,
      `${impound}: el monto es un ejemplo — ponga su tarifa.`,
    ])
  })
})
