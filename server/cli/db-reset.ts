import { rmSync } from 'node:fs'
import path from 'node:path'
import { loadConfig } from '../config'

// Only the embedded database is reset this way; a PostgreSQL database is dropped by its administrator.
const config = loadConfig()
if (config.database.kind === 'postgres') {
  console.error('db:reset only deletes the embedded database. For PostgreSQL, drop and recreate the database yourself.')
  process.exit(1)
}
if (!process.argv.includes('--yes')) {
  console.error(`This deletes every record in ${config.dataDir}. Run again with --yes to confirm: npm run db:reset -- --yes`)
  process.exit(1)
}
rmSync(path.join(config.dataDir, 'pg'), { recursive: true, force: true })
console.log(`Deleted the embedded database in ${config.dataDir}. The next start creates it again (with the demo yard unless HOLDFAST_DEMO=0).`)
