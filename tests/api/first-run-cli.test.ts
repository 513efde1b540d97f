import { spawnSync } from 'node:child_process'
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { afterAll, describe, expect, it } from 'vitest'

// A real yard without the demo: `npm run user:create` on an empty data directory, as its first user would.
const dir = mkdtempSync(path.join(tmpdir(), 'holdfast-first-run-'))
afterAll(() => rmSync(dir, { recursive: true, force: true }))

function userCreate(...args: string[]) {
  const run = spawnSync(process.execPath, ['--import', 'tsx', 'server/cli/user-create.ts', ...args], {
    env: { ...process.env, HOLDFAST_DATA_DIR: path.join(dir, 'data'), HOLDFAST_PASSWORD: 'gravel-pit-owl-93', LOG_LEVEL: 'warn' },
    encoding: 'utf8',
    timeout: 120_000,
  })
  return { code: run.status, out: `${run.stdout}${run.stderr}` }
}

const YARD = ['--yard-name', 'North Lot', '--yard-code', 'NL', '--yard-address', '1 Quarry Road', '--lat', '36.41', '--lng=-119.35', '--time-zone', 'America/Los_Angeles']

describe('user:create on a database with no yard', () => {
  it('userCreate_firstManagerWithoutTheYard_isRefusedAndWritesNothing_thenOneCallWithTheYardSucceeds', { timeout: 240_000 }, () => {
    const refused = userCreate('--email', 'first@north-lot.example', '--name', 'First Manager', '--role', 'manager')
    expect(refused.code).toBe(1)
    expect(refused.out).toContain('There is no yard yet: give the first manager the yard options in this same command.')

    // The same e-mail again: had the refused call made the account, this would be "already exists".
    const made = userCreate('--email', 'first@north-lot.example', '--name', 'First Manager', '--role', 'manager', ...YARD)
    expect(made.out).toContain('Created manager first@north-lot.example')
    expect(made.out).toContain('Created the yard North Lot (stock numbers NL-…) under california-sample.')
    expect(made.code).toBe(0)

    const office = userCreate('--email', 'desk@north-lot.example', '--name', 'Desk', '--role', 'office')
    expect(office.out).toContain('Created office desk@north-lot.example')
    expect(office.code).toBe(0)
  })
})
