import { spawn, type ChildProcess } from 'node:child_process'

export interface ServerProcess {
  child: ChildProcess
  output: () => string
  exited: Promise<number | null>
  stop: () => Promise<void>
}

/** Runs server/index.ts in its own process, as `npm start` would, with the given environment. */
export function startServer(env: Record<string, string>): ServerProcess {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    env: { ...process.env, HOST: '127.0.0.1', LOG_LEVEL: 'info', HOLDFAST_CLIENT_DIR: '/nonexistent', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  let out = ''
  child.stdout!.on('data', (d) => (out += d))
  child.stderr!.on('data', (d) => (out += d))
  const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)))
  return {
    child,
    output: () => out,
    exited,
    stop: async () => {
      if (child.exitCode === null) child.kill('SIGTERM')
      await exited
    },
  }
}

export async function waitForHealth(port: number, timeoutMs = 60_000): Promise<void> {
  const until = Date.now() + timeoutMs
  while (Date.now() < until) {
    const ok = await fetch(`http://127.0.0.1:${port}/api/health`).then((r) => r.ok, () => false)
    if (ok) return
    await new Promise((r) => setTimeout(r, 100))
  }
  throw new Error(`server on ${port} did not become healthy in ${timeoutMs} ms`)
}
