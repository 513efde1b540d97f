// Build step: two embedded-database templates as tarballs, which a new data directory starts from
// instead of running initdb (and, with the demo, instead of playing it at the first start). Migrations
// still run at every start.
// - `dist/db-template.tar.gz`: migrated and empty.
// - `dist/db-demo-template.tar.gz` (+ `.json`): the demo yard played into it under a throw-away history
//   key, re-sealed with the install's own key at its first start (server/demo/template.ts).
import { writeFileSync } from 'node:fs'
import path from 'node:path'
import type { PGlite } from '@electric-sql/pglite'
import { openDatabase } from '@db/client'
import { loadConfig } from '../config'
import { buildDemoTemplate } from '../demo/index'

const config = loadConfig()

async function template(out: string, fill?: (handle: Awaited<ReturnType<typeof openDatabase>>) => Promise<void>) {
  const started = performance.now()
  const handle = await openDatabase({ kind: 'memory' }, config.migrationsFolder)
  await handle.migrate()
  await fill?.(handle)
  const dump = await (handle.db as unknown as { $client: PGlite }).$client.dumpDataDir('gzip')
  writeFileSync(out, new Uint8Array(await dump.arrayBuffer()))
  await handle.close()
  console.log(`Wrote the database template ${out} (${((performance.now() - started) / 1000).toFixed(1)} s)`)
}

await template(path.resolve(process.argv[2] ?? 'dist/db-template.tar.gz'))
const demoOut = path.resolve(process.argv[3] ?? config.demoTemplate)
await template(demoOut, (handle) => buildDemoTemplate(handle.db, `${demoOut}.json`, new Date(), config.ruleSetsFolder))
