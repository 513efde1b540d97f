// Screenshots of pages at desktop and phone sizes, for looking at what was built:
//   npx tsx scripts/screens.ts http://127.0.0.1:3101 manager /board /users
// Writes screenshots/<page>-<role>-<size>.png (ignored by git). Use "anon" as the role for public pages.
// A dialog: name the button that opens it after the path, `/users >> Add a staff member`; a further
// `>> Add` presses that button inside the dialog (to see a refusal). In a path,
// `{vehicle}` is the first vehicle on the board and `{held}` the first with a hold set.
// SCREENS_LOCALE=es shows the pages as a browser set to Spanish sees them (file names end in -es).
import { mkdirSync } from 'node:fs'
import { chromium, devices, type Page } from '@playwright/test'
import { boardBodySchema } from '@shared/schemas/board'
import { chromiumLaunch } from '../tests/e2e/chromium'
import { DEMO, type DemoRole } from '../tests/e2e/helpers'

const [base, role, ...paths] = process.argv.slice(2)
if (!base || !role || paths.length === 0) {
  console.error('usage: tsx scripts/screens.ts <base url> <manager|dispatcher|technician|office|anon> <path[ >> button]> [more…]')
  process.exit(1)
}

async function vehicles(page: Page) {
  const res = await page.request.get('/api/board')
  const cards = boardBodySchema.parse(await res.json()).columns.flatMap((c) => c.cards)
  return { '{vehicle}': cards[0]?.id ?? 'none', '{held}': cards.find((c) => c.holds.length > 0)?.id ?? 'none' }
}

mkdirSync('screenshots', { recursive: true })
const browser = await chromium.launch(chromiumLaunch)
const locale = process.env.SCREENS_LOCALE ?? 'en'
const sizes = { desktop: { viewport: { width: 1440, height: 900 } }, phone: devices['Pixel 7'] }
for (const [size, options] of Object.entries(sizes)) {
  const context = await browser.newContext({ ...options, baseURL: base, locale })
  const page = await context.newPage()
  if (role !== 'anon') {
    await page.goto('/sign-in')
    await page.locator('input[name="email"]').fill(DEMO[role as DemoRole])
    await page.locator('input[name="password"]').fill(DEMO.password)
    await page.locator('button[type="submit"]').click()
    await page.waitForURL(/\/(board|today)/)
  }
  const ids: Record<string, string> = role === 'anon' ? {} : await vehicles(page)
  for (const arg of paths) {
    const [p = '/', button, ...inside] = arg.split(/\s*>>\s*/)
    await page.goto(Object.entries(ids).reduce((url, [k, id]) => url.replace(k, id), p))
    await page.waitForLoadState('networkidle')
    if (button) {
      await page.getByRole('button', { name: button }).first().click()
      await page.getByRole('dialog').last().waitFor({ state: 'visible' })
      await page.waitForLoadState('networkidle')
    }
    for (const b of inside) {
      await page.getByRole('dialog').last().getByRole('button', { name: b }).click()
      await page.waitForLoadState('networkidle')
    }
    await page.waitForTimeout(300)
    const name = [p, button, ...inside].filter(Boolean).join('-').replace(/^\//, '').replace(/[^\w-]+/g, '_') || 'home'
    const file = `screenshots/${name}-${role}-${size}${locale === 'en' ? '' : `-${locale}`}.png`
    // A dialog is shown as the screen shows it; a page whole, down to its foot.
    await page.screenshot({ path: file, fullPage: size === 'desktop' && !button })
    console.log(file)
  }
  await context.close()
}
await browser.close()
