import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import S3rver from '@20minutes/s3rver'
import type { S3Client } from '@aws-sdk/client-s3'
import type { TestProject } from 'vitest/node'
import { s3Client } from '../../server/files/s3-file-store'

declare module 'vitest' {
  export interface ProvidedContext {
    /** The local S3 stand-in's address when the run keeps files in a bucket (the api-s3 project). */
    s3Endpoint: string | undefined
  }
}

/** The bucket every test app writes to, each under a folder (prefix) of its own. */
export const TEST_BUCKET = 'holdfast-test'
/** The stand-in's one account (s3rver's built-in key pair). */
export const TEST_S3_CREDENTIALS = { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' }
/**
 * The app's own S3 client, as production makes it, with one adjustment for the stand-in: the SDK sends
 * a bucket-level request (list, head) to `/bucket/` and signs that path, while the stand-in checks the
 * signature over `/bucket`, so it would refuse every such request. The path loses its trailing slash
 * before signing; object requests are untouched.
 */
export async function standInClient(endpoint: string): Promise<S3Client> {
  const client = await s3Client({ endpoint, region: 'us-east-1', forcePathStyle: true }, TEST_S3_CREDENTIALS)
  client.middlewareStack.add(
    (next) => async (args) => {
      const request = args.request as { path?: string }
      if (request.path && /^\/[^/]+\/$/.test(request.path)) request.path = request.path.slice(0, -1)
      return next(args)
    },
    { step: 'build', name: 'standInBucketPath' },
  )
  return client
}

// The ports this worktree's helpers may use for the stand-in (the machine is shared).
const PORTS = [5312, 5313, 5314, 5315, 5316, 5317, 5318, 5319]

/**
 * Starts the S3 stand-in (an npm package speaking the S3 HTTP API, signatures checked) on loopback,
 * keeping its objects in a temporary folder, and points the test apps at it.
 */
export default async function setup(project: TestProject) {
  const directory = mkdtempSync(path.join(tmpdir(), 'holdfast-s3-'))
  let server: S3rver | undefined
  let port = 0
  for (const p of PORTS) {
    const candidate = new S3rver({ address: '127.0.0.1', port: p, silent: true, directory, configureBuckets: [{ name: TEST_BUCKET }] })
    try {
      await candidate.run()
      server = candidate
      port = p
      break
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code !== 'EADDRINUSE') throw err
    }
  }
  if (!server) throw new Error(`The S3 stand-in found no free port among ${PORTS.join(', ')}.`)
  project.provide('s3Endpoint', `http://127.0.0.1:${port}`)
  return async () => {
    await server.close()
    rmSync(directory, { recursive: true, force: true })
  }
}
