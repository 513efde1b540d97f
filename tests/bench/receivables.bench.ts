import { spawn, type ChildProcess } from 'node:child_process'
import { mkdtempSync, readFileSync, rmSync } from 'node:fs'
import { cpus, loadavg, tmpdir } from 'node:os'
import path from 'node:path'
import { seedBigYard } from './board-seed'
import { writeResult, type BenchResult } from './results'

// Issue 12, "Figures": receivables and aged inventory over 50,000 vehicles, 2,000 of them on the lot.
// The first page within 300 ms at the 95th percentile, the CSV of every row within 3 s, and the
// server's memory bounded while it streams the CSV (its peak resident size grows by little more than
// the file, measured from /proc).
const GOALS = { vehicles: 50_000, onTheLot: 2000, firstPageP95Ms: 300, csvMs: 3000, csvRssGrowthMb: 64 }
const PORT = 3396
const base = `http://127.0.0.1:${PORT}`
const RUNS = 40

function start(env: Record<string, string>): ChildProcess {
  return spawn(process.execPath, ['dist/server/index.js'], { env: { ...process.env, HOST: '127.0.0.1', LOG_LEVEL: 'warn', ...env }, stdio: ['ignore', 'ignore', 'inherit'] })
}

async function healthy() {
  for (let i = 0; i < 600; i++) {
    if (await fetch(`${base}/api/health`).then((r) => r.ok, () => false)) return
    await new Promise((r) => setTimeout(r, 100))
  }
  throw new Error('the server did not answer')
}

async function stop(child: ChildProcess) {
  if (child.exitCode !== null || child.signalCode !== null) return
  child.kill('SIGTERM')
  await new Promise((r) => child.once('exit', r))
}

async function signIn(email: string): Promise<string> {
  const first = await fetch(`${base}/api/session`)
  const cookie = first.headers.getSetCookie().find((c) => c.startsWith('holdfast.csrf='))!.split(';')[0]!
  const { csrfToken } = (await first.json()) as { csrfToken: string }
  const res = await fetch(`${base}/api/session`, { method: 'POST', headers: { cookie, 'content-type': 'application/json', 'x-csrf-token': csrfToken }, body: JSON.stringify({ email, password: 'quarry-spur-demo' }) })
  return res.headers.getSetCookie().find((c) => c.startsWith('holdfast.sid='))!.split(';')[0]!
}

/** Resident memory of a process, now and at its peak, in MB (Linux /proc). */
function memoryOf(pid: number) {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8')
  const kb = (key: string) => Number(/(\d+) kB/.exec(status.split('\n').find((l) => l.startsWith(key)) ?? '')?.[1] ?? NaN)
  return { rssMb: Math.round(kb('VmRSS:') / 1024), peakMb: Math.round(kb('VmHWM:') / 1024) }
}

async function timed(url: string, cookie: string) {
  const times: number[] = []
  let body = ''
  for (let i = 0; i < RUNS; i++) {
    const started = performance.now()
    const res = await fetch(url, { headers: { cookie } })
    body = await res.text()
    if (!res.ok) throw new Error(`${url}: ${res.status} ${body.slice(0, 200)}`)
    times.push(performance.now() - started)
  }
  times.sort((a, b) => a - b)
  const at = (q: number) => Math.round(times[Math.min(times.length - 1, Math.floor(times.length * q))]!)
  return { p50Ms: at(0.5), p95Ms: at(0.95), maxMs: Math.round(times.at(-1)!), body }
}

export async function run(): Promise<BenchResult> {
  const loadBefore = loadavg()[0]!
  const dataDir = mkdtempSync(path.join(tmpdir(), 'holdfast-receivables-bench-'))
  const env = { HOLDFAST_DATA_DIR: dataDir, PORT: String(PORT), HOLDFAST_DEMO: '1', HOLDFAST_SIGNIN_PER_IP: '1000' }
  let server: ChildProcess | undefined
  try {
    const first = start(env)
    await healthy()
    await stop(first)
    const seeded = await seedBigYard(dataDir, { active: GOALS.onTheLot, closed: GOALS.vehicles - GOALS.onTheLot })
    server = start(env)
    await healthy()
    const cookie = await signIn('priya@tamsincreek.example')
    // The first request builds the board's snapshot of the lot (the board's own cold start, measured by
    // \`npm run bench -- board\`); every report after it reads that snapshot.
    const coldStarted = performance.now()
    await fetch(`${base}/api/reports/receivables`, { headers: { cookie } }).then((r) => r.text())
    const coldMs = Math.round(performance.now() - coldStarted)

    const page = await timed(`${base}/api/reports/receivables?page=1&pageSize=50`, cookie)
    const { totals } = JSON.parse(page.body) as { totals: { count: number } }
    const sorted = await timed(`${base}/api/reports/receivables?page=3&pageSize=50&sort=nextDeadline&order=asc`, cookie)
    const aged = await timed(`${base}/api/reports/aged`, cookie)

    const before = memoryOf(server.pid!)
    const started = performance.now()
    const res = await fetch(`${base}/api/reports/receivables.csv`, { headers: { cookie } })
    // Read as a stream, as a browser saving the download does; count the bytes and lines.
    let bytes = 0
    let lines = 0
    for await (const chunk of res.body!) {
      bytes += (chunk as Uint8Array).length
      for (const b of chunk as Uint8Array) if (b === 10) lines++
    }
    const csvMs = Math.round(performance.now() - started)
    const after = memoryOf(server.pid!)
    const csvRssGrowthMb = Math.max(0, after.peakMb - before.peakMb)

    const met = totals.count > 0 && page.p95Ms <= GOALS.firstPageP95Ms && aged.p95Ms <= GOALS.firstPageP95Ms && csvMs <= GOALS.csvMs && csvRssGrowthMb <= GOALS.csvRssGrowthMb
    const result: BenchResult = {
      name: 'receivables',
      goals: GOALS,
      met,
      seeded,
      receivableRows: totals.count,
      coldFirstRequestMs: coldMs,
      firstPage: { p50Ms: page.p50Ms, p95Ms: page.p95Ms, maxMs: page.maxMs, runs: RUNS },
      thirdPageByNextDeadline: { p50Ms: sorted.p50Ms, p95Ms: sorted.p95Ms, maxMs: sorted.maxMs, runs: RUNS },
      agedInventory: { p50Ms: aged.p50Ms, p95Ms: aged.p95Ms, maxMs: aged.maxMs, runs: RUNS },
      csv: { ms: csvMs, bytes, lines },
      serverMemory: { before, after, csvRssGrowthMb },
      machine: { cores: cpus().length, loadAverage1m: { before: Math.round(loadBefore * 100) / 100, after: Math.round(loadavg()[0]! * 100) / 100 } },
    }
    writeResult(result)
    return result
  } finally {
    if (server) await stop(server)
    rmSync(dataDir, { recursive: true, force: true })
  }
}
