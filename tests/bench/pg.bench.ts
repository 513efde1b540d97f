import { randomUUID } from 'node:crypto'
import { spawn, type ChildProcess } from 'node:child_process'
import http from 'node:http'
import { mkdtempSync, rmSync } from 'node:fs'
import { cpus, loadavg, tmpdir } from 'node:os'
import path from 'node:path'
import { pathToFileURL } from 'node:url'
import pg from 'pg'
import { bundleServer } from '../soak/crash-rounds'
import { anotherVehicle, towInBody } from '../helpers/tow-in'
import { databaseUrl, startThrowawayPostgres } from '../helpers/postgres'
import { HttpClient, percentile } from './http-client'
import { writeResult, type BenchResult } from './results'

// Issue 15, the figures: the demo yard on PostgreSQL beside the embedded PGlite in the same run (the board read
// and a mixed workload), then two app servers on one PostgreSQL behind a round-robin proxy against one server
// behind the same proxy. Ratios, not absolute times: the machine is shared (its load is written down).
const GOALS = {
  // PostgreSQL answers in another process, over a socket: a board read may cost a little more than in-process PGlite.
  boardRpsPostgresToPglite: 0.5,
  mixedRpsPostgresToPglite: 0.5,
  // Two servers must not do much worse than one behind the same proxy; with cores to spare they do better.
  twoServersRpsToOne: 0.9,
  errors: 0,
}
const SECONDS = Number(process.env.HOLDFAST_PG_BENCH_SECONDS ?? 8)
const CONNECTIONS = 10
const PORTS = { a: 3395, b: 3396, proxy: 3397 }
const PG_PORT = Number(process.env.HOLDFAST_BENCH_PG_PORT ?? 54_335)
// The demo yard's manager makes one manager account per connection: a person has at most two uploads in
// progress (a tow-in is one), so ten connections as one person would be refused rather than measured.
const DEMO_MANAGER = { email: 'delia@tamsincreek.example', password: 'quarry-spur-demo' }
const benchStaff = (i: number) => ({ email: `bench-${i}@tamsincreek.example`, password: 'gravel-lantern-bench-staff-42' })


/** `connections` clients, each calling `step` back to back for SECONDS: requests a second, p95 and errors. */
type Answer = { status: number; what?: string; body?: unknown }

async function closedLoop(base: string, step: (c: HttpClient) => Promise<Answer[]>, seconds = SECONDS) {
  const clients = await Promise.all(Array.from({ length: CONNECTIONS }, (_, i) => new HttpClient(base).signIn(benchStaff(i))))
  const times: number[] = []
  let errors = 0
  const refused = new Map<string, string>()
  const until = performance.now() + seconds * 1000
  await Promise.all(
    clients.map(async (c) => {
      while (performance.now() < until) {
        const t = performance.now()
        const answers = await step(c).catch((err: Error): Answer[] => [{ status: 0, body: err.message }])
        const each = (performance.now() - t) / answers.length
        for (const a of answers) {
          if (a.status >= 200 && a.status < 300) times.push(each)
          else {
            errors++
            const what = `${a.what ?? 'request'} ${a.status}`
            if (!refused.has(what)) refused.set(what, JSON.stringify(a.body ?? '').slice(0, 200))
          }
        }
      }
    }),
  )
  times.sort((a, b) => a - b)
  return { requests: times.length, requestsPerSecond: Math.round(times.length / seconds), p50Ms: Math.round(percentile(times, 0.5)), p95Ms: Math.round(percentile(times, 0.95)), errors, refused: Object.fromEntries(refused) }
}

const boardRead = async (c: HttpClient) => [await c.call('GET', '/api/board')]
/** A desk's work without pauses: the board, a tow-in, its move to teardown, a cash payment, the vehicle's record. */
async function mixed(c: HttpClient) {
  const out = [await c.call('GET', '/api/board')]
  const towed = await c.call('POST', '/api/vehicles', towInBody(c.userId, anotherVehicle))
  out.push(towed)
  if (towed.status === 201) {
    const id = String(towed.body.id)
    out.push(await c.call('POST', `/api/vehicles/${id}/moves`, { to: 'teardown', version: Number(towed.body.version ?? 1) }))
    out.push(await c.call('POST', `/api/vehicles/${id}/payments`, { idempotencyKey: randomUUID(), method: 'cash', amountCents: 100, tenderedCents: 100 }))
    out.push(await c.call('GET', `/api/vehicles/${id}`))
  }
  return out
}

