import { sql } from 'drizzle-orm'
import fc from 'fast-check'
import { afterAll, beforeAll, expect, it } from 'vitest'
import { can, ROLES, type Role } from '@shared/domain/access'
import { ACCESS } from '../../server/access'
import { tableNames } from '../../server/backup/backup'
import { cardPaymentsClient } from '../../server/card-payments/index'
import { startFakePaymentService, type FakePaymentService } from '../../server/fakes/index'
import { makeTestApp, signedIn, type BrowserSession, type TestApp } from '../helpers/app'
import { makeStaff } from '../helpers/factories'
import { towInBody } from '../helpers/tow-in'

// Issue 13, "Hostile input": every write route of the access table, as a role allowed to call it, gets
// generated bodies, path parameters and query strings — valid bodies with one value swapped for
// something hostile, and arbitrary ones: wrong types, huge strings, lone surrogates, NUL, prototype
// keys, SQL and HTML fragments. Never a 5xx; a 400 names the field (`issues`); a refusal writes nothing.
// A seed (HOLDFAST_FC_SEED) replays a run; `npm run test:soak` runs 25 times as many cases.
const soak = process.env.HOLDFAST_SOAK === '1'
const seed = Number(process.env.HOLDFAST_FC_SEED ?? 20_261_203)
const PER_ROUTE = Number(process.env.HOLDFAST_FC_RUNS ?? (soak ? 100 : 4))

let app: TestApp
// Card payments set up against the local stand-in, so the webhook is fuzzed through its signature check.
let fake: FakePaymentService
let staff: Awaited<ReturnType<typeof makeStaff>>
const sessions = {} as Record<Role, BrowserSession>
let vehicleId: string
let fingerprint: () => Promise<string>

beforeAll(async () => {
  fake = await startFakePaymentService()
  app = await makeTestApp({ cardPayments: cardPaymentsClient({ secretKey: fake.secretKey, webhookSecret: fake.webhookSecret, host: fake.host, port: fake.port }) })
  staff = await makeStaff(app.db)
  for (const role of ROLES) sessions[role] = await signedIn(app.app, staff[role])
  vehicleId = (await sessions.dispatcher.post('/api/vehicles', towInBody(staff.dispatcher.id)).expect(201)).body.id
  // Row count and checksum of every table but the ones a refused request rightly writes (sessions, sign-in counters, logs of refusals).
  const tables = (await tableNames(app.db)).filter((n) => !/session|sign_in|throttle|failure|known_device/.test(n))
  const query = sql.raw(`select md5(concat_ws(',', ${tables.map((n) => `(select count(*) || ':' || coalesce(md5(string_agg(x::text, '' order by x::text)), '') from "${n}" x)`).join(', ')})) as f`)
  fingerprint = async () => String(((await app.db.execute(query)) as unknown as { rows: { f: string }[] }).rows[0]!.f)
}, 120_000)
afterAll(async () => {
  await app.close()
  await fake.close()
})

// Sign-in and sign-out would end the session the other cases use; they have their own tests.
const SKIP = new Set(['POST /api/session', 'DELETE /api/session'])
const routes = Object.entries(ACCESS)
  .filter(([key]) => !key.startsWith('GET ') && !SKIP.has(key))
  .map(([key, rule]) => ({ key, method: key.split(' ')[0]!.toLowerCase() as 'post' | 'put' | 'patch' | 'delete', path: key.split(' ')[1]!, role: ROLES.find((r) => rule === 'public' || rule === 'staff' || can(r, rule))! }))
  .filter((r) => r.role)

const NASTY = [
  '\ud800',
  'a\udc00b',
  'left\u0000right',
  "' OR 1=1; DROP TABLE vehicles; --",
  '"); DELETE FROM history_events; --',
  '<script>alert(1)</script>',
  '<img src=x onerror=alert(1)>',
  '${7*7}{{7*7}}',
  '../../etc/passwd',
  '%00',
  '\u202e\u200b',
  '   ',
  '',
  '9'.repeat(400),
  '-1',
  '1e309',
]
const hugeString = fc.integer({ min: 10_000, max: 300_000 }).map((n) => 'x'.repeat(n))
const nastyString = fc.oneof(fc.constantFrom(...NASTY), fc.string({ unit: 'binary', maxLength: 40 }), hugeString)
const PROTO_KEYS = ['__proto__', 'constructor', 'prototype', 'toString', 'hasOwnProperty']
const FIELD_NAMES = ['to', 'version', 'id', 'kind', 'label', 'name', 'email', 'role', 'password', 'note', 'reason', 'amountCents', 'method', 'idempotencyKey', 'value', 'items', 'lines', 'state', 'vehicle', 'tow', 'code', 'asOf', 'stay', 'ruleSetId']
const key = fc.oneof(fc.constantFrom(...PROTO_KEYS, ...FIELD_NAMES), fc.string({ maxLength: 12 }))
const leaf = fc.oneof(
  nastyString,
  fc.integer(),
  fc.constantFrom(Number.MAX_SAFE_INTEGER + 2, -0, 1.5, 1e308, -1e308),
  fc.boolean(),
  fc.constant(null),
  fc.constant([]),
  fc.constant({}),
)
const { value } = fc.letrec((tie) => ({
  value: fc.oneof({ depthSize: 'small', withCrossShrink: true }, leaf, fc.array(tie('value'), { maxLength: 4 }), fc.dictionary(key, tie('value'), { maxKeys: 5 })),
}))

