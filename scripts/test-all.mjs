// `npm test`: every check, in order, stopping at the first failure.
import { execSync } from 'node:child_process'

const steps = [
  ['Debian packages', 'node scripts/ensure-debian-packages.mjs'],
  ['typecheck', 'npm run typecheck'],
  ['lint and import rules', 'npm run lint'],
  ['unit and reference tests', 'npx vitest run --project unit --project reference'],
  ['API tests', 'npx vitest run --project api'],
  ['API tests with files in the S3 stand-in', 'npx vitest run --project api-s3'],
  ['build', 'npm run build'],
  ['browser tests', 'npm run test:e2e'],
]
for (const [name, command] of steps) {
  const started = Date.now()
  console.log(`\n▶ ${name}: ${command}`)
  try {
    execSync(command, { stdio: 'inherit' })
  } catch {
    console.error(`\n✖ ${name} failed.`)
    process.exit(1)
  }
  console.log(`✔ ${name} (${Math.round((Date.now() - started) / 1000)} s)`)
}