/** A round-robin reverse proxy in a few lines of node:http: no sticky sessions (the session lives in the database). */
function roundRobin(upstreams: number[], port: number) {
  let next = 0
  const agent = new http.Agent({ keepAlive: true, maxSockets: 64 })
  const server = http.createServer((req, res) => {
    const target = upstreams[next++ % upstreams.length]!
    const up = http.request({ host: '127.0.0.1', port: target, path: req.url, method: req.method, headers: req.headers, agent }, (r) => {
      res.writeHead(r.statusCode ?? 502, r.headers)
      r.pipe(res)
    })
    up.on('error', () => res.writeHead(502).end())
    req.pipe(up)
  })
  return new Promise<http.Server>((resolve) => server.listen(port, '127.0.0.1', () => resolve(server)))
}

function closeProxy(server: http.Server) {
  server.closeAllConnections()
  return new Promise((r) => server.close(r))
}

function start(entry: string, env: Record<string, string>): ChildProcess {
  return spawn(process.execPath, [entry], {
    env: { ...process.env, HOST: '127.0.0.1', LOG_LEVEL: 'warn', HOLDFAST_DEMO: '1', HOLDFAST_SIGNIN_PER_IP: '100000', ...env },
    stdio: ['ignore', 'ignore', 'inherit'],
  })
}
async function healthy(port: number) {
  for (let i = 0; i < 1200; i++) {
    if (await fetch(`http://127.0.0.1:${port}/api/health`).then((r) => r.ok, () => false)) return
    await new Promise((r) => setTimeout(r, 100))
  }
  throw new Error(`the server on ${port} did not start`)
}

/** A new database with the demo yard gets the bench's staff (already there: 409, fine). */
async function addBenchStaff(port: number) {
  const manager = await new HttpClient(`http://127.0.0.1:${port}`).signIn(DEMO_MANAGER)
  for (let i = 0; i < CONNECTIONS; i++) {
    const res = await manager.call('POST', '/api/users', { ...benchStaff(i), name: `Bench Manager ${i}`, role: 'manager' })
    if (res.status !== 201 && res.status !== 409) throw new Error(`adding bench staff: ${res.status} ${JSON.stringify(res.body)}`)
  }
}
async function stop(child: ChildProcess) {
  if (child.exitCode !== null || child.signalCode !== null) return
  child.kill('SIGTERM')
  await new Promise((r) => child.once('exit', r))
}
const ratio = (a: number, b: number) => Number((a / b).toFixed(2))
const round2 = (n: number) => Math.round(n * 100) / 100

