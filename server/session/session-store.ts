import { and, eq, gt, lt, sql } from 'drizzle-orm'
import session from 'express-session'
import type { Database, Executor } from '@db/client'
import type { Locale } from '@shared/messages/locales'
import { sessions } from '@db/schema'

const DAY = 86_400_000
// A touch writes at most once a minute per session and process: the idle expiry is 30 minutes.
const TOUCH_SLACK_MS = 60_000

type Done = (err?: unknown, value?: session.SessionData | null) => void

/** express-session rows kept in the database, so any app server can answer any request. */
export class DatabaseSessionStore extends session.Store {
  /** When this process last wrote each session's expiry: most requests need no write at all. */
  private readonly touched = new Map<string, number>()

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
    this.remember(sid, Date.now())
    const row = { sid, data: sess as unknown as Record<string, unknown>, userId: sess.user?.id ?? null, expiresAt }
    this.db
      .insert(sessions)
      .values(row)
      .onConflictDoUpdate({ target: sessions.sid, set: { data: row.data, userId: row.userId, expiresAt } })
      .then(() => done(), done)
  }

  override touch(sid: string, sess: session.SessionData, done: (err?: unknown) => void = () => {}): void {
    const now = Date.now()
    if (now - (this.touched.get(sid) ?? 0) < TOUCH_SLACK_MS) return done()
    this.remember(sid, now)
    this.db
      .update(sessions)
      .set({ expiresAt: expiry(sess) })
      .where(eq(sessions.sid, sid))
      .then(() => done(), done)
  }

  private remember(sid: string, at: number) {
    this.touched.set(sid, at)
    if (this.touched.size > 10_000) {
      for (const [key, when] of this.touched) if (at - when > TOUCH_SLACK_MS) this.touched.delete(key)
    }
  }

  override destroy(sid: string, done: (err?: unknown) => void = () => {}): void {
    this.touched.delete(sid)
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

/** A renamed user keeps their sessions; the name they carry is updated in place. */
export async function renameInSessions(db: Executor, userId: string, name: string): Promise<void> {
  await db
    .update(sessions)
    .set({ data: sql`jsonb_set(${sessions.data}, '{user,name}', to_jsonb(${name}::text))` })
    .where(eq(sessions.userId, userId))
}

/** A person's new language, written into every session they hold (the session carries the user). */
export async function localeInSessions(db: Executor, userId: string, locale: Locale): Promise<void> {
  await db
    .update(sessions)
    .set({ data: sql`jsonb_set(${sessions.data}, '{user,locale}', to_jsonb(${locale}::text))` })
    .where(eq(sessions.userId, userId))
}

export async function pruneExpiredSessions(db: Database): Promise<void> {
  await db.delete(sessions).where(lt(sessions.expiresAt, new Date()))
}
