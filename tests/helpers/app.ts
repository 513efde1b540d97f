import { mkdtempSync, readFileSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { pino } from 'pino'
import request from 'supertest'
import { inject } from 'vitest'
import { openDatabase, type Database } from '../../db/client'
import { createApp, type AppDeps } from '../../server/app'
import { localFileStore } from '../../server/files/index'

let template: Buffer | undefined

/** A fresh, migrated in-memory database, a files folder of its own, and an app on them; no port is opened. */
export async function makeTestApp(overrides: Partial<AppDeps> = {}) {
  template ??= readFileSync(inject('templateDataDir'))
  const handle = await openDatabase({ kind: 'memory', loadDataDir: new Blob([new Uint8Array(template)]) })
  const filesDir = mkdtempSync(path.join(tmpdir(), 'holdfast-files-'))
  const app = createApp({
    files: localFileStore(filesDir),
    db: handle.db,
    log: pino({ level: 'silent' }),
    sessionSecret: 'test-secret-that-is-long-enough-for-signing',
    version: 'test',
    signInLimits: { perAccount: 1000, perIp: 1000, windowMs: 60_000 },
    ...overrides,
  })
  return {
    app,
    db: handle.db,
    filesDir,
    async close() {
      await handle.close()
      rmSync(filesDir, { recursive: true, force: true })
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
