import { mkdirSync, writeFileSync } from 'node:fs'
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
