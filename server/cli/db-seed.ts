import { loadDemoIfEmpty } from '../demo/index'
import { loadConfig } from '../config'
import { withDatabase } from './open'

await withDatabase(async ({ db }) => {
  const demo = await loadDemoIfEmpty(db, new Date(), loadConfig().ruleSetsFolder)
  if (!demo) return console.log('The database already has a yard; the demo was not loaded.')
  console.log(`Demo yard loaded. Password for every demo user: ${demo.password}`)
  for (const u of demo.users) console.log(`  ${u.role.padEnd(10)} ${u.email}`)
})
