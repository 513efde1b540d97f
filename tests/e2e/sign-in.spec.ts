import { expect, test } from '@playwright/test'
import { DEMO, navLink, openMenu, signInAs, watchConsole, type DemoRole } from './helpers'

// The everyday pages sit in the bar; the others are in the menu at a desk ("More pages").
const NAV: Record<DemoRole, string[]> = {
  manager: ['Today', 'Board', 'Log a tow-in', 'Cash drawer', 'Deadlines', 'Reports', 'Gate'],
  dispatcher: ['Today', 'Board', 'Log a tow-in'],
  technician: ['Today', 'Board'],
  office: ['Today', 'Board', 'Cash drawer', 'Deadlines', 'Reports', 'Gate'],
}
const MORE: Record<DemoRole, string[]> = {
  manager: ['Archive', 'Outbox', 'Settings', 'Staff'],
  dispatcher: ['Archive'],
  technician: ['Archive'],
  office: ['Archive', 'Outbox'],
}

for (const role of Object.keys(NAV) as DemoRole[]) {
  test(`a ${role} signs in, sees the board and only their navigation`, async ({ page }) => {
    const problems = watchConsole(page)
    await signInAs(page, role)
    const nav = page.getByRole('navigation', { name: 'Main' })
    await expect(nav.getByRole('link')).toHaveText(NAV[role])
    await openMenu(page)
    await expect(page.getByRole('navigation', { name: 'More pages' }).getByRole('link')).toHaveText(MORE[role])
    await expect(page.getByTestId('who')).toContainText(role, { ignoreCase: true })
    await expect(page.locator('[data-column="arrival"] [data-stock]').first()).toBeVisible()
    expect(problems).toEqual([])
  })
}

test('a wrong password shows the message and stays on the sign-in page', async ({ page }) => {
  await page.goto('/sign-in')
  await page.getByLabel('E-mail').fill(DEMO.office)
  await page.getByLabel('Password', { exact: true }).fill('not the password')
  await page.getByRole('button', { name: 'Sign in' }).click()
  await expect(page.getByRole('alert')).toContainText('That e-mail and password do not match an active account.')
  await expect(page).toHaveURL(/\/sign-in/)
})

test('signing out returns to the sign-in page and the board needs a new sign-in', async ({ page }) => {
  await signInAs(page, 'dispatcher')
  await openMenu(page)
  await page.getByRole('button', { name: 'Sign out' }).click()
  await expect(page).toHaveURL(/\/sign-in/)
  await page.goto('/board')
  await expect(page).toHaveURL(/\/sign-in\?next=/)
})

test('a dispatcher who types the staff address is sent back to the board', async ({ page }) => {
  await signInAs(page, 'dispatcher')
  await page.goto('/users')
  await expect(page).toHaveURL(/\/board/)
})

test('a manager adds a staff member who can then sign in', async ({ page, browser }) => {
  // Two sign-ins and a new account (three password hashes) in one test: past 30 s on a busy machine.
  test.slow()
  await signInAs(page, 'manager')
  await (await navLink(page, 'Staff')).click()
  await page.getByRole('button', { name: 'Add a staff member' }).click()
  const dialog = page.getByRole('dialog')
  await dialog.getByLabel('Name').fill('Ossian Threlkeld')
  await dialog.getByLabel('E-mail').fill('ossian@tamsincreek.example')
  await dialog.getByLabel(/First password/).fill('a long first passphrase')
  await dialog.getByRole('button', { name: 'Add' }).click()
  await expect(page.getByRole('cell', { name: 'ossian@tamsincreek.example' })).toBeVisible()

  const other = await browser.newPage()
  await other.goto('/sign-in')
  await other.getByLabel('E-mail').fill('ossian@tamsincreek.example')
  await other.getByLabel('Password', { exact: true }).fill('a long first passphrase')
  await other.getByRole('button', { name: 'Sign in' }).click()
  await expect(other.getByTestId('who')).toContainText('Dispatcher')
  await other.close()

  // Issue 16 item 5: a role change and Deactivate (which signs the person out everywhere) ask first.
  const row = page.getByRole('row').filter({ hasText: 'ossian@tamsincreek.example' })
  await row.getByRole('button', { name: 'Deactivate' }).click()
  const ask = page.getByRole('dialog', { name: 'Deactivate Ossian Threlkeld?' })
  await expect(ask).toContainText('signed out on every device')
  await ask.getByRole('button', { name: 'Cancel' }).click()
  await expect(row.getByText('Active', { exact: true })).toBeVisible()
  await row.getByRole('button', { name: 'Deactivate' }).click()
  await page.getByRole('dialog', { name: 'Deactivate Ossian Threlkeld?' }).getByRole('button', { name: 'Deactivate' }).click()
  await expect(row.getByText('Deactivated', { exact: true })).toBeVisible()
})
