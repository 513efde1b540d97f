import { i18n } from '@/i18n'
import { money } from '@/composables/money'
import { type FieldParams, fieldWordsOf } from '@shared/schemas/field-messages'

// A field's message in the reader's language. A schema's message carries a code (a key under `fields` in
// shared/messages) and its parameters: the server's 400 answer sends them beside the English, and a check
// made here finds them from the message itself. A message without a code (zod's own) is shown as it came.
const { t, te } = i18n.global

/**
 * The words of a parameter: `what` is a key of `fields.what` (and `What` the same with a capital), `…Cents` an
 * amount, `noticeKind` a notice letter's kind; the rest as given.
 */
function shown(params: FieldParams | undefined): Record<string, string | number> {
  const out: Record<string, string | number> = { ...params }
  for (const [name, value] of Object.entries(params ?? {})) if (name.endsWith('Cents') && typeof value === 'number') out[name] = money(value)
  const kind = params?.noticeKind
  if (typeof kind === 'string' && te(`notices.kinds.${kind}`)) out.noticeKind = t(`notices.kinds.${kind}`)
  const what = params?.what
  if (typeof what === 'string' && te(`fields.what.${what}`)) {
    const words = t(`fields.what.${what}`)
    out.what = words
    // The first letter, after any opening mark ("¿rueda?" → "¿Rueda?").
    out.What = words.replace(/\p{L}/u, (c) => c.toLocaleUpperCase())
  }
  // A VIN's problem (its code and parameters beside the English) in the reader's words.
  const problemCode = params?.problemCode
  if (typeof problemCode === 'string' && te(`vin.problems.${problemCode}`)) out.problem = t(`vin.problems.${problemCode}`, params as Record<string, string | number>)
  return out
}

/** An issue from the server (`code`, `params`) or from a schema check here (its message), in the reader's language. */
export function fieldText(issue: { message: string; code?: string; params?: FieldParams }): string {
  const words = issue.code ? { code: issue.code, params: issue.params } : fieldWordsOf(issue.message)
  if (!words || !te(`fields.${words.code}`)) return issue.message
  return t(`fields.${words.code}`, shown(words.params))
}
