import { expect, test } from '@playwright/test'
import { signInAs } from './helpers'

test('a correction wrong on a tab not shown names the field and opens that tab', async ({ page }) => {
  await signInAs(page, 'dispatcher')
  await page.getByRole('textbox', { name: /Find a vehicle/ }).fill('6WPL903')
  await page.getByRole('option').filter({ hasText: 'Kestra Pip' }).click()
  await page.getByRole('button', { name: 'Correct the record' }).click()
  const dialog = page.getByRole('dialog', { name: 'Correct the record' })
  await dialog.getByLabel('Make', { exact: true }).fill('')
  await dialog.getByRole('tab', { name: /^Damage notes/ }).click()
  await dialog.getByLabel('Why the record is corrected (kept in the history)').fill('Make misread at the gate')
  await dialog.getByRole('button', { name: 'Save the correction' }).click()

  await expect(dialog.getByRole('tab', { name: /^The vehicle/ })).toHaveAttribute('aria-selected', 'true')
  await expect(dialog.getByRole('tab', { name: /^The vehicle/ })).toContainText('1 to fix')
  await expect(dialog.locator('.el-alert')).toHaveText('Nothing was saved. The vehicle: Enter the make, or "Unknown".')
  await expect(dialog.locator('.el-form-item.is-error').filter({ hasText: 'Make' })).toBeVisible()
})
