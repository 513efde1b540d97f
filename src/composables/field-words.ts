import { i18n } from '@/i18n'
import { calendarDate, yardFormat } from '@/composables/yard-time'
import { money } from '@/composables/money'
import { type FieldParams, fieldWordsOf } from '@shared/schemas/field-messages'

// A field's message in the reader's language. A schema's message carries a code (a key under `fields` in
// shared/messages) and its parameters: the server's 400 answer sends them beside the English, and a check
// made here finds them from the message itself. A message without a code (zod's own) is shown as it came.
const { t, te } = i18n.global

const ISO_DAY = /^\d{4}-\d{2}-\d{2}$/
// A day the server counted on the yard's clock (an ID's expiry, a sale's first day): `date`, `day`.
const DAYS = ['date', 'day']

/**
 * The words of a parameter: `what` is a key of `fields.what` (and `What` the same with a capital); `date` and
 * `day` are yard days; `at` with `timeZone` an instant on that yard's clock; `…Cents` an amount; `noticeKind` a
 * notice letter's kind; `…Es` is the rule set's own Spanish for the parameter before it (`rule` → `ruleEs`); the
 * rest as given.
 */
function shown(params: FieldParams | undefined): Record<string, string | number> {
  const out: Record<string, string | number> = { ...params }
  for (const name of DAYS) if (typeof params?.[name] === 'string' && ISO_DAY.test(params[name])) out[name] = calendarDate(params[name])
  if (typeof params?.at === 'string' && typeof params.timeZone === 'string') out.at = yardFormat(params.timeZone).dateTime(params.at)
  for (const [name, value] of Object.entries(params ?? {})) if (name.endsWith('Cents') && typeof value === 'number') out[name] = money(value)
  const kind = params?.noticeKind
  if (typeof kind === 'string' && te(`notices.kinds.${kind}`)) out.noticeKind = t(`notices.kinds.${kind}`)
  if (i18n.global.locale.value === 'es') for (const [name, value] of Object.entries(params ?? {})) if (name.endsWith('Es')) out[name.slice(0, -2)] = value
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
  // A space too small (spaceFit's `code` and sizes beside its English `reason`).
  const fitCode = params?.fitCode
  if (typeof fitCode === 'string' && te(`vehicle.spaceFit.${fitCode}`)) {
    const size = (s: unknown) => (te(`vehicle.spaceSizes.${String(s)}`) ? t(`vehicle.spaceSizes.${String(s)}`) : String(s))
    out.reason = t(`vehicle.spaceFit.${fitCode}`, { needs: size(params?.needs), size: size(params?.size) })
  }
  // The lien-sale gate's reason (a sale recorded while the law does not allow it yet): worded from its code.
  const gate = typeof params?.gate === 'string' ? GATE_WORDS[params.gate] : undefined
  if (gate && te(gate)) out.why = t(gate, { date: out.date ?? '' })
  return out
}

/** Where each of the lien-sale gate's codes has its words (LienSaleGateCode in shared/domain/clocks). */
const GATE_WORDS: Record<string, string> = {
  'not-before': 'clocks.explain.not-before',
  'no-sale-date': 'publications.sale.blocked.no-sale-date',
  'no-branch': 'publications.sale.blocked.no-branch',
  'needs-value': 'publications.sale.blocked.needs-value',
  'needs-model-year': 'publications.sale.blocked.needs-model-year',
  waiting: 'clocks.explain.gate.waiting',
  'too-early': 'clocks.explain.gate.too-early',
  expired: 'clocks.explain.gate.expired',
}

/** An issue from the server (`code`, `params`) or from a schema check here (its message), in the reader's language. */
export function fieldText(issue: { message: string; code?: string; params?: FieldParams }): string {
  const words = issue.code ? { code: issue.code, params: issue.params } : fieldWordsOf(issue.message)
  if (!words || !te(`fields.${words.code}`)) return issue.message
  return t(`fields.${words.code}`, shown(words.params))
}
