import { readdirSync, readFileSync } from 'node:fs'
import path from 'node:path'
import type { Executor } from '@db/client'
import { ruleSets, ruleSetVersions } from '@db/schema'
import { sampleChoiceSchema, type SampleChoice } from '@shared/schemas/first-run'

/**
 * Where the shipped sample rule sets are read from unless the server's config (HOLDFAST_RULE_SETS)
 * says otherwise: `server/rule-sets/samples`, found from the working directory because a bundle
 * moves `import.meta.url`.
 */
export const SAMPLE_RULE_SETS_DIR = path.resolve(process.cwd(), 'server/rule-sets/samples')

/**
 * Loads the shipped sample rule sets, each as version 1; those already loaded are left as they
 * are. Runs whenever a yard is created, so a new company starts with the samples to copy from.
 * Returns slug → version id of the ones it added.
 */
export async function loadSampleRuleSets(db: Executor, dir: string = SAMPLE_RULE_SETS_DIR): Promise<Map<string, string>> {
  const versions = new Map<string, string>()
  const names = readdirSync(dir).filter((f) => f.endsWith('.json')).sort()
  for (const file of names) {
    const body = JSON.parse(readFileSync(path.join(dir, file), 'utf8')) as Record<string, unknown>
    const slug = String(body.id ?? path.basename(file, '.json'))
    const [set] = await db
      .insert(ruleSets)
      .values({ slug, name: String(body.name ?? slug), sample: 'sample' })
      .onConflictDoNothing({ target: ruleSets.slug })
      .returning({ id: ruleSets.id })
    if (!set) continue
    const [version] = await db
      .insert(ruleSetVersions)
      .values({ ruleSetId: set.id, version: 1, body })
      .returning({ id: ruleSetVersions.id })
    versions.set(slug, version!.id)
  }
  return versions
}

/**
 * The shipped samples a new yard may start from, read from their files (the first run comes before any
 * is loaded into the database), in file-name order: the first is the one offered when nothing fits better.
 */
export function sampleChoices(dir: string = SAMPLE_RULE_SETS_DIR): SampleChoice[] {
  return readdirSync(dir)
    .filter((f) => f.endsWith('.json'))
    .sort()
    .map((file) => {
      const body = JSON.parse(readFileSync(path.join(dir, file), 'utf8')) as Record<string, unknown>
      const es = (body.es ?? {}) as Record<string, unknown>
      return sampleChoiceSchema.parse({
        id: String(body.id ?? path.basename(file, '.json')),
        name: body.name,
        jurisdiction: body.jurisdiction,
        timeZone: body.timeZone,
        caution: body.caution,
        cautionEs: typeof es.caution === 'string' ? es.caution : null,
        nameEs: typeof es.name === 'string' ? es.name : null,
      })
    })
}
