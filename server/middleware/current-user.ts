import { and, eq } from 'drizzle-orm'
import type { RequestHandler } from 'express'
import type { Database } from '../../db/client'
import { users } from '../../db/schema/index'
import { ABSOLUTE_TIMEOUT_MS } from './session'

/**
 * Loads the signed-in user on every request, so a deactivation or a role change takes effect at once,
 * and ends a session 12 hours after sign-in whatever the activity.
 */
export function currentUser(db: Database, now: () => number = Date.now): RequestHandler {
  return async (req, _res, next) => {
    const userId = req.session?.userId
    if (!userId) return next()
    if (now() - (req.session.signedInAt ?? 0) > ABSOLUTE_TIMEOUT_MS) {
      await new Promise<void>((resolve, reject) => req.session.destroy((err) => (err ? reject(err) : resolve())))
      return next()
    }
    const [user] = await db
      .select({ id: users.id, email: users.email, name: users.name, role: users.role })
      .from(users)
      .where(and(eq(users.id, userId), eq(users.active, true)))
    if (user) req.user = user
    next()
  }
}
