import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto'
import type { Request, Response } from 'express'
import { readCookie } from '../middleware/index'

export const DEVICE_COOKIE = 'holdfast.device'
const LIFETIME_MS = 90 * 24 * 60 * 60_000
// A shared office computer may be signed in to by a few people; each has a token of their own.
const MAX_TOKENS = 5

/**
 * "Known devices" (OWASP, Slow Down Online Guessing Attacks with Device Cookies): a successful
 * sign-in leaves the browser a token for that account, `issued.nonce.signature`, where the
 * signature covers the account's e-mail address — the cookie itself names no one. A browser that
 * shows a genuine, unexpired token for the account it signs in to is counted on its own by the
 * sign-in throttle, so strangers' guesses cannot keep it out. The token grants nothing by itself:
 * the password is still checked.
 */
export function knownDevices(secret: string, secure: boolean, now: () => number = Date.now) {
  // Its own key, so this signature can never stand in for another one made from the same secret.
  const key = createHmac('sha256', secret).update('holdfast known device').digest()
  const sign = (email: string, body: string) => createHmac('sha256', key).update(`${email}\n${body}`).digest('base64url')

  const tokensOf = (req: Request) => (readCookie(req, DEVICE_COOKIE) ?? '').split('~').filter(Boolean).slice(0, MAX_TOKENS)

  function fresh(issued: string): boolean {
    const age = now() - parseInt(issued, 36) * 1000
    return age >= 0 && age < LIFETIME_MS
  }

  /** The nonce of a token that is this server's, unexpired, and for this account. */
  function nonceFor(token: string, email: string): string | null {
    const [issued, nonce, sig, extra] = token.split('.')
    if (!issued || !nonce || !sig || extra !== undefined || !fresh(issued)) return null
    const expected = Buffer.from(sign(email, `${issued}.${nonce}`))
    const given = Buffer.from(sig)
    return given.length === expected.length && timingSafeEqual(given, expected) ? nonce : null
  }

  return {
    /** This browser's device id for the account, or null when it has not signed in to it before. */
    knownFor(req: Request, email: string): string | null {
      for (const token of tokensOf(req)) {
        const nonce = nonceFor(token, email)
        if (nonce) return nonce
      }
      return null
    },

    /** After a successful sign-in: a fresh token for this account; the newest few for others are kept. */
    remember(req: Request, res: Response, email: string): void {
      const body = `${Math.floor(now() / 1000).toString(36)}.${randomBytes(16).toString('base64url')}`
      const others = tokensOf(req).filter((t) => fresh(t.split('.')[0]!) && nonceFor(t, email) === null)
      const tokens = [`${body}.${sign(email, body)}`, ...others].slice(0, MAX_TOKENS)
      res.cookie(DEVICE_COOKIE, tokens.join('~'), { httpOnly: true, sameSite: 'strict', secure, path: '/api/session', maxAge: LIFETIME_MS })
    },
  }
}

export type KnownDevices = ReturnType<typeof knownDevices>
