import { hasHistory } from '@db/history'
import { loadDemoIfEmpty } from '../demo/index'
import { localFileStore } from '../files/index'
import { loadConfig } from '../config'
import { loadHistoryKey } from '../history-key'
import { withDatabase } from './open'

await withDatabase(async ({ db }) => {
  const config = loadConfig()
  const demo = await loadDemoIfEmpty(db, loadHistoryKey(config.historyKeyFile, await hasHistory(db)), new Date(), config.ruleSetsFolder, localFileStore(config.filesDir))
  if (!demo) return console.log('The database already has a yard; the demo was not loaded.')
  console.log(`Demo yard loaded. Password for every demo user: ${demo.password}`)
  for (const u of demo.users) console.log(`  ${u.role.padEnd(10)} ${u.email}`)
})
