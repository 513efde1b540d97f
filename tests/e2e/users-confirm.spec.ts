import { expect, test, type Page } from '@playwright/test'
import { expectAccessible, navLink, signInAs } from './helpers'

// Issue 16 item 5: a role change and Deactivate (which signs the person out on every device) ask first;
// Cancel changes nothing on the server, confirming changes it. The server's own list is read back each
// time (GET /api/users with the page's session), not only what the page shows.

type Row = { id: string; email: string; role: string; active: boolean }

async function onServer(page: Page, email: string): Promise<Row> {
  const answer = await page.request.get('/api/users')
  expect(answer.status()).toBe(200)
  const { users } = (await answer.json()) as { users: Row[] }
  return users.find((u) => u.email === email)!
}

async function addStaff(page: Page, name: string, email: string) {
  await page.getByRole('button', { name: 'Add a staff member' }).click()
  const dialog = page.getByRole('dialog', { name: 'Add a staff member' })
  await dialog.getByLabel('Name').fill(name)
  await dialog.getByLabel('E-mail').fill(email)
  await dialog.getByLabel(/First password/).fill('a long first passphrase')
  await dialog.getByRole('button', { name: 'Add' }).click()
  await expect(page.getByRole('cell', { name: email })).toBeVisible()
}

test('changing a role asks first: Cancel keeps the old role on the server, confirming changes it', async ({ page }) => {
  test.slow()
  await signInAs(page, 'manager')
  await (await navLink(page, 'Staff')).click()
  const email = 'wenna.castellow@tamsincreek.example'
  await addStaff(page, 'Wenna Castellow', email)
  expect((await onServer(page, email)).role).toBe('dispatcher')

  // Element Plus draws the chosen role over its combobox: the press goes to the select's box around it.
  const role = page.locator('.el-select').filter({ has: page.getByRole('combobox', { name: 'Role of Wenna Castellow' }) })
  await role.click()
  await page.getByRole('option', { name: 'Office', exact: true }).click()
  const ask = page.getByRole('dialog', { name: 'Change the role of Wenna Castellow?' })
  await expect(ask).toContainText('goes from Dispatcher to Office')
  await expectAccessible(page)
  await ask.getByRole('button', { name: 'Cancel' }).click()
  await expect(ask).toBeHidden()
  await expect(page.getByRole('row').filter({ hasText: email })).toContainText('Dispatcher')
  expect((await onServer(page, email)).role).toBe('dispatcher')

  await role.click()
  await page.getByRole('option', { name: 'Office', exact: true }).click()
  const saved = page.waitForResponse((r) => r.url().includes('/api/users/') && r.request().method() === 'PATCH')
  await page.getByRole('dialog', { name: 'Change the role of Wenna Castellow?' }).getByRole('button', { name: 'Change the role' }).click()
  expect((await saved).status()).toBe(200)
  await expect(page.getByText('Wenna Castellow is now office.')).toBeVisible()
  expect((await onServer(page, email)).role).toBe('office')
  // What the page shows after a reload is what the server kept.
  await page.reload()
  await expect(page.getByRole('row').filter({ hasText: email })).toContainText('Office')
})

test('Deactivate asks first: Cancel leaves the account active on the server, confirming deactivates it', async ({ page }) => {
  test.slow()
  await signInAs(page, 'manager')
  await (await navLink(page, 'Staff')).click()
  const email = 'tobin.marsh@tamsincreek.example'
  await addStaff(page, 'Tobin Marsh', email)
  const row = page.getByRole('row').filter({ hasText: email })

  await row.getByRole('button', { name: 'Deactivate' }).click()
  const ask = page.getByRole('dialog', { name: 'Deactivate Tobin Marsh?' })
  await expect(ask).toContainText('signed out on every device')
  await ask.getByRole('button', { name: 'Cancel' }).click()
  await expect(ask).toBeHidden()
  await expect(row.getByText('Active', { exact: true })).toBeVisible()
  expect((await onServer(page, email)).active).toBe(true)

  await row.getByRole('button', { name: 'Deactivate' }).click()
  const saved = page.waitForResponse((r) => r.url().includes('/api/users/') && r.request().method() === 'PATCH')
  await page.getByRole('dialog', { name: 'Deactivate Tobin Marsh?' }).getByRole('button', { name: 'Deactivate' }).click()
  expect((await saved).status()).toBe(200)
  await expect(row.getByText('Deactivated', { exact: true })).toBeVisible()
  expect((await onServer(page, email)).active).toBe(false)
})
