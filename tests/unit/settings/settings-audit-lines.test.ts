import { beforeAll, describe, expect, it } from 'vitest'
import { loadMessages } from '@/i18n'
import { auditLines } from '@/components/settings/settings-audit-lines'
import { withI18n } from '../../helpers/i18n'

beforeAll(() => Promise.all([loadMessages('en'), loadMessages('es')]))

const rateChange = {
  before: { 'vehicleClasses.0.dailyRateCents': 6500, 'vehicleClasses.0.placeholder': true, 'fees.1': { label: 'Gate', amountCents: 2500 } },
  after: { 'vehicleClasses.0.dailyRateCents': 7000, 'vehicleClasses.0.placeholder': false, 'storage.cap.maxDays': 30 },
  names: { 'vehicleClasses.0': 'Car' },
}

describe('auditLines', () => {
  it('auditLines_inEnglish_nameTheClassByItsLabel_andShowMoneyAsMoney', () => {
    withI18n('en')
    expect(auditLines(rateChange)).toEqual([
      { path: 'vehicleClasses.0.dailyRateCents', label: 'Car — daily rate', before: '$65.00', after: '$70.00' },
      { path: 'vehicleClasses.0.placeholder', label: 'Car — value', before: 'sample', after: 'set by the yard' },
      { path: 'fees.1', label: 'Fee 2', before: 'name: Gate; amount: $25.00', after: null },
      { path: 'storage.cap.maxDays', label: 'Storage — cap — most days', before: null, after: '30' },
    ])
  })

  it('auditLines_inSpanish_sayTheSameInSpanish', () => {
    withI18n('es')
    const lines = auditLines(rateChange)
    expect(lines[0]).toEqual({ path: 'vehicleClasses.0.dailyRateCents', label: 'Car — tarifa diaria', before: '$65.00', after: '$70.00' })
    expect(lines[1]!.after).toBe('fijado por el patio')
    expect(lines[2]!.label).toBe('Cargo 2')
    withI18n('en')
  })

  it('auditLines_ofAKeyTheCatalogLacks_stillReadAsWords', () => {
    withI18n('en')
    expect(auditLines({ before: { someNewSetting: 'a' }, after: { someNewSetting: 'b' }, names: {} })[0]!.label).toBe('some new setting')
  })
})
