import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { spawn } from 'node:child_process'
import { sql } from 'drizzle-orm'
import { afterAll, describe, expect, it } from 'vitest'
import { openDatabase } from '../../db/client'
import { cookieSet } from '../helpers/live'
import { startServer, waitForHealth } from '../helpers/server-process'

const dataDir = mkdtempSync(path.join(tmpdir(), 'holdfast-lock-'))
const crashDir = mkdtempSync(path.join(tmpdir(), 'holdfast-lock-crash-'))
afterAll(() => {
  rmSync(dataDir, { recursive: true, force: true })
  rmSync(crashDir, { recursive: true, force: true })
})

/** A real process holding the directory open (tests/helpers/hold-data-dir.ts), as a server would. */
function holdDataDir(dir: string, value: string) {
  const child = spawn(process.execPath, ['--import', 'tsx', 'tests/helpers/hold-data-dir.ts', dir, value], { stdio: ['ignore', 'pipe', 'pipe'] })
  let out = ''
  const exited = new Promise<void>((resolve) => child.on('exit', () => resolve()))
  const opened = new Promise<void>((resolve, reject) => {
    child.stdout.on('data', (d) => {
      out += d
      if (out.includes('open')) resolve()
    })
    child.stderr.on('data', (d) => (out += d))
    void exited.then(() => reject(new Error(`the holder exited before opening:\n${out}`)))
  })
  return { child, opened, exited }
}

async function signInAndCount(port: number) {
  const base = `http://127.0.0.1:${port}`
  const first = await fetch(`${base}/api/session`)
  const cookie = cookieSet(first, 'holdfast.csrf')
  const { csrfToken } = (await first.json()) as { csrfToken: string }
  const signIn = await fetch(`${base}/api/session`, {
    method: 'POST',
    headers: { cookie, 'content-type': 'application/json', 'x-csrf-token': csrfToken },
    body: JSON.stringify({ email: 'delia@tamsincreek.example', password: 'quarry-spur-demo' }),
  })
  const session = cookieSet(signIn, 'holdfast.sid')
  const board = (await (await fetch(`${base}/api/board`, { headers: { cookie: session } })).json()) as { columns: { cards: unknown[] }[] }
  return board.columns.reduce((n, c) => n + c.cards.length, 0)
}

describe('embedded database lock', () => {
  it('a second process on the same data directory is refused and the first keeps serving its data', async () => {
    const first = startServer({ HOLDFAST_DATA_DIR: dataDir, PORT: '3291' })
    try {
      await waitForHealth(3291)
      const cards = await signInAndCount(3291)
      expect(cards).toBeGreaterThan(30)

      const second = startServer({ HOLDFAST_DATA_DIR: dataDir, PORT: '3292' })
      const code = await second.exited
      expect(code).toBe(75)
      expect(second.output()).toMatch(/in use by another Holdfast process/)

      expect(await signInAndCount(3291)).toBe(cards)
    } finally {
      await first.stop()
    }
  }, 120_000)

  it('after a clean stop the directory opens again with the same data and no second demo load', async () => {
    const again = startServer({ HOLDFAST_DATA_DIR: dataDir, PORT: '3293' })
    try {
      await waitForHealth(3293)
      expect(again.output()).not.toMatch(/Loaded the demo yard/)
      expect(await signInAndCount(3293)).toBeGreaterThan(30)
    } finally {
      await again.stop()
    }
  }, 120_000)

  it('after the holder is killed (SIGKILL), an immediate reopen takes the directory over and finds its data', async () => {
    const holder = holdDataDir(crashDir, 'written before the crash')
    await holder.opened
    holder.child.kill('SIGKILL')
    await holder.exited
    // At once: no waiting for a lock to go stale.
    const handle = await openDatabase({ kind: 'pglite', dataDir: crashDir })
    try {
      const { rows } = (await handle.db.execute(sql`select value from lock_test`)) as unknown as { rows: unknown[] }
      expect(rows).toEqual([{ value: 'written before the crash' }])
    } finally {
      await handle.close()
    }
  }, 240_000)

  it('a frozen holder (SIGSTOP) is never displaced, however long it stays frozen', async () => {
    const holder = holdDataDir(crashDir, 'written by the frozen one')
    try {
      await holder.opened
      holder.child.kill('SIGSTOP')
      // Longer than the 15 s after which the former lock (proper-lockfile, refreshed every 5 s) counted as stale.
      await new Promise((r) => setTimeout(r, 16_000))
      await expect(openDatabase({ kind: 'pglite', dataDir: crashDir })).rejects.toThrow(/in use by another Holdfast process \(process \d+ on /)
    } finally {
      holder.child.kill('SIGCONT')
      holder.child.kill('SIGTERM')
      await holder.exited
    }
  }, 240_000)
})
