// Screenshots of placing a yard (issue 12), at desktop and on a 390 px phone, for looking at what was built:
//   npx tsx scripts/yard-screens.ts <first-run server url | -> <demo server url>
// The first URL is a server with no company yet (HOLDFAST_DEMO=0); "-" skips the first-run page. On the demo
// server the manager adds a second yard "North lot" through Settings → Yards (placed by its address), unless one
// is there already, so the top bar's yard chooser shows. Writes screenshots/yard-*.png (ignored by git).
import { mkdirSync } from 'node:fs'
import { chromium, type Browser, type Page } from '@playwright/test'
import { chromiumLaunch } from '../tests/e2e/chromium'
import { DEMO } from '../tests/e2e/helpers'

const [firstRunBase, demoBase] = process.argv.slice(2)
if (!firstRunBase || !demoBase) {
  console.error('usage: tsx scripts/yard-screens.ts <first-run server url | -> <demo server url>')
  process.exit(1)
}
const locale = process.env.SCREENS_LOCALE ?? 'en'
const suffix = locale === 'en' ? '' : `-${locale}`
const sizes = {
  desktop: { viewport: { width: 1440, height: 900 } },
  phone: { viewport: { width: 390, height: 844 }, deviceScaleFactor: 2, isMobile: true, hasTouch: true },
}
mkdirSync('screenshots', { recursive: true })
const shot = (page: Page, name: string, size: string, fullPage = false) => page.screenshot({ path: `screenshots/yard-${name}-${size}${suffix}.png`, fullPage })

/** Searches an address in the yard search box and takes the first suggestion; waits for the pin. */
async function place(page: Page, scope: Page | ReturnType<Page['locator']>, q: string) {
  const search = scope.locator('input[name="yardSearch"]')
  await search.fill(q)
  await page.locator('.el-autocomplete-suggestion li').first().click()
  await scope.locator('.leaflet-marker-pane [data-testid="map-pin"]').waitFor()
  // The tiles around the pin, so the picture shows the street.
  await page.waitForLoadState('networkidle')
}

async function firstRun(browser: Browser) {
  for (const [size, options] of Object.entries(sizes)) {
    const context = await browser.newContext({ ...options, baseURL: firstRunBase, locale })
    const page = await context.newPage()
    await page.goto('/first-run')
    await page.locator('input[name="yardSearch"]').waitFor()
    await page.locator('input[name="yardName"]').fill('Quarry Road lot')
    await place(page, page, '45 Cinder')
    await page.locator('input[name="yardSearch"]').scrollIntoViewIfNeeded()
    await shot(page, 'first-run', size)
    await shot(page, 'first-run-full', size, true)
    await context.close()
  }
}

async function settings(browser: Browser) {
  for (const [size, options] of Object.entries(sizes)) {
    const context = await browser.newContext({ ...options, baseURL: demoBase, locale })
    const page = await context.newPage()
    await page.goto('/sign-in')
    await page.locator('input[name="email"]').fill(DEMO.manager)
    await page.locator('input[name="password"]').fill(DEMO.password)
    await page.locator('button[type="submit"]').click()
    await page.waitForURL(/\/(board|today)/)
    await page.goto('/settings/yards')
    await page.locator('[data-yard]').first().waitFor()
    const hasSecond = (await page.locator('[data-yard="NL"]').count()) > 0
    await page.getByRole('button', { name: hasSecond ? /^(Edit|Editar)$/ : /^(Add a yard|Agregar un patio)$/ }).first().click()
    const dialog = page.getByRole('dialog')
    await dialog.locator('.leaflet-container').waitFor()
    if (!hasSecond) {
      await dialog.locator('input[name="name"]').fill('North lot')
      await dialog.locator('input[name="code"]').fill('NL')
      await place(page, dialog, "730 Harrow")
      await shot(page, 'settings-add', size)
      const saved = page.waitForResponse((r) => r.url().endsWith('/api/settings/yards') && r.request().method() === 'POST')
      await dialog.getByRole('button', { name: /^(Save the yard|Guardar el patio)$/ }).click()
      if ((await saved).status() !== 201) throw new Error('The second yard was not saved')
    } else {
      await page.waitForLoadState('networkidle')
      await shot(page, 'settings-edit', size)
    }
    // The top bar's yard chooser with two yards, then opened.
    await page.goto('/board')
    const chooser = page.getByTestId('yard-chooser')
    await chooser.waitFor()
    await shot(page, 'chooser', size)
    await chooser.click()
    await page.locator('.el-select-dropdown__item').first().waitFor()
    await shot(page, 'chooser-open', size)
    await context.close()
  }
}

const browser = await chromium.launch(chromiumLaunch)
if (firstRunBase !== '-') await firstRun(browser)
await settings(browser)
await browser.close()
console.log('screenshots/yard-*.png')
