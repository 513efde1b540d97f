import type { ChildProcess } from 'node:child_process'
import { mkdirSync, writeFileSync } from 'node:fs'
import { cpus, loadavg } from 'node:os'
import path from 'node:path'

export interface BenchResult {
  name: string
  goals: Record<string, unknown>
  met: boolean
  [measure: string]: unknown
}

/** Writes bench-results/<name>.json and returns its path. */
export function writeBenchResult(name: string, result: object): string {
  const dir = path.resolve('bench-results')
  mkdirSync(dir, { recursive: true })
  const file = path.join(dir, `${name}.json`)
  writeFileSync(file, JSON.stringify({ ...result, at: new Date().toISOString() }, null, 2) + '\n')
  return file
}

export const writeResult = (result: BenchResult) => writeBenchResult(result.name, result)

const round2 = (n: number) => Math.round(n * 100) / 100

/** What the machine was doing: its cores, and the 1-minute load average before the bench and now. */
export const machine = (loadBefore: number) => ({ cores: cpus().length, loadAverage1m: { before: round2(loadBefore), after: round2(loadavg()[0]!) } })

/** Ends a server a bench started, unless it has already ended (by a signal it has no exit code, only a signal code). */
export async function stopServer(child: ChildProcess | undefined) {
  if (!child || child.exitCode !== null || child.signalCode !== null) return
  const gone = new Promise((r) => child.once('exit', r))
  child.kill('SIGTERM')
  await gone
}
