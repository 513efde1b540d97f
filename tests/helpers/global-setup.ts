import { writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import type { PGlite } from '@electric-sql/pglite'
import pg from 'pg'
import type { TestProject } from 'vitest/node'
import { openDatabase } from '@db/client'
import { testEngineFromEnv, type TestEngine } from './engine'
import { databaseUrl, startThrowawayPostgres } from './postgres'

declare module 'vitest' {
  export interface ProvidedContext {
    templateDataDir: string
    postgresUrl: string
    /** A migrated, empty database on the throwaway server; each test database is created from it. */
    postgresTemplate: string
    testEngine: TestEngine
  }
}

export const POSTGRES_TEMPLATE = 'holdfast_template'

export default async function setup(project: TestProject) {
  // Migrate once per run; each test file then starts from a copy of this migrated, empty database.
  const handle = await openDatabase({ kind: 'memory' })
  await handle.migrate()
  const dump = await (handle.db as unknown as { $client: PGlite }).$client.dumpDataDir('gzip')
  await handle.close()
  const file = path.join(tmpdir(), `holdfast-template-${process.pid}.tar.gz`)
  writeFileSync(file, new Uint8Array(await dump.arrayBuffer()))
  project.provide('templateDataDir', file)
  project.provide('testEngine', testEngineFromEnv())

  const port = process.env.HOLDFAST_TEST_PG_PORT ? Number(process.env.HOLDFAST_TEST_PG_PORT) : undefined
  const postgres = startThrowawayPostgres(port)
  project.provide('postgresUrl', postgres.url)
  // The same for PostgreSQL: one migrated template database; CREATE DATABASE … TEMPLATE copies it in ~100 ms.
  const admin = new pg.Client({ connectionString: postgres.url })
  await admin.connect()
  await admin.query(`create database ${POSTGRES_TEMPLATE}`)
  await admin.end()
  const template = await openDatabase({ kind: 'postgres', url: databaseUrl(postgres.url, POSTGRES_TEMPLATE) })
  await template.migrate()
  await template.close()
  project.provide('postgresTemplate', POSTGRES_TEMPLATE)
  return () => postgres.stop()
}
