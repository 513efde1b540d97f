import { openDatabase, type DatabaseHandle } from '@db/client'
import { loadConfig } from '../config'

/** Opens and migrates the configured database for a one-off command, and closes it afterwards. */
export async function withDatabase<T>(work: (handle: DatabaseHandle) => Promise<T>): Promise<T> {
  const config = loadConfig()
  const handle = await openDatabase(config.database, config.migrationsFolder)
  try {
    await handle.migrate()
    return await work(handle)
  } finally {
    await handle.close()
  }
}

export function fail(message: string): never {
  console.error(message)
  process.exit(1)
}
