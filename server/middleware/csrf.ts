import { timingSafeEqual } from 'node:crypto'
import type { RequestHandler } from 'express'
import { AppError, said } from '../errors'
import type { AnonymousCsrf } from './anonymous-csrf'

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS'])

/**
 * Every state-changing request carries the session's token in `x-csrf-token` (or, with no session,
 * the signed anonymous token that matches its cookie), and a browser's Origin, when sent, must be
 * this server or one configured in HOLDFAST_ORIGINS.
 */
export function csrfProtection(allowedOrigins: string[], anonymous: AnonymousCsrf, exempt: (path: string) => boolean = () => false): RequestHandler {
  return (req, _res, next) => {
    if (SAFE.has(req.method) || exempt(req.path)) return next()
    const origin = req.get('origin')
    if (origin && origin !== `${req.protocol}://${req.get('host')}` && !allowedOrigins.includes(origin)) {
      return next(new AppError(403, 'This request came from another site and was refused.', said('csrfOtherSite')))
    }
    const sent = req.get('x-csrf-token') ?? ''
    const expected = req.session?.csrfToken
    if (expected ? !sameToken(sent, expected) : !anonymous.accepts(req, sent)) {
      return next(new AppError(403, 'The page is out of date or the security token is missing. Reload and try again.', said('csrfStale')))
    }
    next()
  }
}

function sameToken(a: string, b: string): boolean {
  const x = Buffer.from(a)
  const y = Buffer.from(b)
  return x.length === y.length && timingSafeEqual(x, y)
}
