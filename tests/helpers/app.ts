import { randomBytes, randomUUID } from 'node:crypto'
import { mkdtempSync, readFileSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { buffer } from 'node:stream/consumers'
import pg from 'pg'
import { pino } from 'pino'
import request from 'supertest'
import { inject } from 'vitest'
import { openDatabase, type Database, type DatabaseHandle } from '@db/client'
import { createApp, type AppDeps } from '../../server/app'
import { localFileStore, type FileStore } from '../../server/files/index'
import { s3FileStore } from '../../server/files/s3-file-store'
import { standInClient, TEST_BUCKET } from './s3-setup'
import { databaseUrl, dropDatabase } from './postgres'

let template: Buffer | undefined

/** The history key of every app a test file makes: two apps on one database must share it, as servers do. */
export const TEST_HISTORY_KEY = randomBytes(32)

/**
 * A fresh, migrated database, a files folder of its own, and an app on them; no port is opened.
 * The database is an in-memory PGlite, or under `npm run test:pg` a new database on the run's throwaway
 * PostgreSQL (the engine switch for every API test is here and nowhere else).
 */
export async function makeTestApp(overrides: Partial<AppDeps> = {}) {
  if (inject('testEngine') === 'postgres') return makePostgresTestApp(overrides)
  template ??= readFileSync(inject('templateDataDir'))
  const handle = await openDatabase({ kind: 'memory', loadDataDir: new Blob([new Uint8Array(template)]) })
  return appOn(handle, overrides)
}

/**
 * The store a test app keeps its files in: a folder of its own, or — in the api-s3 project, where
 * tests/helpers/s3-setup.ts runs the S3 stand-in — a folder (prefix) of its own in the test bucket.
 */
export function testFileStore(filesDir: string): FileStore {
  const endpoint = inject('s3Endpoint')
  if (!endpoint) return localFileStore(filesDir)
  const settings = { bucket: TEST_BUCKET, endpoint, region: 'us-east-1', forcePathStyle: true, prefix: `${randomUUID()}/` }
  return s3FileStore(settings, standInClient(endpoint))
}

function appOn(handle: DatabaseHandle, overrides: Partial<AppDeps>, afterClose = async () => {}) {
  const filesDir = mkdtempSync(path.join(tmpdir(), 'holdfast-files-'))
  const files = overrides.files ?? testFileStore(filesDir)
  const app = createApp({
    files,
    db: handle.db,
    historyKey: TEST_HISTORY_KEY,
    log: pino({ level: process.env.TEST_LOG ?? 'silent' }),
    sessionSecret: 'test-secret-that-is-long-enough-for-signing',
    version: 'test',
    signInLimits: { perAccount: 1000, perIp: 1000, windowMs: 60_000 },
    ...overrides,
  })
  return {
    app,
    db: handle.db,
    filesDir,
    /** The app's file store, on disk or in the bucket. */
    files,
    /** Every key in the app's file store, sorted. */
    storedKeys: () => files.list(),
    /** One stored file's bytes. */
    storedBytes: async (key: string) => buffer((await files.get(key)).stream),
    async close() {
      await handle.close()
      rmSync(filesDir, { recursive: true, force: true })
      await afterClose()
    },
  }
}

export type TestApp = Awaited<ReturnType<typeof makeTestApp>>

/** A supertest agent with a session cookie and its CSRF token, like a browser tab. */
export async function browserSession(app: TestApp['app']) {
  const agent = request.agent(app)
  const res = await agent.get('/api/session').expect(200)
  let csrf: string = res.body.csrfToken
  return {
    agent,
    get csrf() {
      return csrf
    },
    async signIn(email: string, password: string) {
      const r = await agent.post('/api/session').set('x-csrf-token', csrf).send({ email, password })
      if (r.body.csrfToken) csrf = r.body.csrfToken
      return r
    },
    get: (url: string) => agent.get(url),
    post: (url: string, body?: object) => agent.post(url).set('x-csrf-token', csrf).send(body),
    put: (url: string, body?: object) => agent.put(url).set('x-csrf-token', csrf).send(body),
    patch: (url: string, body?: object) => agent.patch(url).set('x-csrf-token', csrf).send(body),
    del: (url: string) => agent.delete(url).set('x-csrf-token', csrf),
  }
}

export type BrowserSession = Awaited<ReturnType<typeof browserSession>>

export async function signedIn(app: TestApp['app'], user: { email: string; password: string }) {
  const s = await browserSession(app)
  const r = await s.signIn(user.email, user.password)
  if (r.status !== 200) throw new Error(`sign-in failed in test setup: ${r.status} ${JSON.stringify(r.body)}`)
  return s
}

export type { Database }

/**
 * The same app on a real PostgreSQL database of its own (created, migrated, dropped afterwards),
 * for what PGlite cannot show: it runs one query at a time, so races never happen on it.
 */
export async function makePostgresTestApp(overrides: Partial<AppDeps> = {}) {
  const { name, url, adminClient } = await makePostgresDatabase()
  const handle = await openDatabase({ kind: 'postgres', url })
  return appOn(handle, overrides, async () => {
    await dropDatabase(adminClient, name)
    await adminClient.end()
  })
}

/**
 * A new database on the run's throwaway PostgreSQL, copied from the migrated template (global setup).
 * Returns the admin connection that made it, to drop it with at the end.
 */
export async function makePostgresDatabase(prefix = 't') {
  const admin = inject('postgresUrl')
  const name = `${prefix}_${randomUUID().replaceAll('-', '').slice(0, 16)}`
  const adminClient = new pg.Client({ connectionString: admin })
  await adminClient.connect()
  // The copy is refused while anyone is connected to the template (the migrator's pool takes a moment to go).
  for (let attempt = 0; ; attempt++) {
    try {
      await adminClient.query(`create database ${name} template ${inject('postgresTemplate')}`)
      break
    } catch (err) {
      if (attempt > 50 || !/being accessed by other users/.test(String(err))) throw err
      await new Promise((r) => setTimeout(r, 100))
    }
  }
  return { name, url: databaseUrl(admin, name), adminClient }
}
