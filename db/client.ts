import { existsSync, mkdirSync, readFileSync } from 'node:fs'
import path from 'node:path'
import { PGlite } from '@electric-sql/pglite'
import type { Logger } from 'drizzle-orm'
import type { PgDatabase, PgQueryResultHKT } from 'drizzle-orm/pg-core'
import { drizzle as drizzlePglite } from 'drizzle-orm/pglite'
import { drizzle as drizzlePg } from 'drizzle-orm/node-postgres'
import { migrate as migratePglite } from 'drizzle-orm/pglite/migrator'
import { migrate as migratePg } from 'drizzle-orm/node-postgres/migrator'
import pg from 'pg'
import { lockDataDir } from './data-dir-lock'
import * as schema from './schema/index'

export { DataDirLockedError } from './data-dir-lock'

// One type for both drivers: a union of the two instances breaks `.returning()`.
export type Database = PgDatabase<PgQueryResultHKT, typeof schema>
export type Tx = Parameters<Parameters<Database['transaction']>[0]>[0]
export type Executor = Database | Tx

export interface DatabaseHandle {
  db: Database
  driver: 'pglite' | 'postgres'
  /** Applies the committed migrations (db/migrations unless the caller names another folder). */
  migrate(): Promise<void>
  close(): Promise<void>
  /** The template a new embedded data directory was just made from; absent otherwise. */
  startedFrom?: string
}

/**
 * PostgreSQL's default 128 MB of shared buffers is zeroed at every start inside PGlite's WebAssembly
 * memory: about 0.4 s of a warm start (measured here, 2026-12). A yard's working set fits in 32 MB;
 * pages beyond it are read back from the data directory through the operating system's cache.
 */
const START_PARAMS = [...PGlite.defaultStartParams, '-c', 'shared_buffers=32MB']

export type DatabaseTarget =
  | { kind: 'postgres'; url: string }
  | { kind: 'pglite'; dataDir: string; /** A migrated empty database (dumpDataDir) to start a new directory from. */ template?: string }
  | { kind: 'memory'; loadDataDir?: Blob | File }

/**
 * The server passes `migrationsFolder` from its config (HOLDFAST_MIGRATIONS); db/ never imports server/.
 * `logger` hears every statement drizzle sends (the benches count queries per request with it).
 */
export async function openDatabase(
  target: DatabaseTarget,
  migrationsFolder = path.resolve(process.cwd(), 'db/migrations'),
  logger?: Logger,
): Promise<DatabaseHandle> {
  const options = { schema, casing: 'snake_case', logger } as const
  if (target.kind === 'postgres') {
    const pool = new pg.Pool({ connectionString: target.url, max: 10 })
    const db = drizzlePg(pool, options)
    return {
      db: db as unknown as Database,
      driver: 'postgres',
      migrate: () => migrateUnderLock(pool, () => migratePg(db, { migrationsFolder })),
      close: () => pool.end(),
    }
  }
  let release: (() => Promise<void>) | undefined
  let client: PGlite
  let startedFrom: string | undefined
  if (target.kind === 'pglite') {
    mkdirSync(target.dataDir, { recursive: true })
    release = lockDataDir(target.dataDir)
    try {
      const start = startingPoint(target)
      client = await PGlite.create(path.join(target.dataDir, 'pg'), { ...start, startParams: START_PARAMS })
      if (start.loadDataDir) startedFrom = target.template
    } catch (err) {
      await release()
      throw err
    }
  } else {
    client = await PGlite.create({ ...(target.loadDataDir ? { loadDataDir: target.loadDataDir } : {}), startParams: START_PARAMS })
  }
  const db = drizzlePglite(client, options)
  return {
    db: db as unknown as Database,
    driver: 'pglite',
    startedFrom,
    migrate: () => migratePglite(db, { migrationsFolder }),
    async close() {
      await client.close()
      await release?.()
    },
  }
}

/**
 * Servers starting together on one PostgreSQL migrate once: each waits for a session-level advisory lock
 * held on a connection of its own, so the second finds every migration applied and does nothing.
 */
export const MIGRATION_LOCK_KEY = 7_233_018_114_205_001n

async function migrateUnderLock(pool: pg.Pool, migrate: () => Promise<void>): Promise<void> {
  const lock = await pool.connect()
  try {
    await lock.query('select pg_advisory_lock($1)', [MIGRATION_LOCK_KEY.toString()])
    try {
      await migrate()
    } finally {
      await lock.query('select pg_advisory_unlock($1)', [MIGRATION_LOCK_KEY.toString()])
    }
  } finally {
    lock.release()
  }
}

// A new directory starts from the build's migrated template: loading it is about twice as fast as initdb.
function startingPoint(target: { dataDir: string; template?: string }): { loadDataDir?: Blob } {
  const fresh = !existsSync(path.join(target.dataDir, 'pg', 'PG_VERSION'))
  if (!fresh || !target.template || !existsSync(target.template)) return {}
  return { loadDataDir: new Blob([new Uint8Array(readFileSync(target.template))]) }
}
