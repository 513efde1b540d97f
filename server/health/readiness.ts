import { readFileSync } from 'node:fs'
import path from 'node:path'
import { sql } from 'drizzle-orm'
import type { Database } from '@db/client'
import type { FileStore } from '../files/index'
import type { Drain } from './drain'

export type CheckResult = 'ok' | 'down' | 'behind'

export interface Readiness {
  ready: boolean
  checks: { database: CheckResult; migrations: CheckResult; storage: CheckResult; draining: boolean }
}

export interface ReadinessDeps {
  db: Database
  files: FileStore
  drain: Drain
  /** The committed migrations this server was built with (db/migrations). */
  migrationsFolder: string
}

// A probe that hangs is worse than one that says no: a load balancer waits a few seconds at most.
const CHECK_MS = 3_000
const within = <T>(work: Promise<T>): Promise<T> =>
  Promise.race([work, new Promise<never>((_, reject) => setTimeout(() => reject(new Error('timed out')), CHECK_MS).unref())])

/** The newest migration's timestamp in the journal: drizzle applies every migration up to it, by that stamp. */
function newestMigration(folder: string): number {
  const journal = JSON.parse(readFileSync(path.join(folder, 'meta', '_journal.json'), 'utf8')) as { entries: { when: number }[] }
  return Math.max(...journal.entries.map((e) => e.when))
}

/**
 * Whether this server should be sent work: the database answers, it has every migration this server
 * knows (another server may be migrating it), the file store can be written, and it is not shutting down.
 */
export function readinessCheck(deps: ReadinessDeps): () => Promise<Readiness> {
  let wanted: number | undefined
  return async () => {
    const database = await within(deps.db.execute(sql`select 1`)).then(() => 'ok' as const, () => 'down' as const)
    const migrations =
      database === 'down'
        ? ('down' as const)
        : await within(deps.db.execute(sql`select coalesce(max(created_at), 0)::bigint as newest from drizzle.__drizzle_migrations`)).then(
            (r) => (Number((r as unknown as { rows: { newest: unknown }[] }).rows[0]?.newest ?? 0) >= (wanted ??= newestMigration(deps.migrationsFolder)) ? ('ok' as const) : ('behind' as const)),
            () => 'down' as const,
          )
    const storage = await within(deps.files.check()).then(() => 'ok' as const, () => 'down' as const)
    const draining = deps.drain.draining
    return { ready: database === 'ok' && migrations === 'ok' && storage === 'ok' && !draining, checks: { database, migrations, storage, draining } }
  }
}
