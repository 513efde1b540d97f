import { execFileSync, spawnSync } from 'node:child_process'
import { chmodSync, mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'

const PGBIN = process.env.HOLDFAST_PGBIN ?? '/usr/lib/postgresql/15/bin'

export interface ThrowawayPostgres {
  url: string
  stop(): void
}

/**
 * A PostgreSQL 15 server of its own on loopback, for the tests only real PostgreSQL can run
 * (concurrent writes, LISTEN/NOTIFY). As root it runs as the postgres user, which initdb requires.
 */
export function startThrowawayPostgres(port = 54_329 + (process.pid % 500)): ThrowawayPostgres {
  const dir = mkdtempSync(path.join(tmpdir(), 'holdfast-pg-'))
  chmodSync(dir, 0o777)
  const asRoot = process.getuid?.() === 0
  const run = (args: string[]) => {
    const [cmd, ...rest] = args as [string, ...string[]]
    if (asRoot) execFileSync('su', ['postgres', '-c', [cmd, ...rest].map(quote).join(' ')], { stdio: 'pipe' })
    else execFileSync(cmd, rest, { stdio: 'pipe' })
  }
  const data = path.join(dir, 'data')
  run([`${PGBIN}/initdb`, '-D', data, '-U', 'postgres', '-A', 'trust', '-E', 'UTF8', '--locale=C.UTF-8'])
  run([`${PGBIN}/pg_ctl`, '-D', data, '-l', path.join(dir, 'log'), '-o', `-c listen_addresses=127.0.0.1 -p ${port} -k ${dir} -c fsync=off -c max_connections=300`, '-w', 'start'])
  return {
    url: `postgres://postgres@127.0.0.1:${port}/postgres`,
    stop() {
      if (asRoot) spawnSync('su', ['postgres', '-c', `${PGBIN}/pg_ctl -D ${quote(data)} -m fast -w stop`])
      else spawnSync(`${PGBIN}/pg_ctl`, ['-D', data, '-m', 'fast', '-w', 'stop'])
      rmSync(dir, { recursive: true, force: true })
    },
  }
}

function quote(s: string): string {
  return `'${s.replaceAll("'", "'\\''")}'`
}

/** The URL of another database on the same server. */
export function databaseUrl(serverUrl: string, database: string): string {
  return serverUrl.replace(/\/[^/]*$/, `/${database}`)
}

/**
 * Drops a test database once its connections have gone: pool.end() resolves before the server has seen
 * every connection leave, and a forced drop in that moment surfaces as an unhandled error in the closing pool.
 */
export async function dropDatabase(admin: { query: (sql: string, values?: unknown[]) => Promise<{ rows: { n: number }[] }> }, name: string) {
  for (let i = 0; i < 100; i++) {
    const { rows } = await admin.query('select count(*)::int as n from pg_stat_activity where datname = $1', [name])
    if (rows[0]!.n === 0) break
    await new Promise((r) => setTimeout(r, 20))
  }
  await admin.query(`drop database if exists ${name} with (force)`)
}
