import http from 'node:http'
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { afterAll, expect, it } from 'vitest'
import { openDatabase } from '@db/client'
import { makeStaff } from '../helpers/factories'
import { startServer, waitForHealth, type ServerProcess } from '../helpers/server-process'

// Issue 15, "Operations": SIGTERM drains the server. The port is this test's own (HOLDFAST_SHUTDOWN_PORT).
const port = Number(process.env.HOLDFAST_SHUTDOWN_PORT ?? 5212)
const base = `http://127.0.0.1:${port}`
const dataDir = mkdtempSync(path.join(tmpdir(), 'holdfast-shutdown-'))
let server: ServerProcess | undefined
afterAll(async () => {
  await server?.stop()
  rmSync(dataDir, { recursive: true, force: true })
  rmSync(`${dataDir}.history-key`, { force: true })
})

/** Signs in with fetch and returns the cookie and CSRF token a browser tab would hold. */
async function signIn(user: { email: string; password: string }) {
  const cookies = new Map<string, string>()
  const keep = (res: Response) => {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';')
      const at = pair!.indexOf('=')
      cookies.set(pair!.slice(0, at), pair!.slice(at + 1))
    }
  }
  const cookie = () => [...cookies].map(([k, v]) => `${k}=${v}`).join('; ')
  const first = await fetch(`${base}/api/session`)
  keep(first)
  const anon = (await first.json()) as { csrfToken: string }
  const res = await fetch(`${base}/api/session`, { method: 'POST', headers: { cookie: cookie(), 'content-type': 'application/json', 'x-csrf-token': anon.csrfToken }, body: JSON.stringify(user) })
  keep(res)
  expect(res.status).toBe(200)
  return { cookie: cookie(), csrf: ((await res.json()) as { csrfToken: string }).csrfToken }
}

it('on SIGTERM: the open request finishes, the board stream is ended, no new connection is taken, the process exits 0', { timeout: 120_000 }, async () => {
  const handle = await openDatabase({ kind: 'pglite', dataDir }, path.resolve('db/migrations'))
  await handle.migrate()
  const staff = await makeStaff(handle.db)
  await handle.close()
  server = startServer({ HOLDFAST_DATA_DIR: dataDir, PORT: String(port), HOLDFAST_DEMO: '0', HOLDFAST_SHUTDOWN_SECONDS: '30' })
  await waitForHealth(port)
  const tab = await signIn(staff.dispatcher)

  // A board stream, open until the server ends it.
  const stream = await new Promise<http.IncomingMessage>((resolve, reject) =>
    http.get(`${base}/api/board/events`, { headers: { cookie: tab.cookie, accept: 'text/event-stream' } }, resolve).on('error', reject),
  )
  expect(stream.statusCode).toBe(200)
  let received = ''
  stream.on('data', (d) => (received += d))
  const streamEnded = new Promise<void>((resolve) => stream.on('end', resolve))

  // A slow request: its headers are in (the server's 100 Continue says so), half its body is not.
  const body = JSON.stringify({ locale: 'es' })
  const slow = http.request(`${base}/api/session/locale`, {
    method: 'PUT',
    headers: { cookie: tab.cookie, 'x-csrf-token': tab.csrf, 'content-type': 'application/json', 'content-length': Buffer.byteLength(body), expect: '100-continue' },
  })
  const answered = new Promise<{ status: number; text: string }>((resolve, reject) => {
    slow.on('response', (res) => {
      let text = ''
      res.on('data', (d) => (text += d))
      res.on('end', () => resolve({ status: res.statusCode!, text }))
    })
    slow.on('error', reject)
  })
  await new Promise<void>((resolve) => slow.once('continue', resolve))
  slow.write(body.slice(0, 5))

  server.child.kill('SIGTERM')
  // The stream is ended by the server (the browser's EventSource then reconnects, through the proxy, elsewhere).
  await streamEnded
  expect(received).toMatch(/^retry: \d+/)
  // It takes no new connection; the held request is still being served.
  await expect(fetch(`${base}/api/health/live`)).rejects.toThrow()
  expect(server.child.exitCode).toBeNull()

  slow.end(body.slice(5))
  const done = await answered
  expect(done.status, done.text).toBe(200)
  expect(JSON.parse(done.text)).toMatchObject({ user: { locale: 'es' } })
  expect(await server.exited).toBe(0)
  expect(server.output()).toMatch(/shutdown: done/)
  expect(server.output()).not.toMatch(/closing their connections/)
})
