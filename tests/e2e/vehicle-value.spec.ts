import { expect, test } from '@playwright/test'
import { signInAs, watchConsole } from './helpers'

// The demo's Halvard Ridgeback was towed in from a private lot and nobody has valued it: under the
// California sample its records request runs (Civ. Code § 3072 / Veh. Code § 22851.8) while every
// value-dependent deadline waits for the value, which the office records from the vehicle page.
test('the office records the value of a vehicle whose deadlines wait for it, and the card stops asking', async ({ page }) => {
  // A fresh server's first sign-in and board on a busy 2-core machine can pass 30 s; every step still
  // waits on what the page shows.
  test.slow()
  const problems = watchConsole(page)
  await signInAs(page, 'office')
  // The board tests on this server may have moved it on (board.spec.ts starts its teardown): whatever its
  // column, the deadlines still wait for the value.
  const card = page.locator('[data-stock]').filter({ hasText: 'Halvard Ridgeback' })
  await expect(card.getByText('Needs the value')).toBeVisible()
  await expect(card.getByText('Request owner and lienholder records')).toBeVisible()

  await card.getByRole('link').first().click()
  await expect(page.getByText('Needs the value: enter the value to see this deadline.')).toBeVisible()
  await expect(page.getByTestId('vehicle-value')).toContainText('No value on record.')

  await page.getByRole('button', { name: 'Record the value' }).click()
  const dialog = page.getByRole('dialog', { name: "The vehicle's value" })
  await dialog.getByLabel('What it is worth ($)').fill('400')
  await dialog.getByRole('button', { name: 'Price guide' }).click()
  const saved = page.waitForResponse((r) => r.url().endsWith('/value') && r.request().method() === 'PUT')
  await dialog.getByRole('button', { name: 'Save the value' }).click()
  expect((await saved).status()).toBe(200)

  await expect(page.getByTestId('vehicle-value')).toContainText('$400.00, from: Price guide')
  await expect(page.getByTestId('clock-alerts')).toHaveCount(0)
  await expect(page.getByText('Value recorded')).toBeVisible()

  await page.goBack()
  await expect(card.getByText('Request owner and lienholder records')).toBeVisible()
  await expect(card.getByText('Needs the value')).toHaveCount(0)
  expect(problems).toEqual([])
})
