import { i18n } from '../../src/i18n'
import type { Locale } from '../../src/i18n/locales'

/**
 * The app's own vue-i18n instance for a component test's `global.plugins`, switched to `locale`
 * (English unless said): `mount(C, { global: { plugins: [withI18n()] } })`. The app's instance, not a
 * copy, because the formatters and plain functions (money, yard time, history words) read it too.
 */
export function withI18n(locale: Locale = 'en') {
  i18n.global.locale.value = locale
  return i18n
}
