import { dictionary } from '@zxcvbn-ts/language-common'
import { z } from 'zod'
import { normalizePassword, PASSWORD_MIN } from '@shared/domain/passwords'
import { msg } from '@shared/schemas/field-messages'
import { alongsideFieldIssues } from '@shared/schemas/fields'

// OWASP ASVS 5.0 V6.2.4: new passwords are checked against the most common ones that the length rule
// lets through. zxcvbn-ts's ranked list (49,233 entries, MIT) kept to those, lower-cased: built once
// at start, so a check is one Set lookup. Shorter entries are refused by the length rule anyway.
const COMMON = new Set(
  (dictionary['passwords-common'] as string[]).map((p) => normalizePassword(p).toLowerCase()).filter((p) => [...p].length >= PASSWORD_MIN),
)

export const COMMON_PASSWORD = msg('users.commonPassword', 'The password is one of the most common passwords, the first an attacker tries: choose another.')

export const isCommonPassword = (password: string) => COMMON.has(normalizePassword(password).toLowerCase())

/**
 * A request schema with a new password, plus the common-password check. It also runs when another
 * field is wrong, so a form shows every problem at once, but not when the password already has one.
 */
export function refusingCommonPasswords<T extends z.ZodType<{ password: string }>>(schema: T) {
  return schema.superRefine(
    (value, ctx) => {
      if (isCommonPassword(value.password)) ctx.addIssue({ code: 'custom', path: ['password'], message: COMMON_PASSWORD })
    },
    {
      when: ({ value, issues }) =>
        alongsideFieldIssues.when({ value }) && typeof (value as { password?: unknown }).password === 'string' && !issues.some((i) => i.path?.[0] === 'password'),
    },
  )
}