type Json = null | boolean | number | string | Json[] | { [k: string]: Json }

/** Paths to every value of a JSON document, to swap one for something hostile. */
function leaves(doc: Json, at: (string | number)[] = []): (string | number)[][] {
  if (doc === null || typeof doc !== 'object') return [at]
  const entries = Array.isArray(doc) ? doc.map((v, i) => [i, v] as const) : Object.entries(doc)
  return [at, ...entries.flatMap(([k, v]) => leaves(v, [...at, k]))]
}
function swapped(doc: Json, path: (string | number)[], to: Json): Json {
  if (path.length === 0) return to
  const copy = (Array.isArray(doc) ? [...doc] : { ...(doc as object) }) as Record<string | number, Json>
  copy[path[0]!] = swapped(copy[path[0]!] ?? null, path.slice(1), to)
  return copy as Json
}
// A valid body where one is known, so a swapped value gets past the other fields' checks.
const valid = (): Record<string, Json> => ({
  'POST /api/vehicles': towInBody(staff.dispatcher.id) as unknown as Json,
  'POST /api/vehicles/:vehicleId/moves': { to: 'teardown', version: 1 },
  'POST /api/quotes/storage': { ruleSetId: 'california-sample', stay: { arrivedAt: '2026-03-01T12:00:00Z', vehicleClass: 'standard' }, asOf: '2026-03-04T12:00:00Z' },
  'POST /api/users': { email: 'new@example.test', name: 'New Person', role: 'office', password: 'a long enough pass phrase' },
})

const body = (route: string) => {
  const sample = valid()[route]
  const arbitrary = fc.oneof(fc.dictionary(key, value, { maxKeys: 6 }), value)
  if (!sample) return arbitrary
  const paths = leaves(sample)
  return fc.oneof(arbitrary, fc.tuple(fc.constantFrom(...paths), value).map(([p, v]) => swapped(sample, p, v as Json)))
}
const param = fc.oneof(fc.constant('own'), fc.constantFrom('00000000-0000-4000-8000-000000000000', "1' OR '1'='1", '%00', '..%2F..', 'x'.repeat(300), '%ED%A0%80'))
const query = fc.option(fc.dictionary(fc.oneof(fc.constantFrom(...PROTO_KEYS, 'q', 'page', 'limit'), fc.string({ maxLength: 8 })), nastyString.map((s) => s.slice(0, 2000)), { maxKeys: 3 }), { nil: undefined })

it(`every write route, ${PER_ROUTE} generated cases each: never a 5xx, a 400 names the field, a refusal writes nothing`, { timeout: routes.length * PER_ROUTE * 3_000 + 60_000 }, async () => {
  let cases = 0
  const failures: string[] = []
  for (const route of routes) {
    const details = await fc.check(
      fc.asyncProperty(body(route.key), param, query, async (sent, p, q) => {
        cases++
        const s = sessions[route.role]
        const path = route.path
          .replace(':vehicleId', p === 'own' ? vehicleId : p)
          .replace(/:(\w+)/g, p === 'own' ? '00000000-0000-4000-8000-000000000000' : p)
        const qs = q ? `?${new URLSearchParams(Object.entries(q)).toString()}` : ''
        const before = await fingerprint()
        const res = await s.agent[route.method](path + qs).set('x-csrf-token', s.csrf).set('content-type', 'application/json').send(JSON.stringify(sent))
        const what = `${route.key} ${path.slice(0, 80)}${qs.slice(0, 80)} ${String(JSON.stringify(sent)).slice(0, 200)} → ${res.status} ${JSON.stringify(res.body).slice(0, 200)}`
        expect(res.status, what).toBeLessThan(500)
        if (res.status === 400) {
          expect(res.body.issues, what).toEqual(expect.arrayContaining([expect.objectContaining({ path: expect.any(String), message: expect.any(String) })]))
        }
        if (res.status >= 400) expect(await fingerprint(), `${what}: refused, but something was written`).toBe(before)
      }),
      { seed: seed + cases, numRuns: PER_ROUTE, endOnFailure: true },
    )
    // Every route is tried even when one fails; each failure is kept short (huge strings are cut).
    if (details.failed) failures.push(String(details.errorInstance instanceof Error ? details.errorInstance.message : details.errorInstance).slice(0, 700))
  }
  console.log(`hostile input: ${cases} cases over ${routes.length} write routes (seed ${seed})`)
  expect(failures).toEqual([])
})
