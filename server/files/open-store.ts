import { localFileStore, type FileStore } from './file-store'
import { s3FileStore, type S3Settings } from './s3-file-store'

/** The configured store: the bucket when one is named, else the files folder on this machine. */
export async function openFileStore(config: { filesDir: string; s3: S3Settings | undefined }): Promise<FileStore> {
  return config.s3 ? s3FileStore(config.s3) : localFileStore(config.filesDir)
}
