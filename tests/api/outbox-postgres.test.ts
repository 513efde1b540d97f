import { pino } from 'pino'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startLocalSmtp, type LocalSmtp } from '../../server/fakes/index'
import { OutboxWorker, queueMessage, smtpTransport } from '../../server/outbox/index'
import { makePostgresTestApp, type TestApp } from '../helpers/app'
import { makeStaff } from '../helpers/factories'

// Several app servers on one PostgreSQL each run a worker; PGlite runs one query at a time and can never
// show two claims racing, real PostgreSQL can (FOR UPDATE SKIP LOCKED).
let app: TestApp
let smtp: LocalSmtp
beforeAll(async () => {
  app = await makePostgresTestApp()
  smtp = await startLocalSmtp()
})
afterAll(async () => {
  await smtp.close()
  await app.close()
})

describe('the outbox on PostgreSQL', () => {
  it('four workers draining forty messages at once send each exactly once', async () => {
    const staff = await makeStaff(app.db)
    const to = Array.from({ length: 40 }, (_, i) => `owner${i}@test.example`)
    for (const address of to) await queueMessage(app.db, staff.company.id, null, { to: address, subject: 'Notice', text: 'Body', purpose: 'test' })
    const noFiles = () => Promise.reject(new Error('no stored files here'))
    const workers = Array.from(
      { length: 4 },
      () => new OutboxWorker(app.db, smtpTransport(smtp.url), { where: 'nowhere', put: noFiles, get: noFiles, delete: noFiles, list: noFiles, check: noFiles }, pino({ level: 'silent' }), { from: 'yard@test.example' }),
    )
    const sent = await Promise.all(workers.map((w) => w.drain()))
    await Promise.all(workers.map((w) => w.stop()))
    expect(sent.reduce((a, b) => a + b, 0)).toBe(40)
    expect(smtp.received.map((m) => m.to[0]).sort()).toEqual([...to].sort())
    // More than one worker did some of the work: the claims really ran side by side.
    expect(sent.filter((n) => n > 0).length).toBeGreaterThan(1)
  })
})
