import { writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import type { PGlite } from '@electric-sql/pglite'
import type { TestProject } from 'vitest/node'
import { openDatabase } from '@db/client'
import { startThrowawayPostgres } from './postgres'

declare module 'vitest' {
  export interface ProvidedContext {
    templateDataDir: string
    postgresUrl: string
  }
}

export default async function setup(project: TestProject) {
  // Migrate once per run; each test file then starts from a copy of this migrated, empty database.
  const handle = await openDatabase({ kind: 'memory' })
  await handle.migrate()
  const dump = await (handle.db as unknown as { $client: PGlite }).$client.dumpDataDir('gzip')
  await handle.close()
  const file = path.join(tmpdir(), `holdfast-template-${process.pid}.tar.gz`)
  writeFileSync(file, new Uint8Array(await dump.arrayBuffer()))
  project.provide('templateDataDir', file)

  const postgres = startThrowawayPostgres()
  project.provide('postgresUrl', postgres.url)
  return () => postgres.stop()
}
