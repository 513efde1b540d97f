import { writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import type { TestProject } from 'vitest/node'
import { openDatabase } from '../../db/client'

declare module 'vitest' {
  export interface ProvidedContext {
    templateDataDir: string
  }
}

// Migrate once per run; each test then starts from a copy of this migrated, empty database.
export default async function setup(project: TestProject) {
  const handle = await openDatabase({ kind: 'memory' })
  await handle.migrate()
  const client = (handle.db as unknown as { $client: { dumpDataDir(c: 'gzip'): Promise<Blob> } }).$client
  const dump = await client.dumpDataDir('gzip')
  await handle.close()
  const file = path.join(tmpdir(), `holdfast-template-${process.pid}.tar.gz`)
  writeFileSync(file, Buffer.from(await dump.arrayBuffer()))
  project.provide('templateDataDir', file)
}
