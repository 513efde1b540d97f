// @20minutes/s3rver ships no types: the little the test setup uses of it.
declare module '@20minutes/s3rver' {
  interface S3rverOptions {
    address?: string
    port?: number
    silent?: boolean
    directory?: string
    resetOnClose?: boolean
    allowMismatchedSignatures?: boolean
    configureBuckets?: { name: string; configs?: (string | Buffer)[] }[]
  }
  export default class S3rver {
    constructor(options?: S3rverOptions)
    run(): Promise<{ address: string; port: number }>
    close(): Promise<void>
    reset(): void
  }
}
