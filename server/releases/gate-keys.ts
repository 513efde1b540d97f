import { createHash, randomBytes, randomInt } from 'node:crypto'
import { GATE_CODE_ALPHABET, GATE_CODE_LENGTH, normalizeGateCode } from '@shared/schemas/releases'

/** 32 random bytes (256 bits) as base64url: the token in the pass's QR. */
export const newGateToken = () => randomBytes(32).toString('base64url')

/** The short code a gate types from the printed pass: ~49 bits, staff-only, single use and expiring. */
export function newGateCode(): string {
  let code = ''
  for (let i = 0; i < GATE_CODE_LENGTH; i++) code += GATE_CODE_ALPHABET[randomInt(GATE_CODE_ALPHABET.length)]
  return code
}

/** What is stored of a pass's token or code: its SHA-256 under its own label (never the owner links'). */
export const gateHash = (kind: 'gate-token' | 'gate-code', value: string) => createHash('sha256').update(`holdfast:${kind}:${value}`).digest('hex')

const TOKEN = /^[A-Za-z0-9_-]{43}$/

/**
 * What the gate read or typed — the QR's link (…/g/<token>), a bare token, or the short code in any
 * case, with or without its dash — as the hash to look the pass up by; null when it can be none of them.
 */
export function readPass(value: string): { column: 'token' | 'code'; hash: string } | null {
  const trimmed = value.trim()
  const fromLink = /\/g\/([A-Za-z0-9_-]{43})(?:[/?#]|$)/.exec(trimmed)?.[1]
  const token = fromLink ?? (TOKEN.test(trimmed) ? trimmed : null)
  if (token) return { column: 'token', hash: gateHash('gate-token', token) }
  const code = normalizeGateCode(trimmed)
  const alphabet = new RegExp(`^[${GATE_CODE_ALPHABET}]{${GATE_CODE_LENGTH}}$`)
  if (alphabet.test(code)) return { column: 'code', hash: gateHash('gate-code', code) }
  return null
}
