import { GetObjectCommand } from '@aws-sdk/client-s3'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it, inject } from 'vitest'
import { s3Client, s3FileStore } from '../../../server/files/s3-file-store'
import { makeTestApp, type TestApp } from '../../helpers/app'
import { standInClient, TEST_BUCKET } from '../../helpers/s3-setup'

// Issue 15, "Files": what only a bucket has. Run by the api-s3 project only (the S3 stand-in on loopback).
const endpoint = inject('s3Endpoint')!
let app: TestApp
let key: string
beforeAll(async () => {
  expect(endpoint, 'the api-s3 project starts the stand-in (tests/helpers/s3-setup.ts)').toMatch(/^http:\/\/127\.0\.0\.1:53(1[2-9])$/)
  app = await makeTestApp()
  key = 'vehicles/00000000-0000-4000-8000-000000000001/11111111-2222-4333-8444-555555555555.jpg'
  await app.files.put(key, Buffer.from('bytes in the bucket'))
})
afterAll(() => app?.close())

describe('files in an S3 bucket', () => {
  it('the app keeps them in the bucket, under its prefix, readable with its credentials', async () => {
    expect(app.files.where).toMatch(new RegExp(`^s3://${TEST_BUCKET}/[0-9a-f-]{36}/$`))
    expect((await app.storedBytes(key)).toString()).toBe('bytes in the bucket')
  })

  it('the bucket refuses a request signed with the wrong secret, and one whose signed address was changed', async () => {
    const wrong = await s3Client({ endpoint, region: 'us-east-1', forcePathStyle: true }, { accessKeyId: 'S3RVER', secretAccessKey: 'not-the-secret' })
    const prefix = app.files.where.replace(`s3://${TEST_BUCKET}/`, '')
    await expect(wrong.send(new GetObjectCommand({ Bucket: TEST_BUCKET, Key: `${prefix}${key}` }))).rejects.toMatchObject({ name: 'SignatureDoesNotMatch' })
    // A correctly signed request sent to another object: the signature covers the path, so it fails.
    const tampering = await standInClient(endpoint)
    tampering.middlewareStack.add(
      (next) => async (args) => {
        const req = args.request as { path: string }
        req.path = req.path.replace('.jpg', '-other.jpg')
        return next(args)
      },
      { step: 'finalizeRequest', name: 'tamperAfterSigning', priority: 'low' },
    )
    await expect(tampering.send(new GetObjectCommand({ Bucket: TEST_BUCKET, Key: `${prefix}${key}` }))).rejects.toMatchObject({ $metadata: { httpStatusCode: 403 } })
  })

  // A second app on a busy machine takes a while to make.
  it('readiness says the storage is down, with no details, when the bucket cannot be reached', { timeout: 90_000 }, async () => {
    const settings = { bucket: 'no-such-bucket', endpoint, region: 'us-east-1', forcePathStyle: true, prefix: '' }
    const missing = await makeTestApp({ files: s3FileStore(settings, standInClient(endpoint)) })
    try {
      const res = await request(missing.app).get('/api/health/ready').expect(503)
      expect(res.body).toEqual({ status: 'not ready', checks: { database: 'ok', migrations: 'ok', storage: 'down', draining: false } })
    } finally {
      await missing.close()
    }
    await request(app.app).get('/api/health/ready').expect(200)
  })
})
