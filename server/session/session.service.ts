import { eq } from 'drizzle-orm'
import type { Database } from '@db/client'
import { users } from '@db/schema'
import type { SignIn } from '@shared/schemas/session'
import type { User } from '@shared/schemas/users'
import { AppError, said } from '../errors'
import { findUsersByEmail, verifyPassword } from '../users/index'

// One message for an unknown e-mail, a wrong password and a deactivated account: no account discovery.
const REFUSED = 'That e-mail and password do not match an active account.'

export const signInRefused = () => new AppError(401, REFUSED, said('signInRefused'))

/** Who signed in, and the password hash their password was checked against. */
export interface Verified {
  user: User
  passwordHash: string
}

/**
 * The account the e-mail and password match, or null: unknown, wrong password or deactivated alike.
 * Companies may each have an account with one address (each with its own password): the password
 * is checked against all of them at once, and the oldest active one it matches signs in.
 */
export async function signIn(db: Database, input: SignIn): Promise<Verified | null> {
  const rows = await findUsersByEmail(db, input.email)
  if (rows.length === 0) {
    await verifyPassword(undefined, input.password)
    return null
  }
  const matches = await Promise.all(rows.map((r) => verifyPassword(r.passwordHash, input.password)))
  const row = rows.find((r, i) => matches[i] && r.active)
  if (!row) return null
  // The language only once the person chose one: until then the browser's, and the answer as it always was.
  const user: User = { id: row.id, email: row.email, name: row.name, role: row.role, ...(row.locale ? { locale: row.locale } : {}) }
  return { user, passwordHash: row.passwordHash }
}

/**
 * Whether the account is still as it was when its password was checked. Call it once the new
 * session row is saved: a deactivation, role change or password reset that committed in between
 * ended that user's sessions before this one existed. FOR SHARE waits for such a change still
 * under way, and one that starts later finds the saved row and ends it.
 */
export async function stillAsVerified(db: Database, { user, passwordHash }: Verified): Promise<boolean> {
  const [row] = await db
    .select({ active: users.active, role: users.role, passwordHash: users.passwordHash })
    .from(users)
    .where(eq(users.id, user.id))
    .for('share')
  return !!row && row.active && row.role === user.role && row.passwordHash === passwordHash
}
