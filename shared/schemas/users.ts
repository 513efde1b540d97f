import { z } from 'zod'
import { ROLES } from '../domain/roles'
import { text } from './fields'

export const roleSchema = z.enum(ROLES, { error: 'Choose a role: manager, dispatcher, technician or office.' })

const email = z.string().trim().toLowerCase().pipe(z.email({ error: 'Enter a valid e-mail address.' })).pipe(z.string().max(200))
// NIST SP 800-63B: length matters more than composition rules; long passphrases must fit.
export const passwordSchema = text({ error: 'Enter a password.' })
  .min(10, 'Use at least 10 characters.')
  .max(200, 'Use at most 200 characters.')

export const userSchema = z.object({
  id: z.uuid(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
})
export type User = z.infer<typeof userSchema>

export const userRowSchema = userSchema.extend({
  active: z.boolean(),
  createdAt: z.string(),
})
export type UserRow = z.infer<typeof userRowSchema>

export const createUserSchema = z.object({
  email,
  name: text().trim().min(1, 'Enter a name.').max(120, 'Keep the name under 120 characters.'),
  role: roleSchema,
  password: passwordSchema,
})
export type CreateUser = z.infer<typeof createUserSchema>

export const updateUserSchema = z
  .object({
    name: createUserSchema.shape.name.optional(),
    role: roleSchema.optional(),
    active: z.boolean().optional(),
  })
  .refine((v) => Object.keys(v).length > 0, 'Nothing to change.')
export type UpdateUser = z.infer<typeof updateUserSchema>

export const resetPasswordSchema = z.object({ password: passwordSchema })
