import { type Request, Router } from 'express'
import { rateLimit } from 'express-rate-limit'
import type { Database } from '@db/client'
import { signInSchema } from '@shared/schemas/session'
import { AppError } from '../errors'
import { newCsrfToken } from '../middleware/index'
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

function csrfTokenOf(req: Request): string {
  req.session.csrfToken ??= newCsrfToken()
  return req.session.csrfToken
}

export function sessionRouter(db: Database, limits: SignInLimits): Router {
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

  router.get('/', (req, res) => {
    res.json({ user: req.user ?? null, csrfToken: csrfTokenOf(req) })
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
