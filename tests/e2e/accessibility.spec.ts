import { expect, test, type Page } from '@playwright/test'
import { expectAccessible, signInAs, type DemoRole } from './helpers'

// Issue 16 item 17: every page passes axe-core's WCAG 2.2 A and AA rules — contrast, names, valid ARIA —
// at a desk, in English and Spanish. Each page is checked once what it shows has arrived.

async function firstVehicle(page: Page) {
  const card = page.locator('[data-column="storage"] [data-stock]').first()
  await expect(card).toBeVisible()
  return (await card.getAttribute('data-id'))!
}

test('the public pages pass axe: sign-in, the owner\'s start page and a page that is not there', async ({ page }) => {
  await page.goto('/sign-in')
  await expect(page.getByRole('button', { name: 'Sign in' })).toBeVisible()
  await expectAccessible(page)
  await page.goto('/o')
  await expect(page.getByRole('heading', { name: 'Find your vehicle' })).toBeVisible()
  await expectAccessible(page)
  await page.goto('/nowhere-at-all')
  await expect(page.getByRole('heading').first()).toBeVisible()
  await expectAccessible(page)
})

const pages: Record<DemoRole, { path: string; ready: (page: Page) => ReturnType<Page['getByRole']> }[]> = {
  manager: [
    { path: '/board', ready: (p) => p.getByRole('status').filter({ hasText: 'Live' }) },
    { path: '/archive', ready: (p) => p.getByRole('table') },
    { path: '/users', ready: (p) => p.getByRole('table') },
    { path: '/outbox', ready: (p) => p.getByRole('table') },
  ],
  office: [
    { path: '/cash-drawer', ready: (p) => p.getByRole('heading', { level: 1 }) },
    { path: '/deadlines', ready: (p) => p.getByRole('heading', { level: 1 }) },
    { path: '/gate', ready: (p) => p.getByRole('heading', { level: 1 }) },
  ],
  dispatcher: [{ path: '/tow-in', ready: (p) => p.getByTestId('map') }],
  technician: [{ path: '/board', ready: (p) => p.getByRole('status').filter({ hasText: 'Live' }) }],
}

for (const [role, list] of Object.entries(pages) as [DemoRole, (typeof pages)[DemoRole]][]) {
  test(`the ${role}'s pages pass axe`, async ({ page }) => {
    test.slow()
    await signInAs(page, role)
    for (const { path, ready } of list) {
      await page.goto(path)
      await expect(ready(page).first()).toBeVisible()
      await expectAccessible(page)
    }
  })
}

test("the manager's yard at a glance passes axe once its charts have drawn, and its figures are in tables too", async ({ page }) => {
  test.slow()
  await signInAs(page, 'manager', '/reports/glance')
  // echarts comes with this page only (its own chunk): the chart's SVG is the sign it arrived and drew.
  await expect(page.getByTestId('glance-weeks').locator('svg').first()).toBeVisible()
  await expect(page.getByTestId('glance-columns').getByRole('rowheader', { name: 'Storage' })).toBeVisible()
  await expect(page.getByRole('img', { name: 'Storage earned by week' })).toBeVisible()
  await expectAccessible(page)
})

test("a vehicle's page, its teardown and the owner's page pass axe, in English and in Spanish", async ({ page, browser }) => {
  test.slow()
  await signInAs(page, 'manager')
  const vehicleId = await firstVehicle(page)
  await page.goto(`/vehicles/${vehicleId}`)
  await expect(page.getByTestId('history')).toBeVisible()
  await expectAccessible(page)
  // Printed, the record is the paper's: no top bar, no buttons, no map (it printed on six pages before).
  await page.emulateMedia({ media: 'print' })
  await expect(page.locator('.top-bar')).toBeHidden()
  await expect(page.getByRole('button', { name: 'Correct the record' })).toBeHidden()
  await expect(page.getByTestId('map')).toBeHidden()
  await expect(page.getByTestId('history')).toBeVisible()
  await page.emulateMedia({ media: 'screen' })
  await page.goto(`/vehicles/${vehicleId}/inspection`)
  await expect(page.getByTestId('vehicle-state')).toBeVisible()
  await expectAccessible(page)

  await page.goto(`/vehicles/${vehicleId}`)
  await page.getByRole('button', { name: 'New owner link' }).click()
  const url = await page.getByTestId('owner-link-url').inputValue()
  for (const locale of ['en-US', 'es-US']) {
    const context = await browser.newContext({ locale })
    const owner = await context.newPage()
    await owner.goto(url)
    await expect(owner.getByTestId('owner-quote').or(owner.getByRole('heading', { level: 1 })).first()).toBeVisible()
    await expect(owner.locator('html')).toHaveAttribute('lang', locale.slice(0, 2))
    await expectAccessible(owner)
    await context.close()
  }
})
