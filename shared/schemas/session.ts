import { z } from 'zod'
import { normalizePassword } from '../domain/passwords'
import { text } from './fields'
import { userSchema } from './users'
import { msg } from './field-messages'

export const signInSchema = z.object({
  email: z.string({ error: msg('session.enterYourMailAddress', 'Enter your e-mail address.') }).trim().toLowerCase().min(1, msg('session.enterYourMailAddress', 'Enter your e-mail address.')).max(200),
  // The same normal form the password was set in (shared/domain/passwords.ts).
  password: text({ error: msg('session.enterYourPassword', 'Enter your password.') }).min(1, msg('session.enterYourPassword', 'Enter your password.')).max(200).transform(normalizePassword),
})
export type SignIn = z.infer<typeof signInSchema>

export const sessionSchema = z.object({
  user: userSchema.nullable(),
  csrfToken: z.string(),
})
export type SessionState = z.infer<typeof sessionSchema>

export const healthSchema = z.object({
  status: z.enum(['ok', 'degraded']),
  db: z.enum(['ok', 'down']),
  version: z.string(),
})
