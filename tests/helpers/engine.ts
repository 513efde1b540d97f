/**
 * Which database the API tests run on: the embedded PGlite (`npm run test:api`) or a throwaway
 * PostgreSQL 15 (`npm run test:pg`, HOLDFAST_TEST_ENGINE=postgres). The switch is made once, in
 * tests/helpers/app.ts's makeTestApp; no test chooses its engine itself.
 */
export type TestEngine = 'pglite' | 'postgres'

export function testEngineFromEnv(): TestEngine {
  const v = process.env.HOLDFAST_TEST_ENGINE ?? 'pglite'
  if (v !== 'pglite' && v !== 'postgres') throw new Error(`HOLDFAST_TEST_ENGINE must be pglite or postgres, not ${v}`)
  return v
}

/**
 * Test files that are by nature about the embedded engine, left out of `npm run test:pg` (they still run,
 * on PGlite, in `npm test`). Each names why; DEVELOPERS.md lists them.
 */
export const PGLITE_ONLY: Record<string, string> = {
  'tests/api/data-dir-lock.test.ts': 'the lock on an embedded data directory: PostgreSQL locks its own data',
  'tests/api/crash-restart.test.ts': 'kill -9 rounds against the embedded engine in a data directory (PostgreSQL has its own WAL recovery)',
}
