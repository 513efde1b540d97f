// The languages Holdfast speaks, for both sides: the client's catalogs and the server's columns and
// schemas. The first is the fallback for any text a catalog lacks.
export const LOCALES = ['en', 'es'] as const
export type Locale = (typeof LOCALES)[number]

export function isLocale(value: unknown): value is Locale {
  return typeof value === 'string' && (LOCALES as readonly string[]).includes(value)
}
