import type { RequestHandler } from 'express'
import { ABSOLUTE_TIMEOUT_MS } from './session'

/**
 * The signed-in user, from the session: every change that must take effect at once (deactivation,
 * a new role, a new password) deletes that user's session rows, so no lookup is needed per request.
 * A session also ends 12 hours after sign-in whatever the activity.
 */
export function currentUser(now: () => number = Date.now): RequestHandler {
  return async (req, _res, next) => {
    const user = req.session?.user
    if (!user) return next()
    if (now() - (req.session.signedInAt ?? 0) > ABSOLUTE_TIMEOUT_MS) {
      await new Promise<void>((resolve, reject) => req.session.destroy((err) => (err ? reject(err) : resolve())))
      return next()
    }
    req.user = user
    next()
  }
}
