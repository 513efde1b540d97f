import { randomUUID } from 'node:crypto'
import { spawn, type ChildProcess } from 'node:child_process'
import { mkdtempSync, rmSync } from 'node:fs'
import { loadavg, tmpdir } from 'node:os'
import path from 'node:path'
import { pathToFileURL } from 'node:url'
import { bundleServer } from '../soak/crash-rounds'
import { anotherVehicle, towInBody } from '../helpers/tow-in'
import { HttpClient, summary } from './http-client'
import { costPerRequest } from './per-request'
import { machine, stopServer, writeResult, type BenchResult } from './results'

// Issue 13, "Load": 50 simulated staff for 60 s on a mixed workload (board reads, tow-ins, moves, quotes,
// payments) against one server on the embedded database, while 500 board streams are held open.
// `queriesPerRequest`: at most this many statements per operation, alone (tests/bench/per-request.ts).
// Counts do not move with the machine's load, so one that grows is work added, not noise. Measured
// before they were folded (main a28b50b): board 2, tow-in 19, move 17, quote 3, payment 26.
const QUERIES_PER_REQUEST: Record<string, number> = { board: 2, 'tow-in': 14, move: 12, quote: 3, payment: 16 }
const GOALS = { staff: 50, seconds: Number(process.env.HOLDFAST_LOAD_SECONDS ?? 60), streams: 500, errors: 0, p95Ms: 150, boardP95RatioWithStreams: 1.5, queriesPerRequest: QUERIES_PER_REQUEST }
const PORT = 3394
const base = `http://127.0.0.1:${PORT}`
// The demo yard's manager and office clerk (server/demo): 40 at the desk and on the trucks, 10 at the counter.
const MANAGER = { email: 'ruben@tamsincreek.example', password: 'quarry-spur-demo' }
const OFFICE = { email: 'priya@tamsincreek.example', password: 'quarry-spur-demo' }
const COUNTER_STAFF = 10
// Between two actions a person reads the screen: 0.5–2 s (an assumption, not a measured figure).
const think = () => new Promise((r) => setTimeout(r, 500 + Math.random() * 1500))

/** A person at a desk of the demo yard, signed in (the yard's manager unless said otherwise). */
const staff = (who = MANAGER) => new HttpClient(base).signIn(who)

async function boardOneAtATime(s: HttpClient, seconds: number) {
  const times: number[] = []
  const until = performance.now() + seconds * 1000
  while (performance.now() < until) {
    const t = performance.now()
    await s.call('GET', '/api/board')
    times.push(performance.now() - t)
  }
  return summary(times)
}

type Record_ = (op: string, ms: number, ok: boolean, detail?: string) => void
const towed: string[] = []

function timer(s: HttpClient, record: Record_) {
  return async (op: string, method: string, url: string, body?: unknown) => {
    const t = performance.now()
    const res = await s.call(method, url, body).catch((err: Error) => ({ status: 0, body: { error: `${err.message} ${String((err.cause as { code?: string } | undefined)?.code ?? "")}` } as Record<string, unknown> }))
    record(op, performance.now() - t, res.status >= 200 && res.status < 300, res.status >= 300 || res.status === 0 ? `${op} ${res.status} ${JSON.stringify(res.body).slice(0, 160)}` : undefined)
    await think()
    return res
  }
}

/** A dispatcher's loop: the board, a tow-in, its move to teardown, a storage quote. */
async function desk(s: HttpClient, until: number, record: Record_) {
  const timed = timer(s, record)
  while (performance.now() < until) {
    await timed('board', 'GET', '/api/board')
    const res = await timed('tow-in', 'POST', '/api/vehicles', towInBody(s.userId, anotherVehicle))
    if (res.status === 201) {
      const id = String(res.body.id)
      const moved = await timed('move', 'POST', `/api/vehicles/${id}/moves`, { to: 'teardown', version: Number(res.body.version ?? 1) })
      // Offered to the counter only once the dispatcher is done with it: a payment bumps the version, and
      // a move sent from the version before it would be refused (409), as a real board would be.
      if (moved.status === 200) towed.push(id)
    }
    await timed('quote', 'POST', '/api/quotes/storage', { ruleSetId: 'california-sample', stay: { arrivedAt: '2026-03-01T12:00:00Z', vehicleClass: 'standard' }, asOf: '2026-03-04T12:00:00Z' })
  }
}

/** A counter clerk's loop: the board, then a small cash payment on a vehicle towed in and moved during the run. */
async function counter(s: HttpClient, until: number, record: Record_) {
  const timed = timer(s, record)
  while (performance.now() < until) {
    await timed('board', 'GET', '/api/board')
    const id = towed[Math.floor(Math.random() * towed.length)]
    if (id) await timed('payment', 'POST', `/api/vehicles/${id}/payments`, { idempotencyKey: randomUUID(), method: 'cash', amountCents: 100, tenderedCents: 100 })
  }
}

