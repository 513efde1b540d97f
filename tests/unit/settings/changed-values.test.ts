import { describe, expect, it } from 'vitest'
import { changedValues, itemNames } from '../../../server/settings-audit/changed-values'

describe('changedValues', () => {
  it('changedValues_ofOneNestedValue_keepsOnlyThatPathOnEachSide', () => {
    const before = { name: 'A', vehicleClasses: [{ code: 'standard', dailyRateCents: 6500 }, { code: 'heavy', dailyRateCents: 13000 }] }
    const after = { name: 'A', vehicleClasses: [{ code: 'standard', dailyRateCents: 7000 }, { code: 'heavy', dailyRateCents: 13000 }] }
    expect(changedValues(before, after)).toEqual({ before: { 'vehicleClasses.0.dailyRateCents': 6500 }, after: { 'vehicleClasses.0.dailyRateCents': 7000 } })
  })

  it('changedValues_ofAnAddedAndARemovedValue_namesEachOnItsOwnSide', () => {
    expect(changedValues({ grace: { hours: 2 } }, { cap: { maxDays: 30 } })).toEqual({ before: { grace: { hours: 2 } }, after: { cap: { maxDays: 30 } } })
  })

  it('changedValues_ofEqualValues_isEmpty', () => {
    expect(changedValues({ a: [1, { b: 2 }] }, { a: [1, { b: 2 }] })).toEqual({ before: {}, after: {} })
  })
})

describe('itemNames', () => {
  it('itemNames_ofAChangedRate_namesItsClassByItsLabel_andARemovedFeeByItsLabelBefore', () => {
    const before = { vehicleClasses: [{ label: 'Car', dailyRateCents: 6500 }], fees: [{ label: 'Impound', amountCents: 9500 }], notes: ['a'] }
    const after = { vehicleClasses: [{ label: 'Car', dailyRateCents: 7000 }], fees: [], notes: ['b'] }
    expect(itemNames(before, after, ['vehicleClasses.0.dailyRateCents', 'fees.0', 'notes.0', 'storage.cap.maxDays'])).toEqual({ 'vehicleClasses.0': 'Car', 'fees.0': 'Impound' })
  })
})
