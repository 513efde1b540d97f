import type { Database } from '../../db/client'
import type { SignIn } from '../../shared/schemas/session'
import type { User } from '../../shared/schemas/users'
import { AppError } from '../errors'
import { verifyPassword } from '../users/passwords'
import { findUserByEmail } from '../users/users.queries'

// One message for an unknown e-mail, a wrong password and a deactivated account: no account discovery.
const REFUSED = 'That e-mail and password do not match an active account.'

export async function signIn(db: Database, input: SignIn): Promise<User> {
  const row = await findUserByEmail(db, input.email)
  const ok = await verifyPassword(row?.passwordHash, input.password)
  if (!row || !ok || !row.active) throw new AppError(401, REFUSED)
  return { id: row.id, email: row.email, name: row.name, role: row.role }
}
