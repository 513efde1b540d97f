import { randomBytes } from 'node:crypto'
import { createReadStream } from 'node:fs'
import { mkdir, rename, rm, stat, writeFile } from 'node:fs/promises'
import path from 'node:path'
import type { Readable } from 'node:stream'

/**
 * Where uploaded files live. The local one keeps them on disk under the data directory, outside any
 * served folder; a bucket adapter implements the same three calls, so any app server can answer.
 */
export interface FileStore {
  put(key: string, data: Buffer): Promise<void>
  get(key: string): Promise<{ stream: Readable; bytes: number }>
  delete(key: string): Promise<void>
}

export class FileMissingError extends Error {}

// Keys are made by the server; the pattern keeps any key from leaving the store's folder.
const KEY = /^[a-z0-9-]+(\/[a-z0-9-]+)*\.(jpg|pdf)$/

function checked(key: string): string {
  if (!KEY.test(key)) throw new Error(`not a storage key: ${key}`)
  return key
}

export function localFileStore(root: string): FileStore {
  const where = (key: string) => path.join(root, ...checked(key).split('/'))
  return {
    async put(key, data) {
      const file = where(key)
      await mkdir(path.dirname(file), { recursive: true, mode: 0o700 })
      // Written beside, then renamed: a reader never sees half a file, a crash leaves only a .part.
      const part = `${file}.${randomBytes(6).toString('hex')}.part`
      try {
        await writeFile(part, data, { mode: 0o600, flag: 'wx' })
        await rename(part, file)
      } catch (err) {
        await rm(part, { force: true })
        throw err
      }
    },
    async get(key) {
      const file = where(key)
      const info = await stat(file).catch(() => null)
      if (!info?.isFile()) throw new FileMissingError(key)
      return { stream: createReadStream(file), bytes: info.size }
    },
    async delete(key) {
      await rm(where(key), { force: true })
    },
  }
}
