import { randomBytes, randomUUID } from 'node:crypto'
import type { Server } from 'node:http'
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { pathToFileURL } from 'node:url'
import { pino } from 'pino'
import { openDatabase } from '@db/client'
import { createApp } from '../../server/app'
import { loadDemoIfEmpty } from '../../server/demo/index'
import { localFileStore } from '../../server/files/index'
import { anotherVehicle, towInBody } from '../helpers/tow-in'
import { HttpClient } from './http-client'

// The demo yard's manager and office clerk (server/demo), as in the load bench.
const MANAGER = { email: 'ruben@tamsincreek.example', password: 'quarry-spur-demo' }
const OFFICE = { email: 'priya@tamsincreek.example', password: 'quarry-spur-demo' }

export interface OperationCost {
  /** Statements sent to the database per request (drizzle's logger), the mean over the rounds. */
  queries: number
  /** CPU time of this process per request: server and the bench's own client together, so a ratio, not an absolute. */
  cpuMs: number
}

/**
 * Each operation of the load bench's workload alone, one request at a time, on the demo yard in an
 * in-memory database in this process: how many statements it sends and how much CPU it takes. Counts
 * do not depend on how busy the machine is, so they say whether a change made a request do more work.
 */
export async function costPerRequest(port: number, rounds = 20): Promise<Record<string, OperationCost>> {
  let queries = 0
  // HOLDFAST_SHOW_QUERIES=<operation> prints that operation's statements, to see what it sends.
  const show = process.env.HOLDFAST_SHOW_QUERIES
  let current = ''
  const handle = await openDatabase({ kind: 'memory' }, undefined, {
    logQuery: (query) => {
      queries++
      if (show && current === show) console.log(`${show}: ${query.slice(0, 160)}`)
    },
  })
  const filesDir = mkdtempSync(path.join(tmpdir(), 'holdfast-per-request-'))
  let server: Server | undefined
  try {
    await handle.migrate()
    const historyKey = randomBytes(32)
    const files = localFileStore(filesDir)
    await loadDemoIfEmpty(handle.db, historyKey, new Date(), path.resolve('server/rule-sets/samples'), files)
    const app = createApp({ db: handle.db, historyKey, files, log: pino({ level: 'silent' }), sessionSecret: randomBytes(32).toString('hex'), version: 'bench' })
    server = await new Promise<Server>((resolve) => {
      const s = app.listen(port, '127.0.0.1', () => resolve(s))
    })
    const base = `http://127.0.0.1:${port}`
    const desk = await new HttpClient(base).signIn(MANAGER)
    const counter = await new HttpClient(base).signIn(OFFICE)
    const totals = new Map<string, { queries: number; cpuUs: number; n: number }>()
    const measure = async (op: string, send: () => Promise<{ status: number; body: Record<string, unknown> }>) => {
      current = op
      const q = queries
      const cpu = process.cpuUsage()
      const res = await send()
      const used = process.cpuUsage(cpu)
      current = ''
      if (res.status >= 300) throw new Error(`${op}: ${res.status} ${JSON.stringify(res.body).slice(0, 200)}`)
      const t = totals.get(op) ?? { queries: 0, cpuUs: 0, n: 0 }
      t.queries += queries - q
      t.cpuUs += used.user + used.system
      t.n += 1
      totals.set(op, t)
      return res
    }
    // One round unmeasured: the first board read builds the yard's snapshot, the first of anything warms the code.
    for (let round = -1; round < rounds; round++) {
      const m = round < 0 ? async (_op: string, send: () => Promise<{ status: number; body: Record<string, unknown> }>) => send() : measure
      await m('board', () => desk.call('GET', '/api/board'))
      const towed = await m('tow-in', () => desk.call('POST', '/api/vehicles', towInBody(desk.userId, anotherVehicle)))
      const id = String(towed.body.id)
      await m('move', () => desk.call('POST', `/api/vehicles/${id}/moves`, { to: 'teardown', version: Number(towed.body.version ?? 1) }))
      await m('quote', () => desk.call('POST', '/api/quotes/storage', { ruleSetId: 'california-sample', stay: { arrivedAt: '2026-03-01T12:00:00Z', vehicleClass: 'standard' }, asOf: '2026-03-04T12:00:00Z' }))
      await m('payment', () => counter.call('POST', `/api/vehicles/${id}/payments`, { idempotencyKey: randomUUID(), method: 'cash', amountCents: 100, tenderedCents: 100 }))
    }
    return Object.fromEntries([...totals].map(([op, t]) => [op, { queries: Math.round((t.queries / t.n) * 10) / 10, cpuMs: Math.round(t.cpuUs / t.n / 100) / 10 }]))
  } finally {
    await new Promise((r) => (server ? server.close(r) : r(undefined)))
    server?.closeAllConnections()
    await handle.close()
    rmSync(filesDir, { recursive: true, force: true })
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) console.log(JSON.stringify(await costPerRequest(Number(process.env.PORT ?? 3394), Number(process.env.ROUNDS ?? 20)), null, 2))
