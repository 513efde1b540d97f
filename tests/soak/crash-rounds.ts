import { spawn, type ChildProcess } from 'node:child_process'
import { mkdtempSync, readFileSync, rmSync } from 'node:fs'
import { loadavg, tmpdir } from 'node:os'
import path from 'node:path'
import { build } from 'esbuild'
import fc from 'fast-check'
import { openDatabase } from '@db/client'
import { HttpClient } from '../bench/http-client'
import { makeStaff } from '../helpers/factories'
import { anotherVehicle, sampleRuleSet, towInBody } from '../helpers/tow-in'

/**
 * Issue 13, "Crashes": the built server on an embedded data directory, a writer logging tow-ins one
 * after another and counting each 201 as acknowledged, and a kill -9 at a random moment (seeded, so a
 * failing round can be replayed). After each kill the server is started again at once; the time from
 * the kill to a healthy answer is the restart time. Every acknowledged vehicle must be there and its
 * history must verify.
 */
export interface CrashReport {
  rounds: number
  seed: number
  acknowledged: number
  lost: string[]
  /** Vehicles whose history did not verify, with the problems. */
  unverified: string[]
  restartSeconds: { median: number; max: number; all: number[] }
  /**
   * The CPU the restarted process spent until its first healthy answer. On a loaded machine the wall
   * time above mostly measures the wait for a core; on an idle one the two are about equal, since the
   * start-up runs on one thread.
   */
  restartCpuSeconds: { median: number; max: number; all: number[] }
  /** The machine's 1-minute load average at each restart, for reading the wall times. */
  loadAverage: number[]
}

/** Linux: user + system CPU seconds of a process so far (/proc/<pid>/stat fields 14 and 15, at 100 ticks a second). */
function cpuSeconds(pid: number | undefined): number {
  if (pid === undefined) return Number.NaN
  const stat = readFileSync(`/proc/${pid}/stat`, 'utf8')
  const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ')
  return (Number(fields[11]) + Number(fields[12])) / 100
}

const root = path.resolve(import.meta.dirname, '../..')

/** The server bundled as `npm run build:server` does, into a folder of node_modules so packages resolve. */
export async function bundleServer(): Promise<string> {
  const outdir = path.join(root, 'node_modules/.cache/holdfast-crash')
  await build({
    entryPoints: [path.join(root, 'server/index.ts')],
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    packages: 'external',
    outdir,
    tsconfig: path.join(root, 'tsconfig.node.json'),
    logLevel: 'warning',
  })
  return path.join(outdir, 'index.js')
}

export async function crashRounds(rounds: number, seed: number, port: number): Promise<CrashReport> {
  const dir = mkdtempSync(path.join(tmpdir(), 'holdfast-crash-'))
  const dataDir = path.join(dir, 'data')
  const random = fc.sample(fc.integer({ min: 150, max: 1500 }), { seed, numRuns: rounds })
  let child: ChildProcess | undefined
  try {
    const entry = await bundleServer()
    const handle = await openDatabase({ kind: 'pglite', dataDir: dataDir }, path.join(root, 'db/migrations'))
    await handle.migrate()
    await sampleRuleSet(handle.db)
    const staff = await makeStaff(handle.db)
    await handle.close()

    const base = `http://127.0.0.1:${port}`
    const start = () =>
      spawn(process.execPath, [entry], {
        cwd: root,
        env: { ...process.env, HOLDFAST_DATA_DIR: dataDir, PORT: String(port), HOST: '127.0.0.1', LOG_LEVEL: 'warn', HOLDFAST_DEMO: '0', HOLDFAST_SIGNIN_PER_ACCOUNT: '1000' },
        stdio: ['ignore', 'ignore', 'inherit'],
      })
    const healthy = async (since: number) => {
      for (;;) {
        if (await fetch(`${base}/api/health`).then((r) => r.ok, () => false)) return (performance.now() - since) / 1000
        if (child?.exitCode !== null) throw new Error(`the server exited with ${child?.exitCode}`)
        if (performance.now() - since > 60_000) throw new Error('not healthy 60 s after start')
        await new Promise((r) => setTimeout(r, 20))
      }
    }
    const acknowledged: string[] = []
    const restarts: number[] = []
    const restartCpu: number[] = []
    const loads: number[] = []
    const lost: string[] = []
    const unverified: string[] = []
    let killedAt = performance.now()
    child = start()
    await healthy(killedAt)
    for (let round = 0; round <= rounds; round++) {
      const client = await new HttpClient(base).signIn({ email: staff.dispatcher.email, password: staff.dispatcher.password })
      // What was acknowledged before the kill is all there, and each history verifies.
      for (const id of acknowledged.slice(-40)) {
        const check = await client.call('GET', `/api/vehicles/${id}/history/verify`)
        if (check.status === 404) lost.push(id)
        else if (check.status !== 200 || check.body.ok !== true) unverified.push(`${id}: ${JSON.stringify(check.body)}`)
      }
      if (round === rounds) break
      // The writer: one tow-in after another, each counted once its 201 has arrived.
      let writing = true
      const writer = (async () => {
        while (writing) {
          const res = await client.call('POST', '/api/vehicles', towInBody(staff.dispatcher.id, anotherVehicle)).catch(() => undefined)
          if (!res) return
          if (res.status === 201) acknowledged.push(String(res.body.id))
          else throw new Error(`tow-in answered ${res.status}: ${JSON.stringify(res.body)}`)
        }
      })()
      await new Promise((r) => setTimeout(r, random[round]))
      // Killed while the writer is busy: a tow-in is usually in flight, unacknowledged.
      const dead = new Promise((r) => child!.once('exit', r))
      child.kill('SIGKILL')
      killedAt = performance.now()
      writing = false
      await dead
      await writer
      child = start()
      restarts.push(await healthy(killedAt))
      restartCpu.push(cpuSeconds(child.pid))
      loads.push(loadavg()[0]!)
    }
    // At the end, every vehicle ever acknowledged, not only the last rounds'.
    const client = await new HttpClient(base).signIn({ email: staff.dispatcher.email, password: staff.dispatcher.password })
    for (const id of acknowledged) {
      const res = await client.call('GET', `/api/vehicles/${id}/history/verify`)
      if (res.status === 404 && !lost.includes(id)) lost.push(id)
    }
    const round2 = (n: number) => Number(n.toFixed(2))
    const figures = (all: number[]) => {
      const sorted = [...all].sort((a, b) => a - b)
      return { median: round2(sorted[Math.floor(sorted.length / 2)] ?? 0), max: round2(sorted.at(-1) ?? 0), all: all.map(round2) }
    }
    return {
      rounds,
      seed,
      acknowledged: acknowledged.length,
      lost,
      unverified,
      restartSeconds: figures(restarts),
      restartCpuSeconds: figures(restartCpu),
      loadAverage: loads.map(round2),
    }
  } finally {
    if (child && child.exitCode === null) {
      const gone = new Promise((r) => child!.once('exit', r))
      child.kill('SIGTERM')
      await gone
    }
    rmSync(dir, { recursive: true, force: true })
  }
}
