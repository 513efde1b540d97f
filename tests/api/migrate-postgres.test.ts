import { readFileSync } from 'node:fs'
import { randomUUID } from 'node:crypto'
import pg from 'pg'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { openDatabase, type DatabaseHandle } from '@db/client'
import { loadDemoIfEmpty } from '../../server/demo/index'
import { TEST_HISTORY_KEY } from '../helpers/app'
import { databaseUrl, dropDatabase } from '../helpers/postgres'

// Issue 15: servers starting together on one empty PostgreSQL migrate once, under an advisory lock.
// Without it both would create the same tables and one start would fail ("already exists").
const database = `t_migrate_${randomUUID().replaceAll('-', '').slice(0, 12)}`
const journal = JSON.parse(readFileSync('db/migrations/meta/_journal.json', 'utf8')) as { entries: { tag: string }[] }
let admin: pg.Client
const handles: DatabaseHandle[] = []

beforeAll(async () => {
  admin = new pg.Client({ connectionString: inject('postgresUrl') })
  await admin.connect()
  await admin.query(`create database ${database}`)
})
afterAll(async () => {
  await Promise.all(handles.map((h) => h.close()))
  await dropDatabase(admin, database)
  await admin.end()
})

describe('migrations on PostgreSQL (db/client.ts)', () => {
  it('two servers migrating one empty database at once both start, and every migration is applied once', async () => {
    const url = databaseUrl(inject('postgresUrl'), database)
    for (let i = 0; i < 3; i++) handles.push(await openDatabase({ kind: 'postgres', url }))
    const results = await Promise.allSettled(handles.map((h) => h.migrate()))
    expect(results.map((r) => (r.status === 'rejected' ? String(r.reason) : 'ok'))).toEqual(['ok', 'ok', 'ok'])

    const check = new pg.Client({ connectionString: url })
    await check.connect()
    try {
      const applied = await check.query('select count(*)::int as n from drizzle.__drizzle_migrations')
      expect(applied.rows[0].n).toBe(journal.entries.length)
      // The schema is whole: the last table of the first migration and a later one are there.
      const tables = await check.query(`select count(*)::int as n from information_schema.tables where table_schema = 'public'`)
      expect(tables.rows[0].n).toBeGreaterThan(20)
      // The lock was let go: a later start migrates (nothing to do) without waiting.
      const held = await check.query(`select count(*)::int as n from pg_locks where locktype = 'advisory' and granted`)
      expect(held.rows[0].n).toBe(0)
    } finally {
      await check.end()
    }
  })

  it('two servers starting on it together with the demo on load the demo once', { timeout: 300_000 }, async () => {
    // Each start counts yards, finds none, and would load the demo: the second waits on the first's lock and then finds it.
    const [a, b] = handles
    const loaded = await Promise.all([loadDemoIfEmpty(a!.db, TEST_HISTORY_KEY), loadDemoIfEmpty(b!.db, TEST_HISTORY_KEY)])
    expect(loaded.filter((l) => l !== null)).toHaveLength(1)
    const check = new pg.Client({ connectionString: databaseUrl(inject('postgresUrl'), database) })
    await check.connect()
    const companies = await check.query('select count(*)::int as n from companies').finally(() => check.end())
    expect(companies.rows[0].n).toBe(1)
  })
})
