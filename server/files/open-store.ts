import { localFileStore, type FileStore } from './file-store'
import type { S3Settings } from './s3-file-store'

/**
 * The configured store: the bucket when one is named, else the files folder on this machine. The AWS
 * SDK is loaded only for a bucket: a yard on one machine does not pay for it at every start.
 */
export async function openFileStore(config: { filesDir: string; s3: S3Settings | undefined }): Promise<FileStore> {
  if (!config.s3) return localFileStore(config.filesDir)
  const { s3FileStore } = await import('./s3-file-store')
  return s3FileStore(config.s3)
}
