import { randomUUID } from 'node:crypto'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { eq } from 'drizzle-orm'
import pg from 'pg'
import { pino } from 'pino'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { openDatabase, type DatabaseHandle } from '@db/client'
import * as t from '@db/schema'
import { createApp } from '../../server/app'
import { localFileStore } from '../../server/files/index'
import { TEST_HISTORY_KEY } from '../helpers/app'
import { billedVehicle, key } from '../helpers/billing'
import { makeStaff } from '../helpers/factories'
import { fetchSession, listening } from '../helpers/live'

// Two app servers on one real PostgreSQL database: double payments only show where queries really
// run side by side (PGlite runs one at a time). The server is the API tests' shared throwaway one.
const database = `t_billing_${randomUUID().replaceAll('-', '').slice(0, 12)}`
let handle: DatabaseHandle
const servers: Awaited<ReturnType<typeof listening>>[] = []

beforeAll(async () => {
  const admin = new pg.Client({ connectionString: inject('postgresUrl') })
  await admin.connect()
  await admin.query(`create database ${database}`)
  await admin.end()
  handle = await openDatabase({ kind: 'postgres', url: inject('postgresUrl').replace(/\/[^/]*$/, `/${database}`) })
  await handle.migrate()
  const log = pino({ level: 'silent' })
  for (let i = 0; i < 2; i++) {
    const app = createApp({
      historyKey: TEST_HISTORY_KEY,
      db: handle.db, log, files: localFileStore(path.join(tmpdir(), `holdfast-files-${database}`)),
      sessionSecret: 'test-secret-that-is-long-enough-for-signing', version: 'test',
      signInLimits: { perAccount: 1000, perIp: 1000, windowMs: 60_000 },
    })
    servers.push(await listening(app))
  }
})

afterAll(async () => {
  for (const s of servers) await s.close()
  await handle?.close()
})

const rows = (vehicleId: string) => handle.db.select().from(t.payments).where(eq(t.payments.vehicleId, vehicleId))

describe('payments on PostgreSQL', () => {
  it('payment_sameKeyOnTwoServersAtOnce_isRecordedOnceEveryTime', async () => {
    const staff = await makeStaff(handle.db)
    const [a, b] = await Promise.all([fetchSession(servers[0]!.url, staff.office), fetchSession(servers[1]!.url, staff.manager)])
    for (let i = 0; i < 6; i++) {
      const v = await billedVehicle(handle.db, staff.yard.id)
      const body = { idempotencyKey: key(), method: 'cash', amountCents: 2_000 }
      const answers = await Promise.all([a.post(`/api/vehicles/${v.id}/payments`, body), b.post(`/api/vehicles/${v.id}/payments`, body)])
      expect(answers.map((r) => r.status).sort()).toEqual([200, 201])
      expect(await rows(v.id)).toHaveLength(1)
    }
  })

  it('payment_twoClerksEachTakingTheWholeBalanceAtOnce_onlyOneIsTaken', async () => {
    const staff = await makeStaff(handle.db)
    const [a, b] = await Promise.all([fetchSession(servers[0]!.url, staff.office), fetchSession(servers[1]!.url, staff.manager)])
    for (let i = 0; i < 6; i++) {
      const v = await billedVehicle(handle.db, staff.yard.id)
      const due = ((await (await a.get(`/api/vehicles/${v.id}/invoice`)).json()) as { invoice: { dueCents: number } }).invoice.dueCents
      const answers = await Promise.all([
        a.post(`/api/vehicles/${v.id}/payments`, { idempotencyKey: key(), method: 'cash', amountCents: due }),
        b.post(`/api/vehicles/${v.id}/payments`, { idempotencyKey: key(), method: 'card', amountCents: due, terminalReference: 'T9' }),
      ])
      expect(answers.map((r) => r.status).sort()).toEqual([201, 400])
      expect(await rows(v.id)).toHaveLength(1)
    }
  })
})
