import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto'
import type { Request, Response } from 'express'
import { readCookie } from './cookies'

export const ANONYMOUS_CSRF_COOKIE = 'holdfast.csrf'
const LIFETIME_MS = 24 * 60 * 60_000

/**
 * The CSRF token of a browser that is not signed in: a signed double-submit value (OWASP CSRF
 * Prevention Cheat Sheet) in a cookie of its own, so a visit to the sign-in page writes no session
 * row. The page echoes it in `x-csrf-token`; a request is accepted when header and cookie agree and
 * the signature is this server's. Signing in replaces it with the session's own token.
 */
export function anonymousCsrf(secret: string, secure: boolean) {
  // Its own key, so this signature can never stand in for another one made from the same secret.
  const key = createHmac('sha256', secret).update('holdfast anonymous csrf token').digest()
  const sign = (body: string) => createHmac('sha256', key).update(body).digest('base64url')

  function valid(token: string | undefined, now = Date.now()): token is string {
    const [issued, nonce, sig, extra] = (token ?? '').split('.')
    if (!issued || !nonce || !sig || extra !== undefined) return false
    const age = now - parseInt(issued, 36)
    return age >= 0 && age < LIFETIME_MS && same(sig, sign(`${issued}.${nonce}`))
  }

  return {
    /** The browser's token, minted (and its cookie set) when it has none or it has expired. */
    tokenFor(req: Request, res: Response): string {
      const held = readCookie(req, ANONYMOUS_CSRF_COOKIE)
      if (valid(held)) return held
      const body = `${Date.now().toString(36)}.${randomBytes(18).toString('base64url')}`
      const token = `${body}.${sign(body)}`
      res.cookie(ANONYMOUS_CSRF_COOKIE, token, { httpOnly: true, sameSite: 'strict', secure, path: '/api' })
      return token
    },
    /** Whether the header carries the browser's own, genuine anonymous token. */
    accepts(req: Request, sent: string): boolean {
      const held = readCookie(req, ANONYMOUS_CSRF_COOKIE)
      return valid(held) && same(sent, held)
    },
  }
}

export type AnonymousCsrf = ReturnType<typeof anonymousCsrf>

function same(a: string, b: string): boolean {
  const x = Buffer.from(a)
  const y = Buffer.from(b)
  return x.length === y.length && timingSafeEqual(x, y)
}
