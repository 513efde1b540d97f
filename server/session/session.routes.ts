import { Router } from 'express'
import { rateLimit } from 'express-rate-limit'
import type { Database } from '../../db/client'
import { signInSchema } from '../../shared/schemas/session'
import { AppError } from '../errors'
import type { AnonymousCsrf } from '../middleware/anonymous-csrf'
import { newCsrfToken } from '../middleware/session'
import { signIn, signInRefused, stillAsVerified } from './session.service'

export interface SignInLimits {
  /** Failed sign-ins allowed per account in the window. */
  perAccount: number
  /** Sign-in attempts allowed per IP address in the window. */
  perIp: number
  windowMs: number
}

const TOO_MANY = 'Too many sign-in attempts. Wait a few minutes and try again.'

function promisify(fn: (cb: (err?: unknown) => void) => void): Promise<void> {
  return new Promise((resolve, reject) => fn((err) => (err ? reject(err) : resolve())))
}

export function sessionRouter(db: Database, anonymous: AnonymousCsrf, limits: SignInLimits): Router {
  const router = Router()
  const byIp = rateLimit({
    windowMs: limits.windowMs,
    limit: limits.perIp,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) => next(new AppError(429, TOO_MANY)),
  })
  const byAccount = rateLimit({
    windowMs: limits.windowMs,
    limit: limits.perAccount,
    skipSuccessfulRequests: true,
    standardHeaders: false,
    legacyHeaders: false,
    keyGenerator: (req) => `account:${String(req.body?.email ?? '').trim().toLowerCase()}`,
    handler: (_req, _res, next) => next(new AppError(429, TOO_MANY)),
  })

  // Signed in: the session's own token. Signed out: nothing is kept, so no session row is written.
  router.get('/', (req, res) => {
    const csrfToken = req.user && req.session.csrfToken ? req.session.csrfToken : anonymous.tokenFor(req, res)
    res.json({ user: req.user ?? null, csrfToken })
  })

  router.post('/', byIp, byAccount, async (req, res) => {
    const input = signInSchema.parse(req.body)
    const verified = await signIn(db, input)
    const { user } = verified
    // A new session id at sign-in: an id planted before sign-in is worth nothing after it.
    await promisify((cb) => req.session.regenerate(cb))
    req.session.user = user
    req.session.signedInAt = Date.now()
    req.session.csrfToken = newCsrfToken()
    await promisify((cb) => req.session.save(cb))
    if (!(await stillAsVerified(db, verified))) {
      await promisify((cb) => req.session.destroy(cb))
      throw signInRefused()
    }
    res.json({ user, csrfToken: req.session.csrfToken })
  })

  router.delete('/', async (req, res) => {
    await promisify((cb) => req.session.destroy(cb))
    res.clearCookie('holdfast.sid', { path: '/' })
    res.status(204).end()
  })
  return router
}
