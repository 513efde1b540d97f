import { readdirSync, readFileSync } from 'node:fs'
import path from 'node:path'
import { eq } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { ruleSetVersions } from '@db/schema'
import { SAMPLE_RULE_SETS_DIR } from './sample-rule-sets'

type Json = Record<string, unknown>
type Words = { labels: Map<string, string>; citations: Map<string, string>; notes: Map<string, string>; cautions: Map<string, string>; names: Map<string, string> }

const isObject = (v: unknown): v is Json => typeof v === 'object' && v !== null && !Array.isArray(v)
const esOf = (item: Json): Json => (isObject(item.es) ? item.es : {})

/** Every Spanish word the shipped samples give, keyed by the English it stands beside. */
export function sampleWords(dir: string = SAMPLE_RULE_SETS_DIR): Words {
  const words: Words = { labels: new Map(), citations: new Map(), notes: new Map(), cautions: new Map(), names: new Map() }
  const put = (map: Map<string, string>, english: unknown, spanish: unknown) => {
    if (typeof english === 'string' && typeof spanish === 'string' && spanish) map.set(english, spanish)
  }
  for (const file of readdirSync(dir).filter((f) => f.endsWith('.json'))) {
    const body = JSON.parse(readFileSync(path.join(dir, file), 'utf8')) as Json
    put(words.cautions, body.caution, esOf(body).caution)
    put(words.names, body.name, esOf(body).name)
    walk(body, (item) => {
      put(words.labels, item.label, esOf(item).label)
      put(words.citations, item.citation, esOf(item).citation)
      put(words.notes, item.note, esOf(item).note)
    })
  }
  return words
}

/** Calls `visit` on every object of a rule set's body, depth first. */
function walk(value: unknown, visit: (item: Json) => void): void {
  if (Array.isArray(value)) value.forEach((v) => walk(v, visit))
  else if (isObject(value)) {
    visit(value)
    for (const [key, v] of Object.entries(value)) if (key !== 'es') walk(v, visit)
  }
}

/**
 * A stored body with the samples' Spanish added wherever its English still reads as a sample's and it
 * has no Spanish of its own yet; null when nothing is added. Only words: no value, day count or branch
 * changes, so every version still means what it meant.
 */
export function withSampleWords(body: unknown, words: Words): Json | null {
  if (!isObject(body)) return null
  const copy = structuredClone(body)
  let added = false
  const fill = (item: Json, key: string, map: Map<string, string>) => {
    const english = item[key]
    const spanish = typeof english === 'string' ? map.get(english) : undefined
    if (!spanish || esOf(item)[key]) return
    item.es = { ...esOf(item), [key]: spanish }
    added = true
  }
  fill(copy, 'caution', words.cautions)
  fill(copy, 'name', words.names)
  walk(copy, (item) => {
    if ('label' in item) fill(item, 'label', words.labels)
    if ('citation' in item) {
      fill(item, 'citation', words.citations)
      fill(item, 'note', words.notes)
    }
  })
  return added ? copy : null
}

/**
 * Rule sets copied into a database before the samples spoke Spanish (the samples' own version 1 and every
 * company copy and edit since) get the samples' Spanish beside each class, fee, step, police clock,
 * citation, note, caution and the rule set's name whose English is still the sample's. Runs at start-up, before any request
 * parses a version; idempotent, so several servers starting at once do no harm. Returns how many
 * versions it changed.
 */
export async function addSampleWords(db: Executor, dir: string = SAMPLE_RULE_SETS_DIR): Promise<number> {
  const words = sampleWords(dir)
  const rows = await db.select({ id: ruleSetVersions.id, body: ruleSetVersions.body }).from(ruleSetVersions)
  let changed = 0
  for (const row of rows) {
    const body = withSampleWords(row.body, words)
    if (!body) continue
    await db.update(ruleSetVersions).set({ body }).where(eq(ruleSetVersions.id, row.id))
    changed++
  }
  return changed
}
