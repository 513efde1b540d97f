import { describe, expect, it } from 'vitest'
import { loadConfig } from '../../../server/config'

// Issue 15, "Files": the bucket settings, parsed once at start like the others.
describe('loadConfig: files in a bucket', () => {
  it('keeps files on disk when no bucket is named', () => {
    const config = loadConfig({})
    expect(config.s3).toBeUndefined()
    expect(config.shutdownMs).toBe(10_000)
  })

  it('reads the bucket, endpoint, region and prefix; path style by default with an endpoint', () => {
    const config = loadConfig({ HOLDFAST_S3_BUCKET: 'tamsin-creek-files', HOLDFAST_S3_ENDPOINT: 'http://10.0.0.5:9000', HOLDFAST_S3_REGION: 'us-west-2', HOLDFAST_S3_PREFIX: 'holdfast/', HOLDFAST_SHUTDOWN_SECONDS: '25' })
    expect(config.s3).toEqual({ bucket: 'tamsin-creek-files', endpoint: 'http://10.0.0.5:9000', region: 'us-west-2', prefix: 'holdfast/', forcePathStyle: true })
    expect(config.shutdownMs).toBe(25_000)
  })

  it("on AWS itself: no endpoint, the SDK's AWS_REGION, host-style addresses", () => {
    expect(loadConfig({ HOLDFAST_S3_BUCKET: 'yard-files', AWS_REGION: 'eu-west-1' }).s3).toEqual({ bucket: 'yard-files', endpoint: undefined, region: 'eu-west-1', prefix: '', forcePathStyle: false })
    expect(loadConfig({ HOLDFAST_S3_BUCKET: 'yard-files' }).s3?.region).toBe('us-east-1')
  })

  it.each([
    [{ HOLDFAST_S3_ENDPOINT: 'http://10.0.0.5:9000' }, /HOLDFAST_S3_ENDPOINT set without HOLDFAST_S3_BUCKET/],
    [{ HOLDFAST_S3_PREFIX: 'holdfast/' }, /HOLDFAST_S3_PREFIX set without HOLDFAST_S3_BUCKET/],
    [{ HOLDFAST_S3_BUCKET: 'yard-files', HOLDFAST_FILES_DIR: '/srv/files' }, /files live in one place/],
    [{ HOLDFAST_S3_BUCKET: 'Yard_Files' }, /HOLDFAST_S3_BUCKET must be a bucket name/],
    [{ HOLDFAST_S3_BUCKET: 'yard-files', HOLDFAST_S3_ENDPOINT: 'ftp://x' }, /HOLDFAST_S3_ENDPOINT must be an http\(s\) URL/],
    [{ HOLDFAST_S3_BUCKET: 'yard-files', HOLDFAST_S3_PREFIX: '../other/' }, /HOLDFAST_S3_PREFIX must be folder names ending in \//],
  ])('refuses %o, naming the setting', (env, message) => {
    expect(() => loadConfig(env)).toThrow(message)
  })
})
