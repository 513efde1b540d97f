import { expect, test } from '@playwright/test'
import { mainNav, signInAs, watchConsole } from './helpers'

// Issue 16: on a 390 px phone "Log a tow-in" was clipped under Sign out and the Staff link was off-screen.
test.use({ viewport: { width: 390, height: 844 } })

test('on a 390 px phone the menu reaches every page a manager has, each link whole on screen', async ({ page }) => {
  const problems = watchConsole(page)
  await signInAs(page, 'manager')
  const menu = page.getByRole('button', { name: 'Menu' })
  await expect(menu).toHaveAttribute('aria-expanded', 'false')
  await expect(page.getByRole('navigation', { name: 'Main' })).toBeHidden()

  const nav = await mainNav(page)
  const links = nav.getByRole('link')
  const labels = await links.allTextContents()
  expect(labels.map((l) => l.trim())).toEqual(['Today', 'Board', 'Log a tow-in', 'Cash drawer', 'Deadlines', 'Reports', 'Gate'])
  const more = page.getByRole('navigation', { name: 'More pages' })
  const moreLabels = await more.getByRole('link').allTextContents()
  expect(moreLabels.map((l) => l.trim())).toEqual(['Archive', 'Outbox', 'Settings', 'Staff'])
  for (const link of [...(await nav.getByRole('link').all()), ...(await more.getByRole('link').all())]) {
    const box = (await link.boundingBox())!
    expect(box.x).toBeGreaterThanOrEqual(0)
    expect(box.x + box.width).toBeLessThanOrEqual(390)
    // A gloved thumb: every target at least 48 px tall.
    expect(box.height).toBeGreaterThanOrEqual(48)
  }
  await expect(page.getByRole('button', { name: 'Sign out' })).toBeInViewport()

  await more.getByRole('link', { name: 'Staff' }).tap()
  await expect(page).toHaveURL(/\/users$/)
  // Issue 16 item 5: on a phone a person's name and actions are seen together, not a table scrolled sideways.
  const me = page.getByRole('listitem').filter({ hasText: 'Delia Marchetti' })
  await expect(me.getByRole('button', { name: 'New password' })).toBeInViewport({ ratio: 1 })
  await expect(me.getByRole('combobox', { name: 'Role of Delia Marchetti' })).toBeInViewport()
  // Going somewhere folds the menu away again.
  await expect(menu).toHaveAttribute('aria-expanded', 'false')
  await expect(page.getByRole('navigation', { name: 'Main' })).toBeHidden()

  await menu.tap()
  await page.keyboard.press('Escape')
  await expect(menu).toHaveAttribute('aria-expanded', 'false')
  expect(problems).toEqual([])
})
