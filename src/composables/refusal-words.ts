import { i18n } from '@/i18n'
import { money } from '@/composables/money'
import { calendarDate, yardFormat } from '@/composables/yard-time'

// A refusal in the reader's language. The server and the shared lifecycle send a code (a key under
// `refusals` in shared/messages) and its parameters beside their English sentence; the sentence is the
// fallback for a code the catalogs lack. Parameters that are codes become their words here.
const { t, te } = i18n.global

type Params = Record<string, string | number>

function words(name: string, value: string | number): string | number {
  if (typeof value === 'number') return name.endsWith('Cents') ? money(value) : value
  if ((name === 'column' || name === 'from' || name === 'to' || name === 'state') && te(`lifecycle.columns.${value}`)) return t(`lifecycle.columns.${value}`)
  if (name === 'hold' && te(`lifecycle.holds.${value}`)) return t(`lifecycle.holds.${value}`)
  if (name === 'steps') return value.split(',').map((s) => (te(`releases.steps.${s}`) ? t(`releases.steps.${s}`) : s)).join(', ')
  if (name === 'roles') return value.split(',').map((r) => (te(`access.roles.${r}`) ? t(`access.roles.${r}`) : r)).join(', ')
  if (name === 'date' && /^\d{4}-\d{2}-\d{2}$/.test(value)) return calendarDate(value)
  // Why the card payment service said no, in our words (server/card-payments/service-reasons.ts): never its code.
  if (name === 'cardReason') return t(`refusals.cardReasons.${te(`refusals.cardReasons.${value}`) ? value : 'other'}`)
  if (name === 'blocked' && te(`publications.sale.blocked.${value}`)) return t(`publications.sale.blocked.${value}`)
  return value
}

const placed = (params: Params, i: number): Params =>
  Object.fromEntries(Object.entries(params).flatMap(([k, v]) => (k.startsWith(`${i}.`) ? [[k.slice(`${i}.`.length), v]] : [])))

/** The catalog's words for `key` (under `refusals`), else the English `fallback`. */
export function refusalText(key: string | undefined, params: Params | undefined, fallback: string): string {
  if (!key || !te(`refusals.${key}`)) return fallback
  const shown = Object.fromEntries(Object.entries(params ?? {}).map(([k, v]) => [k, words(k, v)]))
  // An instant (`at`) reads on the clock of the yard it names (`timeZone`).
  if (typeof params?.at === 'string' && typeof params.timeZone === 'string') shown.at = yardFormat(params.timeZone).dateTime(params.at)
  // A verdict's reasons (server/errors.ts reasonParams): each key's words with the parameters of its place.
  if (typeof params?.reasons === 'string') shown.reasons = params.reasons.split(',').map((k, i) => reasonText({ key: k, params: placed(params, i), message: k })).join(' ')
  return t(`refusals.${key}`, shown)
}

/** A lifecycle reason (why a move is refused now) in the reader's language. */
export const reasonText = (r: { key?: string; params?: Params; message: string }) => refusalText(r.key && `reasons.${r.key}`, r.params, r.message)
