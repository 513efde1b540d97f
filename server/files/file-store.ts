import { randomBytes } from 'node:crypto'
import { constants, createReadStream } from 'node:fs'
import { access, mkdir, readdir, rename, rm, stat, writeFile } from 'node:fs/promises'
import path from 'node:path'
import type { Readable } from 'node:stream'

/**
 * Where uploaded files live. The local one keeps them on disk under the data directory, outside any
 * served folder; the bucket one (s3-file-store.ts) implements the same calls, so any app server can answer.
 */
export interface FileStore {
  /** Where the files are, for logs and the start-up banner: a folder, or s3://bucket/prefix. */
  readonly where: string
  put(key: string, data: Buffer): Promise<void>
  get(key: string): Promise<{ stream: Readable; bytes: number }>
  delete(key: string): Promise<void>
  /** Every stored key, sorted (backups read them all). */
  list(): Promise<string[]>
  /** Throws when the store cannot be written to now (readiness asks before a load balancer sends work). */
  check(): Promise<void>
}

export class FileMissingError extends Error {}

// Keys are made by the server; the pattern keeps any key from leaving the store's folder.
const KEY = /^[a-z0-9-]+(\/[a-z0-9-]+)*\.(jpg|pdf)$/

export const isStorageKey = (key: string) => KEY.test(key)

export function checked(key: string): string {
  if (!KEY.test(key)) throw new Error(`not a storage key: ${key}`)
  return key
}

export function localFileStore(root: string): FileStore {
  const where = (key: string) => path.join(root, ...checked(key).split('/'))
  return {
    where: root,
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
    list: () => keysUnder(root),
    async check() {
      await mkdir(root, { recursive: true, mode: 0o700 })
      await access(root, constants.W_OK)
    },
  }
}

/** Files under the folder that are storage keys: a write's .part that a crash left behind is not one. */
async function keysUnder(root: string, dir = ''): Promise<string[]> {
  const entries = await readdir(path.join(root, dir), { withFileTypes: true }).catch((err: NodeJS.ErrnoException) => {
    if (err.code === 'ENOENT') return []
    throw err
  })
  const out: string[] = []
  for (const entry of entries) {
    const rel = path.posix.join(dir, entry.name)
    if (entry.isDirectory()) out.push(...(await keysUnder(root, rel)))
    else if (entry.isFile() && isStorageKey(rel)) out.push(rel)
  }
  return out.sort()
}
