import { expect, test } from '@playwright/test'
import { openMenu, signInAs } from './helpers'

// A manager has eleven pages: at a 1440 px desk every everyday link must be whole in the bar (they
// scrolled out of sight before), with the other pages, the person, the language and sign-out one press away.
test('at a 1440 px desk every everyday page of a manager is in the bar, and the menu holds the others and sign-out', async ({ page }) => {
  await page.setViewportSize({ width: 1440, height: 900 })
  await signInAs(page, 'manager')
  const links = page.getByRole('navigation', { name: 'Main' }).getByRole('link')
  await expect(links).toHaveCount(7)
  for (const link of await links.all()) await expect(link).toBeInViewport({ ratio: 1 })
  await expect(page.getByRole('button', { name: 'Sign out' })).toBeHidden()
  await openMenu(page)
  const more = page.getByRole('navigation', { name: 'More pages' }).getByRole('link')
  await expect(more).toHaveText(['Archive', 'Outbox', 'Settings', 'Staff'])
  for (const link of await more.all()) await expect(link).toBeInViewport({ ratio: 1 })
  await expect(page.getByRole('button', { name: 'Sign out' })).toBeInViewport()
  await expect(page.getByTestId('who')).toContainText('Manager')
  // A press elsewhere folds it away.
  await page.getByRole('heading', { level: 1 }).click()
  await expect(page.getByRole('button', { name: 'Sign out' })).toBeHidden()
})
