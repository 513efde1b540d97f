import { describe, expect, it } from 'vitest'
import type { BoardCard } from '@shared/schemas/board'
import { cardMatches, filtersFromQuery, type BoardFilters } from '../../../src/composables/board-filters'

const none: BoardFilters = { q: '', reason: '', hold: '', minDays: null, overdue: false }
const card = {
  stockNumber: 'TC-2026-00014',
  vin: '1ZVHT82H485113456',
  plate: '6CAB001',
  year: 2004,
  make: 'Orlan',
  model: 'Scout',
  colour: 'Red',
  space: 'A-10',
  towReason: 'law_enforcement',
  holds: [{ kind: 'law_enforcement', agency: 'Orrin Flats PD', caseNumber: 'OF-26-11602', until: null }],
  summary: { daysOnLot: 12, nextDeadline: { status: 'missed' } },
} as unknown as BoardCard

describe('board filters', () => {
  it.each([
    { f: { q: 'orlan scout' }, match: true, why: 'every word found, any case' },
    { f: { q: 'scout orlan' }, match: true, why: 'words in any order' },
    { f: { q: 'orlan finch' }, match: false, why: 'a word not found' },
    { f: { q: '6cab' }, match: true, why: 'part of the plate' },
    { f: { q: 'h485113456' }, match: true, why: 'the end of the VIN (issue 16 item 9: one search by stock number, VIN, plate, make or model)' },
    { f: { q: '1zvht82h485113457' }, match: false, why: 'another VIN' },
    { f: { reason: 'breakdown' }, match: false, why: 'another tow reason' },
    { f: { hold: 'any' as const }, match: true, why: 'held' },
    { f: { hold: 'none' as const }, match: false, why: 'held, asked for none' },
    { f: { hold: 'lien' as const }, match: false, why: 'another kind of hold' },
    { f: { minDays: 14 }, match: false, why: 'not long enough on the lot' },
    { f: { minDays: 7, overdue: true }, match: true, why: 'long enough and a deadline missed' },
  ])('cardMatches_$why', ({ f, match }) => {
    expect(cardMatches(card, { ...none, ...f })).toBe(match)
  })

  it('filtersFromQuery_readsTheAddressAndIgnoresWhatItDoesNotKnow', () => {
    expect(filtersFromQuery({ q: 'Kestra', hold: 'law_enforcement', days: '7', overdue: '1', reason: 'accident' })).toEqual({
      q: 'Kestra', reason: 'accident', hold: 'law_enforcement', minDays: 7, overdue: true,
    })
    expect(filtersFromQuery({ hold: 'whatever', days: '-3', overdue: 'yes', q: ['a', 'b'] })).toEqual(none)
  })
})
