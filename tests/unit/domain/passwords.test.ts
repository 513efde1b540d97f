import { describe, expect, it } from 'vitest'
import { normalizePassword, passwordProblem } from '@shared/domain/passwords'

describe('normalizePassword', () => {
  it.each([
    ['NFKC folds a ligature', 'ﬁle cabinet', 'file cabinet'],
    ['NFKC folds fullwidth letters and digits', 'ｐａｓｓ１２', 'pass12'],
    ['zero-width space, joiner and BOM are dropped', 'a\u200bb\u200dc\ufeffd', 'abcd'],
    ['a soft hyphen is dropped', 'tow\u00adtruck', 'towtruck'],
    ['spaces are kept, leading and trailing too', '  two  spaces  ', '  two  spaces  '],
    ['an emoji (a surrogate pair) is kept', 'tow 🚗 yard', 'tow 🚗 yard'],
  ])('%s', (_name, input, expected) => {
    expect(normalizePassword(input)).toBe(expected)
  })
})

describe('passwordProblem', () => {
  it.each([
    ['too short, counted in characters not UTF-16 units', '🚗🚗🚗🚗🚗', /at least 10 characters/],
    ['only spaces', ' '.repeat(12), /only spaces/],
    ['only tabs and no-break spaces', '\t\u00a0\t\u00a0\t\u00a0\t\u00a0\t\u00a0', /only spaces/],
    ['one character repeated', 'zzzzzzzzzzzz', /repeat/],
    ['a pair repeated', '1212121212', /repeat/],
    ['a run up', 'klmnopqrstu', /run/],
    ['a run down', 'zyxwvutsrq', /run/],
    ['too long', 'x'.repeat(201) + 'y', /at most 200/],
    ['ten emoji, all one', '🚗'.repeat(10), /repeat/],
  ])('%s', (_name, password, message) => {
    expect(passwordProblem(password)).toMatch(message)
  })

  it.each(['correct horse battery', 'abcdefghij kept apart', '10 Tamsin Creek Road', 'tow 🚗 to the yard'])('%s is fine', (password) => {
    expect(passwordProblem(password)).toBeNull()
  })
})
