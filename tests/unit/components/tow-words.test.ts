import { describe, expect, it } from 'vitest'
import { askedBy } from '@/composables/tow-words'

describe('who asked for the tow, as the vehicle page says it', () => {
  it.each([
    ['Orrin Flats Police Department', 'Orrin Flats Police Department', 'Orrin Flats Police Department'],
    ['orrin flats police department ', 'Orrin Flats Police Department', 'orrin flats police department '],
    ['Sgt. Dana Whitlow', 'Orrin Flats Police Department', 'Sgt. Dana Whitlow, Orrin Flats Police Department'],
    ['Marla Quist', null, 'Marla Quist'],
    [null, 'Tule Valley Apartments', 'Tule Valley Apartments'],
    [null, null, ''],
  ])('askedBy_%s_%s_namesEachOnce', (name, agency, expected) => {
    expect(askedBy(name, agency)).toBe(expected)
  })
})
