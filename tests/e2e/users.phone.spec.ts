import { expect, test } from '@playwright/test'
import { navLink, signInAs } from './helpers'

// Issue 16 item 5, on a 390 px phone: each person is one card with their name and their actions together
// (a table's actions fell off the screen), and Deactivate still asks first.
test.use({ viewport: { width: 390, height: 844 } })

test('on a phone each staff member shows their name beside their actions, and Deactivate asks first', async ({ page }) => {
  await signInAs(page, 'manager')
  await (await navLink(page, 'Staff')).click()
  const card = page.getByRole('listitem').filter({ hasText: 'ruben@tamsincreek.example' })
  await expect(card).toBeVisible()
  await card.scrollIntoViewIfNeeded()
  const name = card.getByText('Ruben Okafor', { exact: true })
  const deactivate = card.getByRole('button', { name: 'Deactivate' })
  for (const part of [name, card.getByRole('combobox', { name: /^Role of / }), card.getByRole('button', { name: 'New password' }), deactivate]) {
    await expect(part).toBeInViewport()
  }
  const box = (await card.boundingBox())!
  expect(box.x).toBeGreaterThanOrEqual(0)
  expect(box.x + box.width).toBeLessThanOrEqual(390)
  await page.screenshot({ path: 'test-results/users-phone.png', fullPage: false })

  await deactivate.click()
  const ask = page.getByRole('dialog', { name: /^Deactivate .+\?$/ })
  await expect(ask).toBeVisible()
  await ask.getByRole('button', { name: 'Cancel' }).click()
  await expect(ask).toBeHidden()
  await expect(card.getByText('Active', { exact: true })).toBeVisible()
})
