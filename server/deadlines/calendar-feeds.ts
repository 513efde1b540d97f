import { createHash, randomBytes } from 'node:crypto'
import { and, eq, gt } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { calendarFeeds, users } from '@db/schema'
import { can } from '@shared/domain/access'
import type { CalendarFeed } from '@shared/schemas/deadlines'

/** How long a feed address opens the calendar before its person renews it. */
export const FEED_DAYS = 365
const DAY_MS = 86_400_000
const TOKEN = /^[A-Za-z0-9_-]{43}$/

/**
 * What is stored of a feed token: its SHA-256 under its own label, so a copy of the database opens no
 * feed and a feed token can never be taken for an owner link. 256 random bits need no slow hash.
 */
const feedHash = (token: string) => createHash('sha256').update(`holdfast:calendar-feed:${token}`).digest('hex')

const view = (row: { createdAt: Date; expiresAt: Date } | undefined): CalendarFeed =>
  row ? { active: true, createdAt: row.createdAt.toISOString(), expiresAt: row.expiresAt.toISOString() } : { active: false, createdAt: null, expiresAt: null }

export async function feedOf(db: Executor, userId: string, now = new Date()): Promise<CalendarFeed> {
  const [row] = await db.select().from(calendarFeeds).where(and(eq(calendarFeeds.userId, userId), gt(calendarFeeds.expiresAt, now)))
  return view(row)
}

/** A new secret address for this person's feed; the one before it stops working. The token leaves here once. */
export async function renewFeed(db: Executor, userId: string, now = new Date()): Promise<{ feed: CalendarFeed; token: string }> {
  const token = randomBytes(32).toString('base64url')
  const values = { userId, tokenHash: feedHash(token), createdAt: now, expiresAt: new Date(now.getTime() + FEED_DAYS * DAY_MS) }
  const [row] = await db
    .insert(calendarFeeds)
    .values(values)
    .onConflictDoUpdate({ target: calendarFeeds.userId, set: { tokenHash: values.tokenHash, createdAt: values.createdAt, expiresAt: values.expiresAt } })
    .returning()
  return { feed: view(row), token }
}

export async function revokeFeed(db: Executor, userId: string): Promise<void> {
  await db.delete(calendarFeeds).where(eq(calendarFeeds.userId, userId))
}

/**
 * The staff member a feed token belongs to, while the feed is live, the person active and still allowed
 * the Deadlines page; otherwise undefined (the caller answers 404 either way: nothing tells a guess why).
 */
export async function feedOwner(db: Executor, token: string, now = new Date()) {
  if (!TOKEN.test(token)) return undefined
  const [row] = await db
    .select({ id: users.id, role: users.role, active: users.active })
    .from(calendarFeeds)
    .innerJoin(users, eq(users.id, calendarFeeds.userId))
    .where(and(eq(calendarFeeds.tokenHash, feedHash(token)), gt(calendarFeeds.expiresAt, now)))
  return row && row.active && can(row.role, 'deadlines') ? row : undefined
}
