// Screenshots of pages at desktop and phone sizes, for looking at what was built:
//   npx tsx scripts/screens.ts http://127.0.0.1:3101 manager /board /users
// Writes screenshots/<page>-<role>-<size>.png (ignored by git). Use "anon" as the role for public pages.
import { mkdirSync } from 'node:fs'
import { chromium, devices } from '@playwright/test'
import { chromiumLaunch } from '../tests/e2e/chromium'
import { DEMO, type DemoRole } from '../tests/e2e/helpers'

const [base, role, ...paths] = process.argv.slice(2)
if (!base || !role || paths.length === 0) {
  console.error('usage: tsx scripts/screens.ts <base url> <manager|dispatcher|technician|office|anon> <path> [path…]')
  process.exit(1)
}
mkdirSync('screenshots', { recursive: true })
const browser = await chromium.launch(chromiumLaunch)
const sizes = { desktop: { viewport: { width: 1440, height: 900 } }, phone: devices['Pixel 7'] }
for (const [size, options] of Object.entries(sizes)) {
  const context = await browser.newContext({ ...options, baseURL: base })
  const page = await context.newPage()
  if (role !== 'anon') {
    await page.goto('/sign-in')
    await page.getByLabel('E-mail').fill(DEMO[role as DemoRole])
    await page.getByLabel('Password', { exact: true }).fill(DEMO.password)
    await page.getByRole('button', { name: 'Sign in' }).click()
    await page.waitForURL(/\/board/)
  }
  for (const p of paths) {
    await page.goto(p)
    await page.waitForLoadState('networkidle')
    await page.waitForTimeout(300)
    const name = p.replace(/^\//, '').replace(/[^\w-]+/g, '_') || 'home'
    const file = `screenshots/${name}-${role}-${size}.png`
    await page.screenshot({ path: file, fullPage: size === 'phone' ? false : true })
    console.log(file)
  }
  await context.close()
}
await browser.close()
