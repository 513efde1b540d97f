import { expect, test, type Page } from '@playwright/test'
import { AXE_ROUTES, isElsewhere } from './axe-routes'
import { expectAccessible, signInAs } from './helpers'

// Issue 16 item 17: every page passes axe-core's WCAG 2.2 A and AA rules — contrast, names, valid ARIA —
// at a desk, in English and Spanish. Each page is checked once what it shows has arrived. Which pages, and
// where each route is checked: tests/e2e/axe-routes.ts (a unit test holds it to the router's routes).

async function firstVehicle(page: Page) {
  const card = page.locator('[data-column="storage"] [data-stock]').first()
  await expect(card).toBeVisible()
  return (await card.getAttribute('data-id'))!
}

// The pages of tests/e2e/axe-routes.ts, one test each (axe on a full page takes a while on a loaded
// machine), each page once what it shows has arrived, and each main dialog open over it.
for (const [name, entry] of Object.entries(AXE_ROUTES)) {
  if (isElsewhere(entry)) continue
  const { role, path, ready, dialogs } = entry
  test(`${name} passes axe${role ? ` (${role})` : ''}${dialogs ? `, with ${dialogs.join(', ')} open` : ''}`, async ({ page }) => {
    test.slow()
    if (role) await signInAs(page, role)
    await page.goto(typeof path === 'string' ? path : await path(page))
    await expect(ready(page).first()).toBeVisible()
    await expectAccessible(page)
    for (const opener of dialogs ?? []) {
      await page.getByRole('button', { name: opener, exact: true }).first().click()
      const dialog = page.getByRole('dialog')
      await expect(dialog).toBeVisible()
      await expectAccessible(page)
      await page.keyboard.press('Escape')
      await expect(dialog).toBeHidden()
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
