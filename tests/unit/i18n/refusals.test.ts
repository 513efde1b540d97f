import { readdirSync, readFileSync } from 'node:fs'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { checkMove, type MoveFacts } from '@shared/domain/lifecycle'

// Every refusal code the server sends (`said('code')`, `forbidden(…, 'code')`, a payment `refusal(…, 'code')`)
// and every lifecycle reason's key has words in every language: a code without them would reach a
// Spanish reader as the server's English fallback.
const ROOT = join(import.meta.dirname, '../../..')
// Read as text: the build's i18n plugin compiles a JSON import into messages, not strings.
type Refusals = { refusals: Record<string, unknown> & { reasons: Record<string, string> } }
const catalog = (locale: string) => JSON.parse(readFileSync(join(ROOT, `shared/messages/${locale}/refusals.json`), 'utf8')) as Refusals
const en = catalog('en')
const es = catalog('es')

function sources(dir: string): string[] {
  return readdirSync(join(ROOT, dir), { withFileTypes: true }).flatMap((f) =>
    f.isDirectory() ? sources(join(dir, f.name)) : f.name.endsWith('.ts') ? [readFileSync(join(ROOT, dir, f.name), 'utf8')] : [],
  )
}

const CODE = [/RefusalCode = '(\w+)'/g, /\bsaid\('([\w]+)'/g, /\bforbidden\([^)]*?,\s*'([\w]+)'\)/g, /\brefusal\(\d+,[^)]*?,\s*'([\w]+)'\)/g]
// A reason's key, or each of the keys a condition chooses between (`key: to === 'closed' ? 'holdClose' : 'hold'`).
const KEY = /\bkey(?::|\s*=)\s*([^,}\n]+)/g
const serverCodes = [...new Set(sources('server').flatMap((text) => CODE.flatMap((re) => [...text.matchAll(re)].map((m) => m[1]!))))].sort()
const reasonKeys = [...new Set([...sources('shared/domain/lifecycle'), ...sources('server/releases')].flatMap((text) => [...text.matchAll(KEY)].flatMap((m) => [...m[1]!.matchAll(/'(\w+)'/g)].map((q) => q[1]!))))].sort()
const catalogs = { en: en.refusals as Record<string, unknown>, es: es.refusals as Record<string, unknown> }

describe('refusal codes', () => {
  it('finds the codes the server sends (the scan itself works)', () => {
    expect(serverCodes).toEqual(expect.arrayContaining(['vehicleStale', 'movedElsewhere', 'signedOut', 'notFound', 'forbidden', 'sampleLocked', 'closedPayments']))
    expect(reasonKeys).toEqual(expect.arrayContaining(['hold', 'balance', 'noSuchMove', 'releaseFirst']))
  })

  it.each(Object.keys(catalogs))('every code the server sends has words in %s', (locale) => {
    const missing = serverCodes.filter((c) => typeof catalogs[locale as keyof typeof catalogs][c] !== 'string')
    expect(missing).toEqual([])
  })

  it.each(Object.keys(catalogs))('every lifecycle reason key has words in %s', (locale) => {
    const reasons = catalogs[locale as keyof typeof catalogs].reasons as Record<string, string>
    expect(reasonKeys.filter((k) => typeof reasons[k] !== 'string')).toEqual([])
  })

  it.each(Object.keys(catalogs))('every parameter a message names in %s is one English names too', (locale) => {
    const names = (text: string) => [...text.matchAll(/\{(\w+)\}/g)].map((m) => m[1]).sort()
    const flat = (node: Record<string, unknown>, p = ''): [string, string][] =>
      Object.entries(node).flatMap(([k, v]) => (typeof v === 'string' ? [[p + k, v] as [string, string]] : flat(v as Record<string, unknown>, `${p}${k}.`)))
    const english = Object.fromEntries(flat(catalogs.en))
    for (const [key, text] of flat(catalogs[locale as keyof typeof catalogs])) expect(names(text), key).toEqual(names(english[key]!))
  })
})

describe('a refused move carries its words for the reader', () => {
  const facts: MoveFacts = {
    timeZone: 'America/Los_Angeles', holds: [{ kind: 'law_enforcement', agency: 'Orrin Flats PD', caseNumber: 'OF-1', until: null }],
    inspected: true, balanceCents: 12_500, paidCents: 0, creditedCents: 0, waived: false, claimantIdRecorded: true,
    releaseSigned: true, transferSigned: false, lienSaleSigned: false, lienSale: null,
  }

  it('gives each reason a key with words in both languages and the parameters those words name', () => {
    const verdict = checkMove({ from: 'release', to: 'closed', role: 'office', facts, disposition: 'returned_to_owner' })
    expect(verdict.reasons.map((r) => [r.key, r.params])).toEqual([
      ['holdClose', { hold: 'law_enforcement', who: ' (Orrin Flats PD, OF-1)', column: 'closed' }],
      ['balance', { dueCents: 12_500 }],
    ])
    for (const r of verdict.reasons) for (const l of [en, es]) expect(l.refusals.reasons[r.key!]).toBeTypeOf('string')
  })

  it('names the roles that may make a move a role may not', () => {
    const verdict = checkMove({ from: 'arrival', to: 'teardown', role: 'office', facts: { ...facts, holds: [] } })
    expect(verdict.forbidden).toBe(true)
    expect(verdict.reasons[0]).toMatchObject({ key: 'role', params: { from: 'arrival', to: 'teardown' } })
    expect(String(verdict.reasons[0]!.params!.roles).split(',')).not.toContain('office')
  })
})
