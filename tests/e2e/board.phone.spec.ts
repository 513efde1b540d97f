import { expect, test } from '@playwright/test'
import { signInAs } from './helpers'

test('on a phone the board shows one column at a time and moves through the menu', async ({ page }) => {
  await signInAs(page, 'technician')
  const tabs = page.getByRole('navigation', { name: 'Columns' })
  await expect(tabs.getByRole('button', { name: /Arrival/ })).toHaveAttribute('aria-current', 'true')
  await expect(page.locator('[data-column]')).toHaveCount(1)
  const card = page.locator('[data-column="arrival"] [data-stock]').filter({ hasText: 'Veyland Solace' })
  const stock = (await card.getAttribute('data-stock'))!
  await card.getByRole('button', { name: `Move ${stock} to…` }).click()
  const dialog = page.getByRole('dialog')
  await expect(dialog.getByLabel('Owner collects — go to Release')).toBeDisabled()
  await expect(dialog).toContainText('Only these roles can move a vehicle from Arrival to Release: Manager, Office.')
  await dialog.getByRole('button', { name: 'Start the teardown' }).click()
  await expect(page.getByTestId('board-notice')).toContainText(`${stock} is now in Teardown.`)
  await tabs.getByRole('button', { name: /Teardown/ }).click()
  await expect(page).toHaveURL(/col=teardown/)
  await expect(page.locator('[data-column="teardown"] [data-stock]').filter({ hasText: 'Veyland Solace' })).toBeVisible()
})

test('on a phone the archive shows how each closed vehicle left without scrolling sideways', async ({ page }) => {
  await signInAs(page, 'office')
  await page.goto('/archive')
  const items = page.getByTestId('archive-item')
  await expect(items.first()).toBeVisible()
  for (const item of await items.all()) {
    await expect(item).toContainText(/Returned to owner|Released to a third party|Title transferred|Lien sale|Scrapped/)
    const box = (await item.boundingBox())!
    expect(box.x + box.width).toBeLessThanOrEqual(page.viewportSize()!.width)
  }
  const scrollsSideways = await page.evaluate(() => document.documentElement.scrollWidth > window.innerWidth)
  expect(scrollsSideways).toBe(false)
})
