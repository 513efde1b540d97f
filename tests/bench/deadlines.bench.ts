import { spawn } from 'node:child_process'
import { mkdtempSync, rmSync } from 'node:fs'
import { loadavg, tmpdir } from 'node:os'
import path from 'node:path'
import { sql } from 'drizzle-orm'
import { openDatabase } from '@db/client'
import { DEADLINE_KINDS } from '@shared/schemas/deadlines'
import { summarizeVehicles } from '../../server/charges/index'
import { activeVehicles, yardDeadlines } from '../../server/deadlines/index'
import { seedBigYard } from './board-seed'
import { machine, writeResult, type BenchResult } from './results'

// The Deadlines page works out every clock of every vehicle on the board: it must cost no more than
// the board's own summaries of the same vehicles (the bill and the next date), which the board
// already pays for every minute. A ratio, so a busy machine slows both sides alike.
const GOALS = { activeCards: 2000, closedVehicles: 50_000, ratioToBoardSummaries: 1.25 }
const PORT = 3394
const RUNS = 5

async function median(work: () => Promise<unknown>): Promise<number> {
  await work()
  const times: number[] = []
  for (let i = 0; i < RUNS; i++) {
    const started = performance.now()
    await work()
    times.push(performance.now() - started)
  }
  return Math.round(times.sort((a, b) => a - b)[Math.floor(RUNS / 2)]! * 10) / 10
}

/** Loads the demo through the built server once, so the data directory holds what a yard would. */
async function demoDataDir(dataDir: string) {
  const child = spawn(process.execPath, ['dist/server/index.js'], {
    env: { ...process.env, HOST: '127.0.0.1', LOG_LEVEL: 'warn', PORT: String(PORT), HOLDFAST_DATA_DIR: dataDir, HOLDFAST_DEMO: '1' },
    stdio: ['ignore', 'ignore', 'inherit'],
  })
  try {
    for (let i = 0; i < 600; i++) {
      if (await fetch(`http://127.0.0.1:${PORT}/api/health`).then((r) => r.ok, () => false)) return
      await new Promise((r) => setTimeout(r, 100))
    }
    throw new Error('the server did not start')
  } finally {
    child.kill('SIGTERM')
    await new Promise((r) => child.once('exit', r))
  }
}

export async function run(): Promise<BenchResult> {
  const dataDir = mkdtempSync(path.join(tmpdir(), 'holdfast-deadlines-bench-'))
  const loadBefore = loadavg()[0]!
  try {
    await demoDataDir(dataDir)
    const counts = await seedBigYard(dataDir, { active: GOALS.activeCards, closed: GOALS.closedVehicles })
    const handle = await openDatabase({ kind: 'pglite', dataDir })
    try {
      const db = handle.db
      const [yard] = ((await db.execute(sql`select id, time_zone as "timeZone", rule_set_id as "ruleSetId" from yards limit 1`)) as unknown as { rows: { id: string; timeZone: string; ruleSetId: string | null }[] }).rows
      const rows = await activeVehicles(db, yard!.id)
      const list = await yardDeadlines(db, yard!, DEADLINE_KINDS)
      // Both sides read the vehicles from the database and work out every summary or clock.
      const boardSummariesMs = await median(async () => summarizeVehicles(db, yard!, await activeVehicles(db, yard!.id)))
      const deadlinesMs = await median(() => yardDeadlines(db, yard!, DEADLINE_KINDS))
      const ratio = Math.round((deadlinesMs / boardSummariesMs) * 100) / 100
      const result: BenchResult = {
        name: 'deadlines',
        goals: GOALS,
        met: rows.length >= GOALS.activeCards && ratio <= GOALS.ratioToBoardSummaries,
        vehicles: counts,
        activeVehicles: rows.length,
        entries: list.entries.length,
        byKind: Object.fromEntries(DEADLINE_KINDS.map((k) => [k, list.entries.filter((e) => e.kind === k).length])),
        medianMs: { deadlines: deadlinesMs, boardSummaries: boardSummariesMs },
        ratioToBoardSummaries: ratio,
        machine: machine(loadBefore),
      }
      writeResult(result)
      return result
    } finally {
      await handle.close()
    }
  } finally {
    rmSync(dataDir, { recursive: true, force: true })
  }
}
