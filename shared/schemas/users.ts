import { z } from 'zod'
import { normalizePassword, passwordProblem } from '../domain/passwords'
import { ROLES } from '../domain/access/roles'
import { LOCALES } from '../messages/locales'
import { text } from './fields'
import { msg } from './field-messages'

export const roleSchema = z.enum(ROLES, { error: msg('users.chooseRoleManagerDispatcher', 'Choose a role: manager, dispatcher, technician or office.') })

const email = z.string().trim().toLowerCase().pipe(z.email({ error: msg('users.enterValidMailAddress', 'Enter a valid e-mail address.') })).pipe(z.string().max(200))
// NIST SP 800-63B, OWASP ASVS 5.0 V6.2: length, no composition rules, nothing guessed first; kept in
// one normal form. The server also refuses the most common passwords (server/users/common-passwords.ts).
export const passwordSchema = text({ error: msg('users.enterPassword', 'Enter a password.') })
  .min(1, msg('users.enterPassword', 'Enter a password.'))
  .transform(normalizePassword)
  .superRefine((password, ctx) => {
    const problem = passwordProblem(password)
    if (problem) ctx.addIssue({ code: 'custom', message: problem })
  })

export const localeSchema = z.enum(LOCALES, { error: msg('common.chooseEnglishSpanish', 'Choose English or Spanish.') })

export const userSchema = z.object({
  id: z.uuid(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  /** The language this person chose to work in; none yet: the browser's. */
  locale: localeSchema.nullable().optional(),
})
export type User = z.infer<typeof userSchema>

export const userRowSchema = userSchema.extend({
  active: z.boolean(),
  createdAt: z.string(),
  /** Belongs to every yard of the company, present and future (else to `yardIds`). */
  allYards: z.boolean(),
  /** The yards the manager chose for them (the Staff list fills it; empty with all yards). */
  yardIds: z.array(z.uuid()).optional(),
})
export type UserRow = z.infer<typeof userRowSchema>

export const createUserSchema = z.object({
  email,
  name: text().trim().min(1, msg('users.enterName', 'Enter a name.')).max(120, msg('users.keepNameUnder120', 'Keep the name under 120 characters.')),
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
  .refine((v) => Object.keys(v).length > 0, msg('users.nothingChange', 'Nothing to change.'))
export type UpdateUser = z.infer<typeof updateUserSchema>

export const resetPasswordSchema = z.object({ password: passwordSchema })

/** A person's own language, saved with their account (PUT /api/session/locale). */
export const setLocaleSchema = z.object({ locale: localeSchema })
export type SetLocale = z.infer<typeof setLocaleSchema>

/** PUT /api/users/:id/yards: every yard of the company, or the yards chosen (at least one). */
export const staffYardsSchema = z
  .object({
    allYards: z.boolean({ error: msg('users.chooseAllYardsYards', 'Choose all yards or the yards this person works in.') }),
    yardIds: z.array(z.uuid({ error: msg('common.chooseOneYourYards', 'Choose one of your yards.') })).max(200).default([]),
  })
  .superRefine((v, ctx) => {
    if (!v.allYards && v.yardIds.length === 0) ctx.addIssue({ code: 'custom', path: ['yardIds'], message: msg('users.chooseAtLeastOne', 'Choose at least one yard, or all yards.') })
  })
export type StaffYards = z.input<typeof staffYardsSchema>
