import type { DemoLoaded } from './demo/index'

export interface StartupFacts {
  url: string
  /** Where the records live: the embedded database's folder, or "PostgreSQL". */
  database: string
  filesDir: string
  historyKeyFile: string
  demo: DemoLoaded | null
  readyMs: number
}

/**
 * What a person at a terminal needs once the server is up: the address to open, how to sign in to the
 * demo, and where the data lives (what to back up). Plain lines, no log noise; a log collector gets
 * the same facts as JSON log lines instead.
 */
export function startupBanner(f: StartupFacts): string {
  const lines = [
    '',
    `  Holdfast is ready — open ${f.url}   (started in ${(f.readyMs / 1000).toFixed(1)} s)`,
    '',
  ]
  if (f.demo) {
    lines.push(`  Demo yard sign-ins (password: ${f.demo.password})`)
    const width = Math.max(...f.demo.users.map((u) => u.role.length))
    for (const u of f.demo.users) lines.push(`    ${u.role.padEnd(width)}  ${u.email}`)
    lines.push('')
  }
  lines.push(
    '  Data (back these up together; keep the history key apart from the database)',
    `    records      ${f.database}`,
    `    files        ${f.filesDir}`,
    `    history key  ${f.historyKeyFile}`,
    '',
    '  Stop with Ctrl+C.',
    '',
  )
  return lines.join('\n')
}
