import { createI18n } from 'vue-i18n'
import { LOCALES, type Locale, isLocale } from './locales'

// Every string a person reads comes from src/locales/<locale>/<namespace>.json. Each file holds one
// top-level key, its namespace (`board.json` → `{ "board": { … } }`), so files of one locale merge
// without clashes and each screen's strings sit in one place. @intlify/unplugin-vue-i18n compiles
// them at build time: no message compiler in the bundle, no eval under the CSP.
type Catalog = Record<string, unknown>
// shared/messages/<locale>/<namespace>.json hold the words both sides use (columns, holds, roles,
// reasons, history, refusals): the server renders the same catalogs for letters and e-mails.
const files = {
  ...import.meta.glob<Catalog>('../../shared/messages/*/*.json', { eager: true, import: 'default' }),
  ...import.meta.glob<Catalog>('../locales/*/*.json', { eager: true, import: 'default' }),
}

function catalogs(): Record<Locale, Catalog> {
  const messages = Object.fromEntries(LOCALES.map((l) => [l, {}])) as Record<Locale, Catalog>
  for (const [path, catalog] of Object.entries(files)) {
    const locale = path.split('/').at(-2)
    if (!isLocale(locale)) continue
    Object.assign(messages[locale], catalog)
  }
  return messages
}

export const i18n = createI18n<[Catalog], Locale, false>({
  legacy: false,
  locale: 'en',
  fallbackLocale: 'en',
  messages: catalogs(),
  // A key missing from the Spanish catalog is a failed check in `npm test`, not a console warning.
  missingWarn: false,
  fallbackWarn: false,
})
