import { randomBytes } from 'node:crypto'
import { readFileSync, writeFileSync } from 'node:fs'
import type { HistoryKey } from '@db/history'

const KEY_BYTES = 32

/**
 * The history key from its file, outside the database: 64 hex digits. A new install makes one (readable
 * by this user only). When the database already holds history and the file is gone, the server does
 * not start: a new key would make every record of custody look forged. The file is backed up with the
 * database, but kept apart from it.
 */
export function loadHistoryKey(file: string, databaseHasHistory: boolean): HistoryKey {
  let text: string
  try {
    text = readFileSync(file, 'utf8').trim()
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code !== 'ENOENT') throw err
    if (databaseHasHistory) {
      throw new Error(
        `Holdfast cannot start: the history key ${file} is missing, and the database holds vehicle history sealed with it. ` +
          'Restore the file from the backup made with the database (or point HOLDFAST_HISTORY_KEY_FILE at it).',
        { cause: err },
      )
    }
    const key = randomBytes(KEY_BYTES)
    writeFileSync(file, `${key.toString('hex')}\n`, { mode: 0o600, flag: 'wx' })
    return key
  }
  if (!/^[0-9a-f]{64}$/i.test(text)) throw new Error(`Holdfast cannot start: the history key ${file} must hold 64 hexadecimal digits.`)
  return Buffer.from(text, 'hex')
}
