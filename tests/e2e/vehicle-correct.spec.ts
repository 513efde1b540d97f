import { expect, test } from '@playwright/test'
import { logFreshVehicle, signInAs } from './helpers'

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

// Issue 16 item 16: an unrelated change made elsewhere while the dialog was open (a hold) refused the
// correction with "reload", and the typed text was lost. Now it saves on the new version; a change to the
// same part keeps the typed text and says so.
test('a correction saves over an unrelated change made meanwhile, and keeps the typed text when the same part changed', async ({ page }) => {
  test.slow()
  await signInAs(page, 'dispatcher')
  const session = await (await page.request.get('/api/session')).json()
  const headers = { 'x-csrf-token': session.csrfToken }
  const { id: vehicleId } = await logFreshVehicle(page.request)
  const version = async () => (await (await page.request.get(`/api/vehicles/${vehicleId}`)).json()).vehicle.version as number

  await page.goto(`/vehicles/${vehicleId}`)
  const dialog = page.getByRole('dialog', { name: 'Correct the record' })
  const notes = dialog.getByLabel('Damage and condition notes')
  await page.getByRole('button', { name: 'Correct the record' }).click()
  await dialog.getByRole('tab', { name: /^Damage notes/ }).click()
  await notes.fill('Scrape along the left rear door')
  // Meanwhile, at another desk: a hold.
  const held = await page.request.post(`/api/vehicles/${vehicleId}/holds`, { headers, data: { kind: 'dispute', note: 'Owner disputes the tow' } })
  expect(held.status()).toBe(201)
  await dialog.getByLabel('Why the record is corrected (kept in the history)').fill('Notes added after a walk-round')
  await dialog.getByRole('button', { name: 'Save the correction' }).click()
  await expect(dialog).toBeHidden()
  await expect(page.getByText('Scrape along the left rear door').first()).toBeVisible()

  await page.getByRole('button', { name: 'Correct the record' }).click()
  await dialog.getByRole('tab', { name: /^Damage notes/ }).click()
  await notes.fill('Dent in the tailgate')
  // Meanwhile, someone else corrects the same notes.
  const other = await page.request.patch(`/api/vehicles/${vehicleId}`, { headers, data: { version: await version(), reason: 'Driver’s sheet', conditionNotes: 'Cracked windscreen' } })
  expect(other.status()).toBe(200)
  await dialog.getByLabel('Why the record is corrected (kept in the history)').fill('Checked again at the yard')
  await dialog.getByRole('button', { name: 'Save the correction' }).click()
  await expect(dialog.locator('.el-alert')).toContainText('Someone changed the same part of this record while you were typing. Your text is kept')
  await expect(notes).toHaveValue('Dent in the tailgate')
  // Saving again, knowingly, goes through on the record as it now is.
  await dialog.getByRole('button', { name: 'Save the correction' }).click()
  await expect(dialog).toBeHidden()
  await expect(page.getByText('Dent in the tailgate').first()).toBeVisible()
})
