// `npm run bench`: every performance target, each written to bench-results/<name>.json.
import { existsSync } from 'node:fs'
import { execSync } from 'node:child_process'
import { writeBenchResult } from './results'

if (!existsSync('dist/server/index.js')) execSync('npm run build', { stdio: 'inherit' })

const benches: Record<string, () => Promise<{ met: boolean }>> = {
  startup: async () => (await import('./startup.bench')).run(),
  core: async () => (await import('./core.bench')).run(),
  board: async () => (await import('./board.bench')).run(),
  delivery: async () => (await import('./delivery.bench')).run(),
  deadlines: async () => (await import('./deadlines.bench')).run(),
  release: async () => (await import('./release.bench')).run(),
  load: async () => (await import('./load.bench')).run(),
  receivables: async () => (await import('./receivables.bench')).run(),
  pg: async () => (await import('./pg.bench')).run(),
  counter: async () => (await import('./counter.bench')).run(),
}
const only = process.argv.slice(2)
let allMet = true
for (const [name, run] of Object.entries(benches)) {
  if (only.length && !only.includes(name)) continue
  const result = await run()
  if (name === 'startup') writeBenchResult(name, result)
  allMet &&= result.met
  console.log(`${result.met ? '✔' : '✖'} ${name}: ${JSON.stringify(result)}`)
}
console.log(allMet ? 'All benchmark goals met.' : 'Some benchmark goals were not met (see bench-results/).')
