import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { afterAll, describe, expect, it } from 'vitest'
import { cookieSet } from '../helpers/live'
import { startServer, waitForHealth } from '../helpers/server-process'

const dataDir = mkdtempSync(path.join(tmpdir(), 'holdfast-lock-'))
afterAll(() => rmSync(dataDir, { recursive: true, force: true }))

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
})
