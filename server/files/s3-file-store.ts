import type { S3Client } from '@aws-sdk/client-s3'
import { Readable } from 'node:stream'
import { checked, FileMissingError, isStorageKey, type FileStore } from './file-store'

// The SDK is imported when a bucket is first used, not with the server: a bundle would otherwise load
// it (seconds on a busy two-core machine) at every start of every install, bucket or not.
let sdk: Promise<typeof import('@aws-sdk/client-s3')> | undefined
const loadSdk = () => (sdk ??= import('@aws-sdk/client-s3'))

export interface S3Settings {
  bucket: string
  /** An S3-compatible service's address (MinIO, Ceph, R2…); absent, AWS's own for the region. */
  endpoint: string | undefined
  region: string
  /** Keys go under this folder of the bucket ('' or ending in /), so one bucket can hold several installs. */
  prefix: string
  /** bucket in the path (https://host/bucket/key) rather than in the host name; most non-AWS services want it. */
  forcePathStyle: boolean
}

/** The SDK's client as the settings say; credentials come from the SDK's usual chain (env, profile, role). */
export async function s3Client(s: Pick<S3Settings, 'endpoint' | 'region' | 'forcePathStyle'>, credentials?: { accessKeyId: string; secretAccessKey: string }): Promise<S3Client> {
  const { S3Client } = await loadSdk()
  return new S3Client({
    region: s.region,
    credentials,
    endpoint: s.endpoint,
    forcePathStyle: s.forcePathStyle,
    // The SDK's default checksums need a streaming body's length up front and are not spoken by every
    // S3-compatible service; integrity is already ours (every file's SHA-256 is in the database).
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  })
}

const isMissing = (err: unknown) => (err as { name?: string }).name === 'NoSuchKey' || (err as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode === 404

/**
 * Files in an S3-compatible bucket, under the same keys the disk store uses. The bucket stays private:
 * the browser never reaches it; downloads stream through the server after its access check.
 */
export function s3FileStore(s: S3Settings, client: Promise<S3Client> = s3Client(s)): FileStore {
  const Bucket = s.bucket
  const ready = Promise.all([loadSdk(), client])
  // Nothing is sent before the first use; a client that could not be made fails that use, not the start.
  ready.catch(() => undefined)
  const at = (key: string) => `${s.prefix}${checked(key)}`
  return {
    where: `s3://${Bucket}/${s.prefix}`,
    async put(key, data) {
      // A PUT replaces the object whole or not at all: a reader never sees half a file.
      const [{ PutObjectCommand }, client] = await ready
      await client.send(new PutObjectCommand({ Bucket, Key: at(key), Body: data, ContentLength: data.length, ContentType: key.endsWith('.pdf') ? 'application/pdf' : 'image/jpeg' }))
    },
    async get(key) {
      const [{ GetObjectCommand }, client] = await ready
      try {
        const out = await client.send(new GetObjectCommand({ Bucket, Key: at(key) }))
        if (!(out.Body instanceof Readable)) throw new Error('the S3 client answered without a Node stream')
        return { stream: out.Body, bytes: Number(out.ContentLength ?? 0) }
      } catch (err) {
        if (isMissing(err)) throw new FileMissingError(key)
        throw err
      }
    },
    async delete(key) {
      const [{ DeleteObjectCommand }, client] = await ready
      await client.send(new DeleteObjectCommand({ Bucket, Key: at(key) }))
    },
    async list() {
      const [{ ListObjectsV2Command }, client] = await ready
      const keys: string[] = []
      let ContinuationToken: string | undefined
      do {
        const page = await client.send(new ListObjectsV2Command({ Bucket, Prefix: s.prefix || undefined, ContinuationToken }))
        for (const o of page.Contents ?? []) {
          const key = o.Key?.slice(s.prefix.length)
          if (key && isStorageKey(key)) keys.push(key)
        }
        ContinuationToken = page.IsTruncated ? page.NextContinuationToken : undefined
      } while (ContinuationToken)
      return keys.sort()
    },
    async check() {
      const [{ HeadBucketCommand }, client] = await ready
      await client.send(new HeadBucketCommand({ Bucket }))
    },
  }
}
