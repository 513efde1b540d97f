import { existsSync, mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { spawn } from 'node:child_process'
import { writeResult, type BenchResult } from './results'

const GOALS = { freshSeconds: 6, warmSeconds: 2 }

async function timeToHealthy(dataDir: string, port: number): Promise<number> {
  const started = performance.now()
  const child = spawn(process.execPath, ['dist/server/index.js'], {
    env: { ...process.env, HOLDFAST_DATA_DIR: dataDir, PORT: String(port), HOST: '127.0.0.1', LOG_LEVEL: 'warn' },
    stdio: 'ignore',
  })
  try {
    for (;;) {
      const ok = await fetch(`http://127.0.0.1:${port}/api/health`).then((r) => r.ok, () => false)
      if (ok) return (performance.now() - started) / 1000
      if (child.exitCode !== null) throw new Error(`server exited with ${child.exitCode}`)
      if (performance.now() - started > 60_000) throw new Error('server not healthy after 60 s')
      await new Promise((r) => setTimeout(r, 25))
    }
  } finally {
    child.kill('SIGTERM')
    await new Promise((r) => child.once('exit', r))
  }
}

/** Start-up of the built server: a fresh data directory (migrate + demo load) and a warm one. */
export async function run(): Promise<BenchResult> {
  if (!existsSync('dist/server/index.js')) throw new Error('Build first: npm run build')
  const dataDir = mkdtempSync(path.join(tmpdir(), 'holdfast-bench-'))
  try {
    const fresh = await timeToHealthy(dataDir, 3391)
    const warm: number[] = []
    for (let i = 0; i < 3; i++) warm.push(await timeToHealthy(dataDir, 3391))
    const warmMedian = warm.sort((a, b) => a - b)[1]!
    return {
      name: 'startup',
      freshSeconds: Number(fresh.toFixed(2)),
      warmSeconds: Number(warmMedian.toFixed(2)),
      warmRuns: warm.map((w) => Number(w.toFixed(2))),
      goals: GOALS,
      met: fresh <= GOALS.freshSeconds && warmMedian <= GOALS.warmSeconds,
    }
  } finally {
    rmSync(dataDir, { recursive: true, force: true })
  }
}

if (import.meta.url === `file://${process.argv[1]}`) console.log(writeResult(await run()))
