import { readdirSync, readFileSync } from 'node:fs'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { LOCALES, type Locale } from '@/i18n/locales'

// Every key in one language exists in the other, every file holds exactly its own namespace, and no
// message is blank: a missing Spanish string is a failed test, never an English word on a Spanish screen.
const ROOT = join(import.meta.dirname, '../../../src/locales')

function keys(node: unknown, prefix = ''): string[] {
  if (typeof node === 'string') return [prefix]
  if (node === null || typeof node !== 'object') throw new Error(`${prefix}: a message must be text or a group of messages`)
  return Object.entries(node).flatMap(([k, v]) => keys(v, prefix ? `${prefix}.${k}` : k))
}

function messages(locale: string) {
  return Object.fromEntries(
    readdirSync(join(ROOT, locale))
      .filter((f) => f.endsWith('.json'))
      .map((f) => [f, JSON.parse(readFileSync(join(ROOT, locale, f), 'utf8')) as Record<string, unknown>]),
  )
}

const catalogs = Object.fromEntries(LOCALES.map((l) => [l, messages(l)])) as Record<Locale, Record<string, Record<string, unknown>>>
const camel = (file: string) => file.replace(/\.json$/, '').replace(/-(\w)/g, (_, c: string) => c.toUpperCase())

describe('message catalogs', () => {
  it('has the same files in every language', () => {
    const [first, ...rest] = LOCALES
    for (const l of rest) expect(Object.keys(catalogs[l]).sort(), l).toEqual(Object.keys(catalogs[first]).sort())
  })

  it.each(Object.keys(catalogs.en))('%s holds one namespace named after the file, with the same keys in every language', (file) => {
    for (const l of LOCALES) expect(Object.keys(catalogs[l][file] ?? {}), `${l}/${file}`).toEqual([camel(file)])
    const english = keys(catalogs.en[file]).sort()
    for (const l of LOCALES) expect(keys(catalogs[l][file]).sort(), `${l}/${file}`).toEqual(english)
  })

  it('has no blank message', () => {
    for (const l of LOCALES)
      for (const [file, catalog] of Object.entries(catalogs[l]))
        for (const key of keys(catalog)) {
          const value = key.split('.').reduce<unknown>((n, k) => (n as Record<string, unknown>)[k], catalog)
          expect((value as string).trim(), `${l}/${file}: ${key}`).not.toBe('')
        }
  })
})
