import { isLocale, type Locale } from '@shared/messages/locales'

/** The languages Holdfast speaks (shared/messages/locales.ts); the first is the fallback for any text a catalog lacks. */
export { isLocale, LOCALES, type Locale } from '@shared/messages/locales'

/** The browser's first language Holdfast speaks ("es-MX" → "es"), else English. */
export function browserLocale(languages: readonly string[] = navigator.languages ?? [navigator.language]): Locale {
  for (const tag of languages) {
    const base = tag.toLowerCase().split('-')[0]
    if (isLocale(base)) return base
  }
  return 'en'
}

/**
 * The Intl tags each language formats with. English keeps the look Holdfast always had ("1 Dec 2026",
 * "$1,234.50"); Spanish is the Spanish of the United States ("1 dic 2026", "$1,234.50"): the yards bill in
 * US dollars, and a Spanish-reading clerk in a US yard reads amounts the way the bank and the DMV print them.
 */
export const INTL_TAGS: Record<Locale, { dates: string; numbers: string }> = {
  en: { dates: 'en-GB', numbers: 'en-US' },
  es: { dates: 'es-US', numbers: 'es-US' },
}
