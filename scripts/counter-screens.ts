// Screenshots of the counter's one-screen release ("Release at the counter"), each step, at desktop and
// phone sizes, in English and Spanish:
//   npx tsx scripts/counter-screens.ts http://127.0.0.1:3101
// Each run logs a fresh tow-in as the demo dispatcher (the registered owner on record), then, as the office
// clerk: the screen as it opens, the balance taken in cash, the parts filled in, the owner's signature and
// the screen once released. Writes screenshots/counter-*.png (ignored by git).
import { mkdirSync } from 'node:fs'
import { chromium, devices, type Page } from '@playwright/test'
import sharp from 'sharp'
import { chromiumLaunch } from '../tests/e2e/chromium'
import { drawSignature } from '../tests/e2e/counter'
import { DEMO } from '../tests/e2e/helpers'
import { anotherVehicle, towInBody } from '../tests/helpers/tow-in'

const [base] = process.argv.slice(2)
if (!base) {
  console.error('usage: tsx scripts/counter-screens.ts <base url>')
  process.exit(1)
}
mkdirSync('screenshots', { recursive: true })
const browser = await chromium.launch(chromiumLaunch)
const sizes = { desktop: { viewport: { width: 1440, height: 900 } }, phone: devices['Pixel 7'] }
const licence = await sharp({ create: { width: 400, height: 250, channels: 3, background: '#c9822b' } }).jpeg().toBuffer()

async function signIn(page: Page, email: string) {
  await page.goto('/sign-in')
  await page.locator('input[name="email"]').fill(email)
  await page.locator('input[name="password"]').fill(DEMO.password)
  await page.locator('button[type="submit"]').click()
  await page.waitForURL(/\/(board|today)/)
}

for (const locale of ['en', 'es'] as const) {
  for (const [size, options] of Object.entries(sizes)) {
    // A viewport shot: a full-page one resizes the window, which clears the signature pad.
    const shot = (page: Page, what: string) => page.screenshot({ path: `screenshots/counter-${what}-${size}-${locale}.png` })
    const desk = await browser.newContext({ baseURL: base })
    const d = await desk.newPage()
    await signIn(d, DEMO.dispatcher)
    const csrf = ((await (await d.request.get('/api/session')).json()) as { csrfToken: string }).csrfToken
    const me = ((await (await d.request.get('/api/session')).json()) as { user: { id: string } }).user.id
    const created = await d.request.post('/api/vehicles', { headers: { 'x-csrf-token': csrf }, multipart: { data: JSON.stringify(towInBody(me, anotherVehicle)) } })
    const { id } = (await created.json()) as { id: string }
    await desk.close()

    const context = await browser.newContext({ ...options, baseURL: base, locale })
    const page = await context.newPage()
    await signIn(page, DEMO.office)
    await page.goto(`/vehicles/${id}`)
    await page.getByTestId('counter-open').click()
    const screen = page.getByRole('dialog', { name: /^(Release at the counter|Entrega en mostrador) — / })
    await page.locator('[data-testid="counter-signature-pad"][data-ready="true"]').waitFor()
    await shot(page, '1-open')
    const cash = page.waitForResponse((r) => r.url().endsWith('/payments') && r.status() === 201)
    await screen.getByTestId('counter-cash').click()
    await cash
    await screen.getByTestId('counter-money').locator('.counter__ok').waitFor({ state: 'visible' })
    await shot(page, '2-paid')
    await screen.getByTestId('counter-id-number').fill('D5520981')
    await screen.locator('.el-date-editor input').fill('2031-08-31')
    await screen.getByTestId('counter-id-file').setInputFiles({ name: 'licence.jpg', mimeType: 'image/jpeg', buffer: licence })
    await screen.getByTestId('counter-id-photo').scrollIntoViewIfNeeded()
    await shot(page, '3-who')
    await screen.getByTestId('counter-odometer').locator('input').fill('168410')
    await screen.getByTestId('counter-everything').click()
    await screen.getByTestId('counter-everything').scrollIntoViewIfNeeded()
    await shot(page, '4-item-by-item')
    await screen.getByTestId('counter-everything').click()
    const pad = screen.getByTestId('counter-signature-pad')
    await pad.scrollIntoViewIfNeeded()
    await page.locator('[data-testid="counter-signature-pad"][data-ready="true"]').waitFor()
    await drawSignature(page, pad)
    await shot(page, '5-signed')
    await screen.getByTestId('counter-release').click()
    await screen.getByTestId('counter-done').waitFor({ state: 'visible' })
    await shot(page, '6-done')
    await context.close()
  }
}
await browser.close()
