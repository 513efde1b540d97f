// Screenshots of "Sign the release" on the owner's page, desktop and phone, English and Spanish:
//   npx tsx scripts/owner-sign-screens.ts http://127.0.0.1:3101
// Takes a demo vehicle in Release, records at the counter (as the office) that its registered owner collects
// it, with an ID photo and the handover, makes an owner link, and shows the owner's page ready to sign, a
// signature drawn, and the page once signed. Writes screenshots/owner-sign-*.png (ignored by git).
import { chromium, devices } from '@playwright/test'
import sharp from 'sharp'
import { boardBodySchema } from '@shared/schemas/board'
import { chromiumLaunch } from '../tests/e2e/chromium'
import { DEMO } from '../tests/e2e/helpers'

const [base] = process.argv.slice(2)
if (!base) throw new Error('usage: tsx scripts/owner-sign-screens.ts <base url>')
const browser = await chromium.launch(chromiumLaunch)
const staff = await browser.newContext({ baseURL: base })
const page = await staff.newPage()
await page.goto('/sign-in')
await page.locator('input[name="email"]').fill(DEMO.office)
await page.locator('input[name="password"]').fill(DEMO.password)
await page.locator('button[type="submit"]').click()
await page.waitForURL(/\/board/)
const csrf = (await (await page.request.get('/api/session')).json()).csrfToken as string
const headers = { 'x-csrf-token': csrf }
const cards = boardBodySchema.parse(await (await page.request.get('/api/board')).json()).columns.flatMap((c) => c.cards).filter((c) => c.state === 'release')
const sizes = { desktop: { viewport: { width: 1440, height: 900 } }, phone: devices['Pixel 7'] }
let n = 0
for (const locale of ['en', 'es'] as const) {
  for (const [size, options] of Object.entries(sizes)) {
    const card = cards[n++]!
    const url = `/api/vehicles/${card.id}/release`
    const vehicle = await (await page.request.get(`/api/vehicles/${card.id}`)).json()
    const odometer = (vehicle.vehicle?.odometer ?? vehicle.odometer ?? 0) + 12
    const claimant = await page.request.put(`${url}/claimant`, {
      headers,
      data: { kind: 'registered_owner', name: 'Dana Okafor', actingFor: null, idType: 'drivers_license', idNumber: 'D4471902', idIssuer: 'California', idExpiry: '2030-05-31', authorityKind: 'registration', authorityReference: 'Registration card' },
    })
    if (!claimant.ok()) throw new Error(`claimant: ${claimant.status()} ${await claimant.text()}`)
    const photo = await sharp({ create: { width: 120, height: 76, channels: 3, background: '#c9822b' } }).jpeg().toBuffer()
    const id = await page.request.post(`${url}/id-photo`, { headers, multipart: { files: { name: 'licence.jpg', mimeType: 'image/jpeg', buffer: photo } } })
    if (!id.ok()) throw new Error(`id photo: ${id.status()} ${await id.text()}`)
    const release = await (await page.request.get(url)).json()
    const handover = await page.request.put(`${url}/handover`, {
      headers,
      data: { odometer, odometerUnreadable: false, property: release.property.map((p: { itemId?: string; id?: string }) => ({ itemId: p.itemId ?? p.id, returned: true, note: null })) },
    })
    if (!handover.ok()) throw new Error(`handover: ${handover.status()} ${await handover.text()}`)
    const link = await (await page.request.post(`/api/vehicles/${card.id}/owner-links`, { headers })).json()

    const owner = await browser.newContext({ ...options, baseURL: base, locale })
    const o = await owner.newPage()
    await o.goto(`/o/${link.token}`)
    const pad = o.getByTestId('owner-signature-pad')
    await pad.scrollIntoViewIfNeeded()
    await o.getByTestId('owner-signer-name').fill('Dana Okafor')
    const box = (await pad.boundingBox())!
    await o.mouse.move(box.x + 30, box.y + box.height * 0.7)
    await o.mouse.down()
    for (let i = 1; i <= 20; i++) await o.mouse.move(box.x + 30 + i * (box.width - 60) / 20, box.y + box.height * (0.5 + 0.3 * Math.sin(i / 2)))
    await o.mouse.up()
    await o.screenshot({ path: `screenshots/owner-sign-drawn-${size}-${locale}.png` })
    await o.locator('form.owner-sign__form button[type="submit"]').click()
    await o.getByTestId('owner-signed').waitFor({ state: 'visible' })
    await o.getByTestId('owner-signed').scrollIntoViewIfNeeded()
    await o.screenshot({ path: `screenshots/owner-sign-done-${size}-${locale}.png` })
    console.log(`owner signing ${size} ${locale}: ${card.stockNumber}`)
    await owner.close()
  }
}
await browser.close()
