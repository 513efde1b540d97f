// Starts the built server on a fresh embedded database with the demo yard, for the browser tests.
import { spawn } from 'node:child_process'
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'

const port = process.argv[2] ?? '3210'
const dataDir = mkdtempSync(path.join(tmpdir(), 'holdfast-e2e-'))
// Where a browser test finds what the server kept on disk (the local SMTP stand-in's mail/), by port.
const pointer = path.join(tmpdir(), `holdfast-e2e-${port}.json`)
writeFileSync(pointer, JSON.stringify({ dataDir }))
const child = spawn(process.execPath, ['dist/server/index.js'], {
  stdio: 'inherit',
  env: { ...process.env, PORT: port, HOST: '127.0.0.1', HOLDFAST_DATA_DIR: dataDir, HOLDFAST_DEMO: '1', HOLDFAST_SIGNIN_PER_IP: '1000', LOG_LEVEL: 'warn' },
})
const stop = () => child.kill('SIGTERM')
process.on('SIGTERM', stop)
process.on('SIGINT', stop)
child.on('exit', (code) => {
  rmSync(dataDir, { recursive: true, force: true })
  rmSync(pointer, { force: true })
  process.exit(code ?? 0)
})
