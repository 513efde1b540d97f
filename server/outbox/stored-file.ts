import { eq } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { files } from '@db/schema'
import type { FileStore } from '../files/index'

/** The bytes of an attachment kept by reference to a stored file. */
export async function storedFileBytes(db: Executor, store: FileStore, fileId: string): Promise<Buffer | undefined> {
  const [file] = await db.select({ storageKey: files.storageKey }).from(files).where(eq(files.id, fileId))
  if (!file) return undefined
  const { stream } = await store.get(file.storageKey)
  const chunks: Buffer[] = []
  for await (const chunk of stream) chunks.push(chunk as Buffer)
  return Buffer.concat(chunks)
}
