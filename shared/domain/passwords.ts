// Password rules both sides apply (OWASP ASVS 5.0 V6.2, NIST SP 800-63B 5.1.1.2): a length, no
// composition rules, and a refusal of what is guessed first. The list of the most common passwords
// is checked on the server only (server/users/common-passwords.ts): it is too big for the client.

export const PASSWORD_MIN = 10
export const PASSWORD_MAX = 200

// Characters that draw nothing: zero-width spaces and joiners, soft hyphens, BOMs, fillers.
const IGNORABLE = /\p{Default_Ignorable_Code_Point}/gu
// Spaces of every kind, control characters and the blank Braille pattern.
const BLANK = /^[\s\p{Cc}\u2800]*$/u

/**
 * One form for a password however it was typed (NIST SP 800-63B: NFKC), applied when it is set and
 * when it is checked: a ligature or fullwidth letter equals its plain letters, and invisible
 * characters, which no one can see they typed, are dropped. Spaces are kept.
 */
export function normalizePassword(password: string): string {
  return password.normalize('NFKC').replace(IGNORABLE, '')
}

/** Why a new (already normalised) password is refused, or null. Counted in characters, not UTF-16 units. */
export function passwordProblem(password: string): string | null {
  const chars = [...password]
  if (BLANK.test(password)) return 'The password cannot be only spaces or invisible characters.'
  if (chars.length < PASSWORD_MIN) return `The password needs at least ${PASSWORD_MIN} characters.`
  if (chars.length > PASSWORD_MAX) return `The password can have at most ${PASSWORD_MAX} characters.`
  const lower = password.toLowerCase()
  if (/^(.+?)\1+$/su.test(lower)) return 'The password repeats one part over and over (like "aaaa" or "abab"): choose something less predictable.'
  if (isRun([...lower])) return 'The password is a run of letters or digits in order (like "abcdef" or "98765"): choose something less predictable.'
  return null
}

function isRun(chars: string[]): boolean {
  const codes = chars.map((c) => c.codePointAt(0)!)
  const step = codes[1]! - codes[0]!
  return Math.abs(step) === 1 && codes.every((c, i) => i === 0 || c - codes[i - 1]! === step)
}
