import { createHash, randomBytes, randomInt } from 'node:crypto'
import { CODE_ALPHABET, CODE_LENGTH, isCode, normalizeCode } from '@shared/schemas/owner'

/** 32 random bytes (256 bits) as base64url: 43 characters, the link's token. */
export function newToken(): string {
  return randomBytes(32).toString('base64url')
}

/** A short code a person types from a letter, from an alphabet with nothing to misread. */
export function newCode(): string {
  let code = ''
  for (let i = 0; i < CODE_LENGTH; i++) code += CODE_ALPHABET[randomInt(CODE_ALPHABET.length)]
  return code
}

/**
 * What is stored of a token or code: its SHA-256. Both are random and single-purpose, so a fast hash
 * is enough for the token (2^256 guesses); the code's ~50 bits are guarded by the rate limit and by
 * expiry. Each is hashed under its own label, so a token can never be taken for a code or a gate pass.
 */
export function keyHash(kind: 'owner-token' | 'owner-code', value: string): string {
  return createHash('sha256').update(`holdfast:${kind}:${value}`).digest('hex')
}

const TOKEN = /^[A-Za-z0-9_-]{43}$/

/** The page's key as it came in the address: a token, a code (in any case, with or without its dash), or nothing valid. */
export function readKey(key: string): { column: 'token' | 'code'; hash: string } | null {
  if (TOKEN.test(key)) return { column: 'token', hash: keyHash('owner-token', key) }
  const code = normalizeCode(key)
  if (isCode(code)) return { column: 'code', hash: keyHash('owner-code', code) }
  return null
}
