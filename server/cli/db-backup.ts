import path from 'node:path'
import { hasHistory } from '@db/history'
import { makeBackup } from '../backup/index'
import { loadConfig } from '../config'
import { openFileStore } from '../files/index'
import { loadHistoryKey } from '../history-key'
import { withDatabase } from './open'

// npm run db:backup -- [folder]: a logical backup of the database and the uploads (server/backup).
// On the embedded database, stop the server first: its data directory is locked while it runs.
const config = loadConfig()
const stamp = new Date().toISOString().replace(/[:.]/g, '-')
const outDir = path.resolve(process.argv[2] ?? path.join('backups', `holdfast-${stamp}`))
await withDatabase(async ({ db, driver }) => {
  const key = loadHistoryKey(config.historyKeyFile, await hasHistory(db))
  const manifest = await makeBackup(db, { files: await openFileStore(config), key, outDir, driver })
  const rows = Object.values(manifest.tables).reduce((n, t) => n + t.rows, 0)
  console.log(`Backup written to ${outDir}: ${Object.keys(manifest.tables).length} tables, ${rows} rows, ${Object.keys(manifest.files).length} files.`)
  console.log(`History checkpoints (also in checkpoints.json; keep a copy apart from the backup):`)
  for (const c of manifest.checkpoints) console.log(`  company ${c.companyId}: ${c.vehicles} vehicles, ${c.events} events, ${c.checkpoint}`)
  console.log(`The history key ${config.historyKeyFile} is not in the backup: keep a copy of it apart, a restore needs it.`)
})
