// The tests need three things from Debian that npm cannot provide: Chromium for the browser tests,
// a PostgreSQL 15 server for the tests that only real PostgreSQL can run (races, LISTEN/NOTIFY),
// and pdftoppm to render PDFs. Installed in one apt run when missing and running as root.
import { execSync } from 'node:child_process'
import { existsSync } from 'node:fs'

const needs = [
  { pkg: 'chromium', path: process.env.HOLDFAST_CHROMIUM ?? '/usr/bin/chromium' },
  { pkg: 'postgresql', path: '/usr/lib/postgresql/15/bin/initdb' },
  { pkg: 'poppler-utils', path: '/usr/bin/pdftoppm' },
]
const missing = needs.filter((n) => !existsSync(n.path))
if (missing.length > 0) {
  const list = missing.map((n) => n.pkg).join(' ')
  if (process.getuid?.() !== 0) {
    console.error(`Missing Debian packages for the tests: ${list}. Install them as root: apt-get install -y ${list}`)
    process.exit(1)
  }
  console.log(`Installing Debian packages for the tests: ${list} (a minute or two)…`)
  execSync(`apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq ${list}`, { stdio: 'inherit' })
}
