import { Router } from 'express'
import { type AnonymousCsrf, newCsrfToken } from '../middleware/index'
import type { Database } from '@db/client'
import { signInSchema } from '@shared/schemas/session'
import { setLocaleSchema } from '@shared/schemas/users'
import { AppError, said } from '../errors'
import { type BoardNotifier, sessionKey } from '../live/index'
import type { KnownDevices } from './known-devices'
import { setOwnLocale } from '../users/index'
import { signIn, signInRefused, stillAsVerified } from './session.service'
import { addressKey, type SignInThrottle } from './sign-in-throttle'

export interface SessionRouterDeps {
  anonymous: AnonymousCsrf
  devices: KnownDevices
  throttle: SignInThrottle
  /** Ends the open board streams of a signed-out session. */
  boards: BoardNotifier
}

function promisify(fn: (cb: (err?: unknown) => void) => void): Promise<void> {
  return new Promise((resolve, reject) => fn((err) => (err ? reject(err) : resolve())))
}

function tooMany(waitMs: number): AppError {
  const seconds = Math.ceil(waitMs / 1000)
  if (seconds < 120) {
    return new AppError(429, `Too many failed sign-ins from here. Wait ${seconds} second${seconds === 1 ? '' : 's'} and try again.`, seconds === 1 ? said('signInWaitSecond') : said('signInWaitSeconds', { n: seconds }))
  }
  const minutes = Math.ceil(seconds / 60)
  return new AppError(429, `Too many failed sign-ins from here. Wait ${minutes} minutes and try again.`, said('signInWaitMinutes', { n: minutes }))
}

export function sessionRouter(db: Database, { anonymous, devices, throttle, boards }: SessionRouterDeps): Router {
  const router = Router()

  // Signed in: the session's own token. Signed out: nothing is kept, so no session row is written.
  router.get('/', (req, res) => {
    const csrfToken = req.user && req.session.csrfToken ? req.session.csrfToken : anonymous.tokenFor(req, res)
    res.json({ user: req.user ?? null, csrfToken })
  })

  router.post('/', async (req, res) => {
    const input = signInSchema.parse(req.body)
    const counters = throttle.countersFor(input.email, addressKey(req.ip ?? ''), devices.knownFor(req, input.email))
    // A held attempt is answered before its password is checked, and is not counted.
    const wait = await throttle.waitMs(counters)
    if (wait > 0) {
      res.set('retry-after', String(Math.ceil(wait / 1000)))
      throw tooMany(wait)
    }
    const verified = await signIn(db, input)
    if (!verified) {
      await throttle.failed(counters)
      throw signInRefused()
    }
    await throttle.succeeded(counters)
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
    devices.remember(req, res, input.email)
    res.json({ user, csrfToken: req.session.csrfToken })
  })

  // The signed-in person's own language, kept with the account: the next sign-in, on any device, opens in it.
  router.put('/locale', async (req, res) => {
    const { locale } = setLocaleSchema.parse(req.body)
    const user = await setOwnLocale(db, req.user!, locale)
    req.session.user = user
    res.json({ user })
  })

  router.delete('/', async (req, res) => {
    const ended = sessionKey(req.sessionID)
    await promisify((cb) => req.session.destroy(cb))
    // Its open board streams end now, on every app server, not at their next heartbeat.
    await boards.sessionsEnded({ sessionKey: ended })
    res.clearCookie('holdfast.sid', { path: '/' })
    res.status(204).end()
  })
  return router
}
