import { and, eq, gt, lt } from 'drizzle-orm'
import session from 'express-session'
import type { Database, Executor } from '../../db/client'
import { sessions } from '../../db/schema/index'

const DAY = 86_400_000
// A touch only writes when the expiry would move by more than this: one write a minute, not one per request.
const TOUCH_SLACK_MS = 60_000

type Done = (err?: unknown, value?: session.SessionData | null) => void

/** express-session rows kept in the database, so any app server can answer any request. */
export class DatabaseSessionStore extends session.Store {
  constructor(private readonly db: Database) {
    super()
  }

  override get(sid: string, done: Done): void {
    this.db
      .select({ data: sessions.data })
      .from(sessions)
      .where(and(eq(sessions.sid, sid), gt(sessions.expiresAt, new Date())))
      .then((rows) => done(null, (rows[0]?.data as session.SessionData | undefined) ?? null), done)
  }

  override set(sid: string, sess: session.SessionData, done: (err?: unknown) => void = () => {}): void {
    const expiresAt = expiry(sess)
    const row = { sid, data: sess as unknown as Record<string, unknown>, userId: sess.userId ?? null, expiresAt }
    this.db
      .insert(sessions)
      .values(row)
      .onConflictDoUpdate({ target: sessions.sid, set: { data: row.data, userId: row.userId, expiresAt } })
      .then(() => done(), done)
  }

  override touch(sid: string, sess: session.SessionData, done: (err?: unknown) => void = () => {}): void {
    const expiresAt = expiry(sess)
    this.db
      .update(sessions)
      .set({ expiresAt })
      .where(and(eq(sessions.sid, sid), lt(sessions.expiresAt, new Date(expiresAt.getTime() - TOUCH_SLACK_MS))))
      .then(() => done(), done)
  }

  override destroy(sid: string, done: (err?: unknown) => void = () => {}): void {
    this.db
      .delete(sessions)
      .where(eq(sessions.sid, sid))
      .then(() => done(), done)
  }
}

function expiry(sess: session.SessionData): Date {
  const expires = sess.cookie?.expires
  return expires ? new Date(expires) : new Date(Date.now() + DAY)
}

export async function endSessionsOf(db: Executor, userId: string): Promise<void> {
  await db.delete(sessions).where(eq(sessions.userId, userId))
}

export async function pruneExpiredSessions(db: Database): Promise<void> {
  await db.delete(sessions).where(lt(sessions.expiresAt, new Date()))
}