export async function run(): Promise<BenchResult> {
  const loadBefore = loadavg()[0]!
  const dir = mkdtempSync(path.join(tmpdir(), 'holdfast-pg-bench-'))
  const postgres = startThrowawayPostgres(PG_PORT)
  const children: ChildProcess[] = []
  let proxy: http.Server | undefined
  try {
    const entry = await bundleServer()
    const admin = new pg.Client({ connectionString: postgres.url })
    await admin.connect()
    await admin.query('create database holdfast_bench')
    await admin.end()
    const DATABASE_URL = databaseUrl(postgres.url, 'holdfast_bench')

    // The embedded database alone.
    const embedded = start(entry, { PORT: String(PORTS.a), HOLDFAST_DATA_DIR: path.join(dir, 'pglite') })
    children.push(embedded)
    await healthy(PORTS.a)
    await addBenchStaff(PORTS.a)
    const pglite = { board: await closedLoop(`http://127.0.0.1:${PORTS.a}`, boardRead), mixed: await closedLoop(`http://127.0.0.1:${PORTS.a}`, mixed) }
    await stop(embedded)

    // PostgreSQL, one server: the first start migrates and loads the demo; the second server joins after it.
    const shared = { DATABASE_URL, HOLDFAST_DATA_DIR: path.join(dir, 'pg'), HOLDFAST_HISTORY_KEY_FILE: path.join(dir, 'history-key'), HOLDFAST_FILES_DIR: path.join(dir, 'files') }
    const a = start(entry, { ...shared, PORT: String(PORTS.a) })
    children.push(a)
    await healthy(PORTS.a)
    await addBenchStaff(PORTS.a)
    const postgresOne = { board: await closedLoop(`http://127.0.0.1:${PORTS.a}`, boardRead), mixed: await closedLoop(`http://127.0.0.1:${PORTS.a}`, mixed) }

    // The same proxy in front of one server, then of two, interleaved so both meet the same machine state;
    // B reads the board once first, as a server in service would have.
    const b = start(entry, { ...shared, PORT: String(PORTS.b) })
    children.push(b)
    await healthy(PORTS.b)
    await closedLoop(`http://127.0.0.1:${PORTS.b}`, boardRead, 2)
    const upstreams = [PORTS.a]
    proxy = await roundRobin(upstreams, PORTS.proxy)
    const rounds: { oneServer: Awaited<ReturnType<typeof closedLoop>>; twoServers: Awaited<ReturnType<typeof closedLoop>> }[] = []
    for (let i = 0; i < 2; i++) {
      upstreams.splice(0, upstreams.length, PORTS.a)
      const oneServer = await closedLoop(`http://127.0.0.1:${PORTS.proxy}`, mixed)
      upstreams.splice(0, upstreams.length, PORTS.a, PORTS.b)
      rounds.push({ oneServer, twoServers: await closedLoop(`http://127.0.0.1:${PORTS.proxy}`, mixed) })
    }
    const mean = (pick: (r: (typeof rounds)[number]) => number) => rounds.reduce((n, r) => n + pick(r), 0) / rounds.length
    const viaProxyOne = { requestsPerSecond: mean((r) => r.oneServer.requestsPerSecond), p95Ms: mean((r) => r.oneServer.p95Ms), errors: mean((r) => r.oneServer.errors) }
    const viaProxyTwo = { requestsPerSecond: mean((r) => r.twoServers.requestsPerSecond), p95Ms: mean((r) => r.twoServers.p95Ms), errors: mean((r) => r.twoServers.errors) }

    const figures = {
      boardRpsPostgresToPglite: ratio(postgresOne.board.requestsPerSecond, pglite.board.requestsPerSecond),
      mixedRpsPostgresToPglite: ratio(postgresOne.mixed.requestsPerSecond, pglite.mixed.requestsPerSecond),
      twoServersRpsToOne: ratio(viaProxyTwo.requestsPerSecond, viaProxyOne.requestsPerSecond),
      twoServersP95ToOne: ratio(viaProxyTwo.p95Ms, viaProxyOne.p95Ms),
    }
    const errors = [pglite.board, pglite.mixed, postgresOne.board, postgresOne.mixed, viaProxyOne, viaProxyTwo].reduce((n, r) => n + r.errors, 0)
    const met =
      figures.boardRpsPostgresToPglite >= GOALS.boardRpsPostgresToPglite && figures.mixedRpsPostgresToPglite >= GOALS.mixedRpsPostgresToPglite &&
      figures.twoServersRpsToOne >= GOALS.twoServersRpsToOne && errors === GOALS.errors
    const result = {
      name: 'pg',
      goals: GOALS,
      met,
      figures,
      errors,
      setup: { seconds: SECONDS, connections: CONNECTIONS, data: 'the demo yard', postgres: 'Debian PostgreSQL 15, throwaway, fsync off, loopback' },
      pglite,
      postgres: postgresOne,
      roundRobin: { rounds, oneServer: viaProxyOne, twoServers: viaProxyTwo },
      machine: { cores: cpus().length, loadAverage1m: { before: round2(loadBefore), after: round2(loadavg()[0]!) } },
    }
    writeResult(result)
    return result
  } finally {
    if (proxy?.listening) await closeProxy(proxy)
    for (const c of children) await stop(c)
    postgres.stop()
    rmSync(dir, { recursive: true, force: true })
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) console.log(JSON.stringify(await run(), null, 2))
