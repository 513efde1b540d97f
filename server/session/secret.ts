import { randomBytes } from 'node:crypto'
import { eq } from 'drizzle-orm'
import type { Database } from '@db/client'
import { appSettings } from '@db/schema'

/**
 * The cookie-signing secret: SESSION_SECRET when set, otherwise one made at first start and kept in
 * the database, so restarts and every app server on the same database agree on it.
 */
export async function sessionSecret(db: Database, fromEnv: string | undefined): Promise<string> {
  if (fromEnv) return fromEnv
  await db
    .insert(appSettings)
    .values({ key: 'session_secret', value: randomBytes(48).toString('base64url') })
    .onConflictDoNothing()
  const [row] = await db.select().from(appSettings).where(eq(appSettings.key, 'session_secret'))
  return row!.value
}
