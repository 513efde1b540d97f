import { readdirSync, readFileSync } from 'node:fs'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { ROLE_LABELS } from '@shared/domain/access'
import { COLUMN_LABELS, DISPOSITION_LABELS, HOLD_LABELS } from '@shared/domain/lifecycle'
import { TOW_REASON_LABELS } from '@shared/domain/tow'
import { FILE_KIND_LABELS } from '@shared/schemas/files'
import { HISTORY_LABELS } from '@shared/schemas/history'
import { KEYS_LABELS } from '@shared/schemas/vehicles'
import { LOCALES } from '@/i18n/locales'

// Every key in one language exists in the other, every file holds exactly its own namespace, and no
// message is blank: a missing Spanish string is a failed test, never an English word on a Spanish screen.
// Two folders of catalogs: the client's screens (src/locales) and the words both sides use (shared/messages).
const ROOTS = [join(import.meta.dirname, '../../../src/locales'), join(import.meta.dirname, '../../../shared/messages')]

function keys(node: unknown, prefix = ''): string[] {
  if (typeof node === 'string') return [prefix]
  if (node === null || typeof node !== 'object') throw new Error(`${prefix}: a message must be text or a group of messages`)
  return Object.entries(node).flatMap(([k, v]) => keys(v, prefix ? `${prefix}.${k}` : k))
}

function messages(root: string, locale: string) {
  return Object.fromEntries(
    readdirSync(join(root, locale))
      .filter((f) => f.endsWith('.json'))
      .map((f) => [f, JSON.parse(readFileSync(join(root, locale, f), 'utf8')) as Record<string, unknown>]),
  )
}

const camel = (file: string) => file.replace(/\.json$/, '').replace(/-(\w)/g, (_, c: string) => c.toUpperCase())

describe.each(ROOTS)('message catalogs in %s', (root) => {
  const catalogs = Object.fromEntries(LOCALES.map((l) => [l, messages(root, l)])) as Record<string, Record<string, Record<string, unknown>>>

  it('has the same files in every language', () => {
    const [first, ...rest] = LOCALES
    for (const l of rest) expect(Object.keys(catalogs[l]!).sort(), l).toEqual(Object.keys(catalogs[first]!).sort())
  })

  it.each(Object.keys(catalogs.en!))('%s holds one namespace named after the file, with the same keys in every language', (file) => {
    for (const l of LOCALES) expect(Object.keys(catalogs[l]![file] ?? {}), `${l}/${file}`).toEqual([camel(file)])
    const english = keys(catalogs.en![file]).sort()
    for (const l of LOCALES) expect(keys(catalogs[l]![file]).sort(), `${l}/${file}`).toEqual(english)
  })

  it('has no blank message', () => {
    for (const l of LOCALES)
      for (const [file, catalog] of Object.entries(catalogs[l]!))
        for (const key of keys(catalog)) {
          const value = key.split('.').reduce<unknown>((n, k) => (n as Record<string, unknown>)[k], catalog)
          expect((value as string).trim(), `${l}/${file}: ${key}`).not.toBe('')
        }
  })
})

describe('the two folders of catalogs', () => {
  it('never name the same namespace twice, so merging them loses nothing', () => {
    const [screens, shared] = ROOTS.map((root) => readdirSync(join(root, 'en')))
    expect(screens!.filter((f) => shared!.includes(f))).toEqual([])
  })

  // The server still speaks the TypeScript label tables (refusals, logs): they must read as the English catalog does.
  it.each([
    ['lifecycle.json', 'columns', COLUMN_LABELS],
    ['lifecycle.json', 'dispositions', DISPOSITION_LABELS],
    ['lifecycle.json', 'holds', HOLD_LABELS],
    ['access.json', 'roles', ROLE_LABELS],
    ['tow.json', 'reasons', TOW_REASON_LABELS],
    ['history.json', 'kinds', HISTORY_LABELS],
    ['vehicle.json', 'keys', KEYS_LABELS],
    ['vehicle.json', 'fileKinds', FILE_KIND_LABELS],
  ])('shared/messages/en/%s %s reads as the label table in shared/', (file, group, table) => {
    const catalog = messages(ROOTS[1]!, 'en')[file]!
    expect((catalog[camel(file)] as Record<string, unknown>)[group]).toEqual(table)
  })
})

describe('the board moves in the catalogs', () => {
  it('every move rule reads in the English catalog exactly as the rule table says it', async () => {
    const { MOVES } = await import('@shared/domain/lifecycle')
    const catalog = messages(ROOTS[1]!, 'en')['lifecycle.json']!.lifecycle as { moves: Record<string, string> }
    for (const rule of MOVES) expect(catalog.moves[`${rule.from}_${rule.to}`], `${rule.from} → ${rule.to}`).toBe(rule.label)
  })
})

describe('the teardown checklist in the catalogs', () => {
  it('every system and item reads in the English catalog exactly as the checklist says it', async () => {
    const { CHECKLIST, FINDING_LABELS } = await import('@shared/domain/inspection')
    const catalog = messages(ROOTS[1]!, 'en')['inspection.json']!.inspection as {
      findings: Record<string, string>
      systems: Record<string, string>
      items: Record<string, { label: string; look?: string; part: string }>
    }
    expect(catalog.findings).toEqual(FINDING_LABELS)
    for (const system of CHECKLIST) {
      expect(catalog.systems[system.code]).toBe(system.label)
      for (const item of system.items) expect(catalog.items[item.code], item.code).toEqual({ label: item.label, look: item.look, part: item.part })
    }
  })
})

describe('the pickup badge in the catalogs', () => {
  it('every badge the core can name has its words, read from the English name made a code', async () => {
    const { pickupBadge } = await import('@shared/domain/inspection')
    const catalog = messages(ROOTS[1]!, 'en')['inspection.json']!.inspection as { badges: Record<string, string> }
    const yesNo = [true, false]
    for (const rolls of yesNo)
      for (const steers of yesNo)
        for (const brakes of yesNo)
          for (const keys of ['yes', 'no', 'unknown'] as const) {
            const label = pickupBadge({ rolls, steers, brakes, keys })!.label
            expect(catalog.badges[label.toLowerCase().replace(/[^a-z]+/g, '-')], label).toBe(label)
          }
  })
})
