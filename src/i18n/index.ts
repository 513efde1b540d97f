import { createI18n } from 'vue-i18n'
import { LOCALES, type Locale, isLocale } from './locales'

// Every string a person reads comes from src/locales/<locale>/<namespace>.json. Each file holds one
// top-level key, its namespace (`board.json` → `{ "board": { … } }`), so files of one locale merge
// without clashes and each screen's strings sit in one place. @intlify/unplugin-vue-i18n compiles
// them at build time: no message compiler in the bundle, no eval under the CSP.
//
// The sign-in page's namespaces come with the first download; every other one arrives as one chunk
// per language (vite.config.ts), fetched before the first signed-in or public page is shown and
// when someone switches language — the sign-in page stays small (issue 9's budget).
type Catalog = Record<string, unknown>
const first = import.meta.glob<Catalog>(['../locales/*/common.json', '../locales/*/sign-in.json'], { eager: true, import: 'default' })
// shared/messages/<locale>/<namespace>.json hold the words both sides use (columns, holds, roles,
// reasons, history, refusals): the server renders the same catalogs for letters and e-mails.
const later = import.meta.glob<Catalog>(['../../shared/messages/*/*.json', '../locales/*/*.json', '!../locales/*/common.json', '!../locales/*/sign-in.json'], {
  import: 'default',
})

const localeOf = (path: string) => path.split('/').at(-2)

function firstCatalogs(): Record<Locale, Catalog> {
  const messages = Object.fromEntries(LOCALES.map((l) => [l, {}])) as Record<Locale, Catalog>
  for (const [path, catalog] of Object.entries(first)) {
    const locale = localeOf(path)
    if (isLocale(locale)) Object.assign(messages[locale], catalog)
  }
  return messages
}

export const i18n = createI18n<[Catalog], Locale, false>({
  legacy: false,
  locale: 'en',
  fallbackLocale: 'en',
  messages: firstCatalogs(),
  // A key missing from the Spanish catalog is a failed check in `npm test`, not a console warning.
  missingWarn: false,
  fallbackWarn: false,
})

const loading = new Map<Locale, Promise<void>>()

/** Every namespace of one language, fetched once (a failed fetch is tried again next time). */
export function loadMessages(locale: Locale): Promise<void> {
  let done = loading.get(locale)
  if (!done) {
    const files = Object.entries(later).filter(([path]) => localeOf(path) === locale)
    done = Promise.all(files.map(async ([, load]) => i18n.global.mergeLocaleMessage(locale, await load()))).then(() => undefined)
    done.catch(() => loading.delete(locale))
    loading.set(locale, done)
  }
  return done
}