export async function run(): Promise<BenchResult> {
  const loadBefore = loadavg()[0]!
  const dataDir = mkdtempSync(path.join(tmpdir(), 'holdfast-load-bench-'))
  let server: ChildProcess | undefined
  const streams: AbortController[] = []
  try {
    // Each operation alone first, in this process, on the same port before the server takes it.
    const perRequest = await costPerRequest(PORT)
    const queriesMet = Object.entries(QUERIES_PER_REQUEST).every(([op, most]) => (perRequest[op]?.queries ?? Infinity) <= most)
    const entry = await bundleServer()
    // HOLDFAST_LOAD_NODE_ARGS passes flags to the server's node, such as `--cpu-prof --cpu-prof-dir=<dir>` for a profile of the run.
    const nodeArgs = (process.env.HOLDFAST_LOAD_NODE_ARGS ?? '').split(' ').filter(Boolean)
    server = spawn(process.execPath, [...nodeArgs, entry], {
      env: { ...process.env, HOLDFAST_DATA_DIR: dataDir, PORT: String(PORT), HOST: '127.0.0.1', LOG_LEVEL: 'warn', HOLDFAST_DEMO: '1', HOLDFAST_SIGNIN_PER_IP: '100000' },
      stdio: ['ignore', 'ignore', 'inherit'],
    })
    for (let i = 0; ; i++) {
      if (await fetch(`${base}/api/health`).then((r) => r.ok, () => false)) break
      if (i > 1200) throw new Error('the server did not start')
      await new Promise((r) => setTimeout(r, 100))
    }
    const people: HttpClient[] = []
    for (let i = 0; i < GOALS.staff; i++) people.push(await staff(i < COUNTER_STAFF ? OFFICE : MANAGER))
    const reader = people.at(-1)!
    const boardBefore = await boardOneAtATime(reader, 8)

    // 500 live board streams, five to a session (the cap), each drained as events arrive.
    let streamsOpen = 0
    const streamSessions: HttpClient[] = []
    for (let i = 0; i < GOALS.streams / 5; i++) streamSessions.push(await staff())
    await Promise.all(
      Array.from({ length: GOALS.streams }, async (_, i) => {
        const abort = new AbortController()
        streams.push(abort)
        const s = streamSessions[Math.floor(i / 5)]!
        const res = await fetch(`${base}/api/board/events`, { headers: { cookie: s.cookie, accept: 'text/event-stream' }, signal: abort.signal })
        if (res.status === 200) streamsOpen++
        void (async () => {
          for await (const _chunk of res.body ?? []) void _chunk
        })().catch(() => undefined)
      }),
    )
    const boardWithStreams = await boardOneAtATime(reader, 8)

    // The mixed workload, streams still open.
    const times = new Map<string, number[]>()
    const failedBy = new Map<string, number>()
    const all: number[] = []
    let errors = 0
    const firstErrors: string[] = []
    const until = performance.now() + GOALS.seconds * 1000
    await Promise.all(
      people.map((s, i) =>
        (i < COUNTER_STAFF ? counter : desk)(s, until, (op, ms, ok, detail) => {
          times.set(op, [...(times.get(op) ?? []), ms])
          all.push(ms)
          if (!ok) {
            errors++
            failedBy.set(op, (failedBy.get(op) ?? 0) + 1)
            if (detail && firstErrors.length < 5) firstErrors.push(detail)
          }
        }),
      ),
    )
    const overall = summary(all)
    const byOperation = Object.fromEntries([...times].map(([op, t]) => [op, { ...summary(t), errors: failedBy.get(op) ?? 0 }]))
    const streamRatio = Number((boardWithStreams.p95Ms / Math.max(1, boardBefore.p95Ms)).toFixed(2))
    const met = errors === GOALS.errors && overall.p95Ms <= GOALS.p95Ms && streamsOpen === GOALS.streams && streamRatio <= GOALS.boardP95RatioWithStreams && queriesMet
    const result: BenchResult = {
      name: 'load',
      goals: GOALS,
      met,
      workload: `${GOALS.staff - COUNTER_STAFF} dispatchers (board, tow-in, move, quote) and ${COUNTER_STAFF} counter clerks (board, payment), each waiting 0.5–2 s between actions`,
      requests: overall.count,
      requestsPerSecond: Math.round(overall.count / GOALS.seconds),
      errors,
      firstErrors,
      overall,
      byOperation,
      perRequest,
      streams: { open: streamsOpen, boardOneAtATimeBefore: boardBefore, boardOneAtATimeWithStreams: boardWithStreams, p95Ratio: streamRatio },
      machine: machine(loadBefore),
    }
    writeResult(result)
    return result
  } finally {
    for (const a of streams) a.abort()
    await stopServer(server)
    rmSync(dataDir, { recursive: true, force: true })
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) console.log(JSON.stringify(await run(), null, 2))
