import { eq } from 'drizzle-orm'
import type { Express } from 'express'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { can, ROLES, type Role } from '@shared/domain/access'
import { ACCESS } from '../../server/access'
import { makeTestApp, signedIn, type BrowserSession, type TestApp } from '../helpers/app'
import { makeStaff } from '../helpers/factories'
import { towInBody } from '../helpers/tow-in'

// Issue 13, "Access": every route of the app × every kind of caller, from the one access table.
// A route the app serves that the table does not name fails here, and so does a table entry the app
// no longer serves; every refusal leaves the vehicle exactly as it was.

interface Layer {
  route?: { path: string; methods: Record<string, boolean> }
  rawPath?: string
  handle: { stack?: Layer[] }
}

/** Every "METHOD /path" the Express app answers, from its router stack (router 2's layers keep their path). */
function servedRoutes(app: Express): string[] {
  const out: string[] = []
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        const path = `${prefix}${layer.route.path === '/' ? '' : layer.route.path}` || '/'
        for (const [method, on] of Object.entries(layer.route.methods)) if (on && method !== '_all') out.push(`${method.toUpperCase()} ${path}`)
      } else if (layer.handle.stack && typeof layer.rawPath === 'string') {
        walk(layer.handle.stack, `${prefix}${layer.rawPath === '/' ? '' : layer.rawPath}`)
      }
    }
  }
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '')
  return out.filter((r) => r.split(' ')[1]!.startsWith('/api/'))
}

let app: TestApp
let staff: Awaited<ReturnType<typeof makeStaff>>
let outsider: BrowserSession
const sessions = {} as Record<Role, BrowserSession>
let vehicleId: string

beforeAll(async () => {
  app = await makeTestApp()
  staff = await makeStaff(app.db)
  for (const role of ROLES) sessions[role] = await signedIn(app.app, staff[role])
  outsider = await signedIn(app.app, (await makeStaff(app.db)).manager)
  vehicleId = (await sessions.dispatcher.post('/api/vehicles', towInBody(staff.dispatcher.id)).expect(201)).body.id
}, 120_000)
afterAll(() => app.close())

const NOBODY = '00000000-0000-4000-8000-000000000000'
const url = (path: string, vehicle = vehicleId) => path.replace(':vehicleId', vehicle).replace(/:(\w+)/g, NOBODY).replace('{*splat}', 'x')
// The board's live stream never ends by itself; who may open it is tested in board-events.test.ts.
const STREAMS = new Set(['GET /api/board/events'])
const entries = () =>
  Object.entries(ACCESS)
    .filter(([key]) => !STREAMS.has(key))
    .map(([key, rule]) => ({ key, rule, method: key.split(' ')[0]!, path: key.split(' ')[1]! }))

async function vehicleNow() {
  const [v] = await app.db.select({ version: t.vehicles.version, state: t.vehicles.state }).from(t.vehicles).where(eq(t.vehicles.id, vehicleId))
  const events = await app.db.$count(t.historyEvents, eq(t.historyEvents.vehicleId, vehicleId))
  return { ...v, events }
}

function call(s: BrowserSession | null, method: string, path: string, vehicle = vehicleId) {
  const m = method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete'
  if (!s) return request(app.app)[m](url(path, vehicle)).send({})
  if (m === 'get') return s.get(url(path, vehicle))
  return s.agent[m](url(path, vehicle)).set('x-csrf-token', s.csrf).send({})
}

describe('the access table against the routes the app serves', () => {
  it('every route the app serves is in the table, and every table entry is served', () => {
    const served = new Set(servedRoutes(app.app))
    const listed = new Set(Object.keys(ACCESS))
    expect([...served].filter((r) => !listed.has(r)), 'served but not in server/access.ts').toEqual([])
    expect([...listed].filter((r) => !served.has(r)), 'in server/access.ts but not served').toEqual([])
  })
})

describe('every route × every caller', () => {
  it('signed out: every route but the public ones is refused, and nothing changes', async () => {
    const before = await vehicleNow()
    for (const { key, rule, method, path } of entries()) {
      if (rule === 'public') continue
      const res = await call(null, method, path)
      // A write without a session is refused by the CSRF check (403) before the access table (401).
      expect(method === 'GET' ? [401] : [401, 403], key).toContain(res.status)
    }
    expect(await vehicleNow()).toEqual(before)
  })

  it.each(ROLES)('as %s: refused exactly where the table denies the role, and a refusal changes nothing', async (role) => {
    const before = await vehicleNow()
    const wrong: string[] = []
    for (const { key, rule, method, path } of entries()) {
      if (rule === 'public' || key === 'DELETE /api/session') continue
      const allowed = rule === 'staff' || can(role, rule)
      const res = await call(sessions[role], method, path)
      if (allowed ? res.status === 401 || res.status === 403 : res.status !== 403) wrong.push(`${key}: ${res.status} (${allowed ? 'allowed' : 'denied'})`)
    }
    expect(wrong).toEqual([])
    // Empty bodies: an allowed write is refused by its schema (400), a denied one by the table (403).
    expect(await vehicleNow()).toEqual(before)
  })

  it('another company’s manager gets from this company’s vehicle what a vehicle that does not exist gives, and changes nothing', async () => {
    const before = await vehicleNow()
    const leaks: string[] = []
    for (const { key, method, path } of entries()) {
      if (!path.includes(':vehicleId')) continue
      const theirs = (await call(outsider, method, path)).status
      const none = (await call(outsider, method, path, NOBODY)).status
      if (theirs < 400 || theirs !== none) leaks.push(`${key}: ${theirs} (a vehicle that does not exist: ${none})`)
    }
    expect(leaks).toEqual([])
    expect(await vehicleNow()).toEqual(before)
  })
})
