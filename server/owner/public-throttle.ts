import { createHash } from 'node:crypto'
import { inArray } from 'drizzle-orm'
import type { Response } from 'express'
import type { Database } from '@db/client'
import { signInFailures } from '@db/schema'
import { AppError, said } from '../errors'
import { addressKey, countFailure } from '../session/index'

export interface PublicLimits {
  /** Tries from one address (an IPv6 /64) before each further one waits: wrong owner keys, or lookups. */
  perAddress: number
  windowMs: number
  now?: () => number
}

export const DEFAULT_PUBLIC_LIMITS: PublicLimits = { perAddress: 10, windowMs: 15 * 60_000 }


/**
 * Public pages that answer to something a stranger could guess — an owner's short code, a plate
 * and the end of a VIN — count tries per address in the database, like the sign-in throttle
 * (server/session/sign-in-throttle.ts, in the same table under keys of their own: one place to
 * prune, shared by every app server). Past `perAddress` tries in the window, each further one
 * waits 5 s, doubling, at most the window, and is answered 429 before anything is looked up.
 */
export function publicThrottle(db: Database, limits: PublicLimits) {
  const now = () => limits.now?.() ?? Date.now()
  const keyOf = (kind: string, ip: string) => `${kind}:${createHash('sha256').update(addressKey(ip)).digest('base64url').slice(0, 32)}`

  return {
    /** Refuses (429, Retry-After) while this address must wait. */
    async check(kind: 'owner-key' | 'lookup', ip: string, res: Response): Promise<void> {
      const [row] = await db.select({ blockedUntil: signInFailures.blockedUntil }).from(signInFailures).where(inArray(signInFailures.key, [keyOf(kind, ip)]))
      const wait = (row?.blockedUntil?.getTime() ?? 0) - now()
      if (wait <= 0) return
      const seconds = Math.ceil(wait / 1000)
      res.setHeader('Retry-After', String(seconds))
      throw new AppError(429, 'Too many tries from here. Wait a little and try again.', said('tooManyTries', undefined, { retryAfterSeconds: seconds }))
    },

    /** One more try counted against this address. */
    async count(kind: 'owner-key' | 'lookup', ip: string): Promise<void> {
      const key = keyOf(kind, ip)
      const at = new Date(now())
      await countFailure(db, key, at, { windowMs: limits.windowMs, free: limits.perAddress })
    },
  }
}

export type PublicThrottle = ReturnType<typeof publicThrottle>
