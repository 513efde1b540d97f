import { expect, test } from '@playwright/test'
import { DEMO } from './helpers'
import { fillTheMinimum, openForm } from './tow-in-form'

// Issue 16 item 13: a session that ended (30 minutes idle) was reported as "The page is out of date… Reload",
// and reloading threw away the whole intake. Here the session cookie is dropped, as an expired one is.
test('a session that ends mid-form asks to sign in again over the page and keeps what was typed', async ({ page, context }) => {
  // Two sign-ins (two password hashes) and a save: on a loaded 2-core machine more than the default 30 s.
  test.slow()
  await openForm(page)
  await fillTheMinimum(page)
  const vin = await page.getByLabel('VIN', { exact: true }).inputValue()
  await context.clearCookies({ name: 'holdfast.sid' })

  await page.getByRole('button', { name: 'Log the vehicle' }).click()
  const dialog = page.getByRole('dialog', { name: 'Your session has ended' })
  await expect(dialog).toBeVisible()
  await expect(dialog.getByLabel('E-mail')).toHaveValue(DEMO.dispatcher)
  await dialog.getByLabel('Password').fill('not the password')
  await dialog.getByRole('button', { name: 'Sign in and carry on' }).click()
  await expect(dialog.getByRole('alert')).toContainText('do not match')
  await dialog.getByLabel('Password').fill(DEMO.password)
  await dialog.getByRole('button', { name: 'Sign in and carry on' }).click()
  await expect(dialog).toBeHidden()

  // The form underneath is as it was, and saves now.
  await expect(page.getByLabel('VIN', { exact: true })).toHaveValue(vin)
  await page.getByRole('button', { name: 'Log the vehicle' }).click()
  await expect(page).toHaveURL(/\/vehicles\/[0-9a-f-]{36}$/)
  await expect(page.getByText(vin).first()).toBeVisible()
})
