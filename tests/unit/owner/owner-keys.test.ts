import { describe, expect, it } from 'vitest'
import { CODE_ALPHABET, codeInputSchema, formatCode, isCode, normalizeCode } from '@shared/schemas/owner'
import { keyHash, newCode, newToken, readKey } from '../../../server/owner/owner-keys'

describe('owner keys', () => {
  it('newToken_is32RandomBytes_as43Base64urlCharacters', () => {
    const tokens = new Set(Array.from({ length: 200 }, newToken))
    expect(tokens.size).toBe(200)
    for (const t of tokens) expect(t).toMatch(/^[A-Za-z0-9_-]{43}$/)
    expect(Buffer.from([...tokens][0]!, 'base64url')).toHaveLength(32)
  })

  it('newCode_usesOnlyTheUnambiguousAlphabet_andIsReadBack', () => {
    expect(CODE_ALPHABET).not.toMatch(/[01OIL]/)
    for (let i = 0; i < 200; i++) {
      const code = newCode()
      expect(isCode(code)).toBe(true)
      expect(readKey(code)).toEqual({ column: 'code', hash: keyHash('owner-code', code) })
    }
  })

  it.each([
    ['abcde-23456', 'ABCDE23456'],
    [' ABCDE 23456 ', 'ABCDE23456'],
    ['AbCdE-2345-6', 'ABCDE23456'],
  ])('a code typed as %j reads as %s', (typed, code) => {
    expect(normalizeCode(typed)).toBe(code)
    expect(codeInputSchema.parse({ code: typed }).code).toBe(code)
    expect(readKey(typed)?.hash).toBe(keyHash('owner-code', code))
  })

  it.each(['ABCDE2345', 'ABCDE234567', 'ABCDE2345O', 'ABCDE23451', '', '../../api/users'])('%j is neither a token nor a code', (key) => {
    expect(readKey(key)).toBeNull()
  })

  it('keyHash_separatesTokensFromCodes_andNeverReturnsTheKey', () => {
    const token = newToken()
    expect(keyHash('owner-token', token)).toMatch(/^[0-9a-f]{64}$/)
    expect(keyHash('owner-token', token)).not.toBe(keyHash('owner-code', token))
    expect(keyHash('owner-token', token)).not.toContain(token)
    expect(readKey(token)).toEqual({ column: 'token', hash: keyHash('owner-token', token) })
  })

  it('formatCode_printsTwoGroupsOfFive', () => {
    expect(formatCode('ABCDE23456')).toBe('ABCDE-23456')
  })
})
