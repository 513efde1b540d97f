import { defineConfig } from 'drizzle-kit'

// drizzle-kit only generates migrations here; it never opens a live data directory
// (PGlite takes no lock of its own — the app migrates itself at start-up).
export default defineConfig({
  dialect: 'postgresql',
  schema: './db/schema/index.ts',
  out: './db/migrations',
  casing: 'snake_case',
})
