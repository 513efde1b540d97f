import path from 'node:path'
import { restoreBackup } from '../backup/index'
import { loadConfig } from '../config'
import { openFileStore } from '../files/index'
import { loadHistoryKey } from '../history-key'
import { fail, withDatabase } from './open'

// npm run db:restore -- <backup folder>: into a new, empty data directory (HOLDFAST_DATA_DIR), with the
// history key the backup was made with in place (HOLDFAST_HISTORY_KEY_FILE); then checks what came back.
const from = process.argv[2]
if (!from) fail('Name the backup folder: npm run db:restore -- backups/holdfast-…')
const config = loadConfig()
// The key must already be there: a new one would make every restored chain look forged.
const key = loadHistoryKey(config.historyKeyFile, true)
const files = await openFileStore(config)
const report = await withDatabase(({ db }) => restoreBackup(db, { backupDir: path.resolve(from), files, key }))
console.log(`Restored ${report.tables} tables, ${report.rows} rows, ${report.files} files; checked the history of ${report.vehicles} vehicles.`)
if (report.problems.length > 0) {
  console.error(`The restore is NOT equal to the backup (${report.problems.length} problems):`)
  for (const p of report.problems) console.error(`  ${p}`)
  process.exit(1)
}
console.log('Every table, file, history chain and company checkpoint equals the backup.')
