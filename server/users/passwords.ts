import argon2 from 'argon2'

// OWASP Password Storage Cheat Sheet, argon2id minimum: m = 19 MiB, t = 2, p = 1 (~23 ms here).
const OPTIONS = { type: argon2.argon2id, memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const

export const hashPassword = (password: string) => argon2.hash(password, OPTIONS)

// Verifying against this when the account does not exist keeps the answer time the same either way.
let dummyHash: Promise<string> | undefined

export async function verifyPassword(hash: string | undefined, password: string): Promise<boolean> {
  if (!hash) {
    dummyHash ??= hashPassword('no such account, constant time')
    await argon2.verify(await dummyHash, password)
    return false
  }
  return argon2.verify(hash, password)
}
