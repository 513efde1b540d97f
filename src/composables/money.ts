import { i18n } from '@/i18n'
import { INTL_TAGS, type Locale } from '@/i18n/locales'

// Money is integer cents (shared/domain/billing); the screens show it in the reader's language.
// Read inside a render, the chosen language is a dependency: switching it re-renders every amount.
const made = new Map<Locale, Intl.NumberFormat>()
function formatter(locale: Locale): Intl.NumberFormat {
  let f = made.get(locale)
  if (!f) {
    f = new Intl.NumberFormat(INTL_TAGS[locale].numbers, { style: 'currency', currency: 'USD' })
    made.set(locale, f)
  }
  return f
}

/** Whole cents as US dollars in the given language, else the one chosen: 123456 → "$1,234.56". */
export function money(cents: number, locale: Locale = i18n.global.locale.value): string {
  // `|| 0` turns -0 (nothing, shown as a deduction) into 0: Intl writes "-$0.00" otherwise.
  return formatter(locale).format(cents / 100 || 0)
}

/** A plain number in the chosen language (miles, counts), with exactly `decimals` places when given. */
export function number(value: number, decimals?: number, locale: Locale = i18n.global.locale.value): string {
  const places = decimals === undefined ? {} : { minimumFractionDigits: decimals, maximumFractionDigits: decimals }
  return new Intl.NumberFormat(INTL_TAGS[locale].numbers, places).format(value)
}
