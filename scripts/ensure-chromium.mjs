// The browser tests drive Debian's Chromium; test tools cannot download browsers here.
import { execSync } from 'node:child_process'
import { existsSync } from 'node:fs'

const bin = process.env.HOLDFAST_CHROMIUM ?? '/usr/bin/chromium'
if (!existsSync(bin)) {
  const root = process.getuid?.() === 0
  if (!root) {
    console.error(`Chromium was not found at ${bin}. Install Debian's package as root: apt-get install -y chromium (or set HOLDFAST_CHROMIUM to a Chromium binary).`)
    process.exit(1)
  }
  console.log('Installing Debian chromium for the browser tests (about a minute)…')
  execSync('apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium poppler-utils', { stdio: 'inherit' })
}
