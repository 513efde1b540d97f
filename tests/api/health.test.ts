import { mkdtempSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { localFileStore, type FileStore } from '../../server/files/index'
import { Drain } from '../../server/health/index'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { makeStaff } from '../helpers/factories'

// Issue 15, "Operations": liveness and readiness for a load balancer, public and free of personal data.
let app: TestApp
const drain = new Drain()
const scratch = mkdtempSync(path.join(tmpdir(), 'holdfast-health-'))
beforeAll(async () => {
  app = await makeTestApp({ drain })
})
afterAll(async () => {
  await app?.close()
  rmSync(scratch, { recursive: true, force: true })
})

const ALL_OK = { database: 'ok', migrations: 'ok', storage: 'ok', draining: false }

describe('GET /api/health/live and /api/health/ready', () => {
  it('answer without signing in, with only the checks: no names, no counts, no addresses', async () => {
    const live = await request(app.app).get('/api/health/live').expect(200)
    expect(live.body).toEqual({ status: 'ok' })
    const ready = await request(app.app).get('/api/health/ready').expect(200)
    expect(ready.body).toEqual({ status: 'ready', checks: ALL_OK })
    expect(ready.headers['cache-control']).toBe('no-store')
    expect(ready.headers['set-cookie']).toBeUndefined()
  })

  it('readiness is 503 while the server drains, liveness stays 200, and no board stream opens', async () => {
    const staff = await makeStaff(app.db)
    const d = await signedIn(app.app, staff.dispatcher)
    drain.begin()
    try {
      const ready = await request(app.app).get('/api/health/ready').expect(503)
      expect(ready.body).toEqual({ status: 'draining', checks: { ...ALL_OK, draining: true } })
      await request(app.app).get('/api/health/live').expect(200)
      const stream = await d.get('/api/board/events')
      expect(stream.status).toBe(503)
      expect(stream.headers['retry-after']).toBe('1')
    } finally {
      drain.draining = false
    }
    await request(app.app).get('/api/health/ready').expect(200)
  })

  it('readiness is 503 when the file store cannot be written', async () => {
    const broken: FileStore = { ...localFileStore(scratch), check: () => Promise.reject(new Error('read-only file system')) }
    const other = await makeTestApp({ files: broken })
    try {
      const res = await request(other.app).get('/api/health/ready').expect(503)
      expect(res.body).toEqual({ status: 'not ready', checks: { ...ALL_OK, storage: 'down' } })
      expect(JSON.stringify(res.body)).not.toContain('read-only')
    } finally {
      await other.close()
    }
  })

  it('readiness is 503 while the database lacks a migration this server has', async () => {
    const journal = JSON.parse(readFileSync('db/migrations/meta/_journal.json', 'utf8')) as { entries: { when: number; tag: string }[] }
    const newer = path.join(scratch, 'newer-migrations')
    mkdirSync(path.join(newer, 'meta'), { recursive: true })
    const last = journal.entries.at(-1)!
    writeFileSync(path.join(newer, 'meta', '_journal.json'), JSON.stringify({ ...journal, entries: [...journal.entries, { ...last, tag: 'from_a_newer_build', when: last.when + 1000 }] }))
    const other = await makeTestApp({ migrationsFolder: newer })
    try {
      const res = await request(other.app).get('/api/health/ready').expect(503)
      expect(res.body.checks).toEqual({ ...ALL_OK, migrations: 'behind' })
    } finally {
      await other.close()
    }
  })

  it('readiness is 503 when the database does not answer', async () => {
    const other = await makeTestApp()
    await other.close()
    const res = await request(other.app).get('/api/health/ready').expect(503)
    expect(res.body.checks).toMatchObject({ database: 'down', migrations: 'down' })
  })
})
