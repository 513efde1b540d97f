import { expect, test } from '@playwright/test'
import { signInAs } from './helpers'

test('the top-bar search says plainly when nothing matches', async ({ page }) => {
  await signInAs(page, 'office')
  await page.getByRole('textbox', { name: /Find a vehicle/ }).fill('QQZX')
  const miss = page.getByRole('status').filter({ hasText: 'No vehicle matches "QQZX".' })
  await expect(miss).toBeVisible()
  // Shown where the hits would be, not shrunk to a pixel for screen readers only.
  expect((await miss.boundingBox())!.width).toBeGreaterThan(150)
})

test('each hit shows its plate, and a hit by owner shows whose name matched', async ({ page }) => {
  await signInAs(page, 'office')
  const search = page.getByRole('textbox', { name: /Find a vehicle/ })
  await search.fill('Colby Ferr')
  await expect(page.getByRole('option').filter({ hasText: 'Kestra Pip' })).toContainText(/6WPL903[\s\S]*owner Colby Ferreira/)
  await search.fill('4XNE255')
  await expect(page.getByRole('option').filter({ hasText: 'Kestra Lantern' })).toContainText(/4XNE255[\s\S]*matched plate/)
})

// Issue 16 item 9: Enter on a single match did nothing, and the text stayed after opening the vehicle.
test('Enter on a single match opens that vehicle and leaves the search box empty', async ({ page }) => {
  await signInAs(page, 'office')
  const search = page.getByRole('textbox', { name: /Find a vehicle/ })
  await search.fill('4XNE255')
  await expect(page.locator('.shell-search__popper').getByRole('option')).toHaveCount(1)
  await search.press('Enter')
  await expect(page).toHaveURL(/\/vehicles\/[0-9a-f-]{36}$/)
  await expect(page.locator('main').getByText('Kestra Lantern').first()).toBeVisible()
  await expect(search).toHaveValue('')
})
