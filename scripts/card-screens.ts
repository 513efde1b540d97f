// Screenshots of the card payment on the hosted page, at desktop and phone sizes, in English and Spanish:
//   npx tsx scripts/card-screens.ts http://127.0.0.1:3101
// The counter's "Card on the payment page" dialog, the local stand-in's hosted page, the counter back from
// it, and the owner's page before and after paying (an owner link made for the vehicle). Each run pays
// on a different demo vehicle with a balance. Writes screenshots/card-*.png (ignored by git).
import { mkdirSync } from 'node:fs'
import { chromium, devices, type Page } from '@playwright/test'
import { boardBodySchema } from '@shared/schemas/board'
import { chromiumLaunch } from '../tests/e2e/chromium'
import { DEMO } from '../tests/e2e/helpers'

const [base] = process.argv.slice(2)
if (!base) {
  console.error('usage: tsx scripts/card-screens.ts <base url>')
  process.exit(1)
}
const WORDS = {
  en: { submit: 'Open the payment page', pay: /^Pay \$/ },
  es: { submit: 'Abrir la página de pago', pay: /^Pagar \$/ },
}
mkdirSync('screenshots', { recursive: true })
const browser = await chromium.launch(chromiumLaunch)
const sizes = { desktop: { viewport: { width: 1440, height: 900 } }, phone: devices['Pixel 7'] }
let run = 0
for (const locale of ['en', 'es'] as const) {
  for (const [size, options] of Object.entries(sizes)) {
    const shot = (page: Page, what: string, full = false) => page.screenshot({ path: `screenshots/card-${what}-${size}-${locale}.png`, fullPage: full })
    const context = await browser.newContext({ ...options, baseURL: base, locale })
    const page = await context.newPage()
    await page.goto('/sign-in')
    await page.locator('input[name="email"]').fill(DEMO.office)
    await page.locator('input[name="password"]').fill(DEMO.password)
    await page.locator('button[type="submit"]').click()
    await page.waitForURL(/\/board/)
    const board = boardBodySchema.parse(await (await page.request.get('/api/board')).json())
    const owing = board.columns.flatMap((c) => c.cards).filter((c) => c.state !== 'closed' && c.summary && c.summary.balanceCents > 5_000)
    const vehicle = owing[run++]!
    await page.goto(`/vehicles/${vehicle.id}`)
    await page.getByTestId('card-checkout').click()
    const dialog = page.getByRole('dialog').last()
    await dialog.waitFor({ state: 'visible' })
    await dialog.locator('input[name="cardAmount"]').fill('25.00')
    await shot(page, 'counter-dialog')
    await dialog.getByRole('button', { name: WORDS[locale].submit }).click()
    await page.waitForURL(/\/pay\/cs_test_/)
    await shot(page, 'hosted-page')
    await page.locator('#card').fill('4242 4242 4242 4242')
    await page.getByRole('button', { name: WORDS[locale].pay }).click()
    await page.waitForURL(/\/vehicles\//)
    await page.getByTestId('card-return').waitFor({ state: 'visible' })
    await page.waitForLoadState('networkidle')
    await shot(page, 'counter-back')

    const csrf = (await (await page.request.get('/api/session')).json()).csrfToken as string
    const link = await (await page.request.post(`/api/vehicles/${vehicle.id}/owner-links`, { headers: { 'x-csrf-token': csrf } })).json()
    const owner = await browser.newContext({ ...options, baseURL: base, locale })
    const o = await owner.newPage()
    await o.goto(`/o/${link.token}`)
    await o.getByTestId('owner-pay').waitFor({ state: 'visible' })
    await o.getByTestId('owner-pay').scrollIntoViewIfNeeded()
    await shot(o, 'owner-before')
    await o.getByTestId('owner-pay').click()
    await o.waitForURL(/\/pay\/cs_test_/)
    await shot(o, 'owner-hosted-page')
    await o.locator('#card').fill('4242 4242 4242 4242')
    await o.getByRole('button', { name: WORDS[locale].pay }).click()
    await o.waitForURL(/\/o\/[^/]+\?|\/o\/[A-Za-z0-9_-]{20,}$/)
    await o.getByTestId('owner-paid').waitFor({ state: 'visible' })
    await o.getByTestId('owner-paid').scrollIntoViewIfNeeded()
    await shot(o, 'owner-after')
    console.log(`card screens ${size} ${locale}: ${vehicle.stockNumber}`)
    await owner.close()
    await context.close()
  }
}
await browser.close()
