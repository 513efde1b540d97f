import { DeleteObjectCommand, GetObjectCommand, HeadBucketCommand, ListObjectsV2Command, NoSuchKey, PutObjectCommand, S3Client } from '@aws-sdk/client-s3'
import { Readable } from 'node:stream'
import { checked, FileMissingError, isStorageKey, type FileStore } from './file-store'

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
export function s3Client(s: Pick<S3Settings, 'endpoint' | 'region' | 'forcePathStyle'>, credentials?: { accessKeyId: string; secretAccessKey: string }): S3Client {
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

const isMissing = (err: unknown) => err instanceof NoSuchKey || (err as { name?: string }).name === 'NoSuchKey' || (err as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode === 404

/**
 * Files in an S3-compatible bucket, under the same keys the disk store uses. The bucket stays private:
 * the browser never reaches it; downloads stream through the server after its access check.
 */
export function s3FileStore(s: S3Settings, client: S3Client = s3Client(s)): FileStore {
  const Bucket = s.bucket
  const at = (key: string) => `${s.prefix}${checked(key)}`
  return {
    where: `s3://${Bucket}/${s.prefix}`,
    async put(key, data) {
      // A PUT replaces the object whole or not at all: a reader never sees half a file.
      await client.send(new PutObjectCommand({ Bucket, Key: at(key), Body: data, ContentLength: data.length, ContentType: key.endsWith('.pdf') ? 'application/pdf' : 'image/jpeg' }))
    },
    async get(key) {
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
      await client.send(new DeleteObjectCommand({ Bucket, Key: at(key) }))
    },
    async list() {
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
      await client.send(new HeadBucketCommand({ Bucket }))
    },
  }
}
