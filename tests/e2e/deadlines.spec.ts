import { expect, test } from '@playwright/test'
import { signInAs, watchConsole } from './helpers'
import { freshVin } from '../helpers/vins'
import { openForm } from './tow-in-form'

// The demo yard runs the California sample: a private-property tow must be reported to the local
// traffic law enforcement agency within an hour (Cal. Veh. Code § 22658, sample value from memory).
test('a private-property tow shows the police clock at once and the dispatcher records the notification', async ({ page }) => {
  test.slow()
  const problems = watchConsole(page)
  await openForm(page)
  const map = page.getByTestId('map')
  await expect(map.locator('img.leaflet-tile-loaded').first()).toBeVisible()
  const box = (await map.boundingBox())!
  await page.mouse.click(box.x + box.width * 0.6, box.y + box.height * 0.4)

  await expect(page.getByTestId('police-hint')).toHaveCount(0)
  await page.getByText('Private-property tow', { exact: true }).click()
  // Before anything is saved: the duty, its time and its statute.
  await expect(page.getByTestId('police-hint')).toContainText('within 1 hour')
  await expect(page.getByTestId('police-hint')).toContainText('22658')
  await page.getByLabel('Who asked for the tow').fill('Sunridge Plaza management')
  await page.getByLabel('VIN', { exact: true }).fill(freshVin())
  await page.getByLabel('Make', { exact: true }).fill('Kestra')
  await page.getByLabel('Colour', { exact: true }).fill('Grey')
  await page.getByLabel('Odometer', { exact: true }).fill('64020')
  await page.getByRole('radiogroup', { name: 'Keys with the vehicle' }).getByText('No', { exact: true }).click()
  await page.getByRole('button', { name: 'Log the vehicle' }).click()

  // The confirmation names the time the police must be told by, and the vehicle page opens on the clock.
  await expect(page.getByRole('alert').filter({ hasText: 'Tell the police by' })).toBeVisible()
  await expect(page).toHaveURL(/\/vehicles\/[0-9a-f-]{36}$/)
  const vehicleId = page.url().split('/').at(-1)!
  const panel = page.getByTestId('police-panel')
  await expect(panel).toHaveAttribute('data-status', 'open')
  await expect(panel).toContainText(/\d+ min left/)
  await page.screenshot({ path: 'test-results/screens/police-open.png', fullPage: false })

  // The card on the board says so too, in words.
  const stock = (await page.getByTestId('stock-number').textContent())!.trim()
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Board' }).click()
  await expect(page.locator(`[data-stock="${stock}"]`).getByTestId('police-badge')).toContainText('Tell the police')
  await page.locator(`[data-stock="${stock}"]`).getByRole('link', { name: stock }).click()
  await expect(page).toHaveURL(new RegExp(`/vehicles/${vehicleId}$`))

  await panel.getByRole('button', { name: 'Record the notification' }).click()
  const dialog = page.getByRole('dialog', { name: 'The police were told of the tow' })
  // A blank agency is refused beside its field, and nothing is sent.
  await dialog.getByRole('button', { name: 'Save the notification' }).click()
  await expect(dialog.getByText('Name the police agency you told.')).toBeVisible()
  await dialog.getByLabel('Police agency').fill('Orrin Flats Police Department')
  await dialog.getByLabel('Who took the call (optional)').fill('Desk officer Lena Marsh')
  await dialog.getByLabel('Report number (optional)').fill('OFPD-7781')
  const saved = page.waitForResponse((r) => r.url().endsWith(`/api/vehicles/${vehicleId}/police-notice`) && r.request().method() === 'POST')
  await dialog.getByRole('button', { name: 'Save the notification' }).click()
  expect((await saved).status()).toBe(201)
  await expect(dialog).toBeHidden()
  await expect(panel).toHaveAttribute('data-status', 'met')
  await expect(panel).toContainText('Told Orrin Flats Police Department')
  await expect(panel).toContainText('Report number OFPD-7781')
  await expect(page.getByTestId('history')).toContainText('Police told of the tow')
  await page.screenshot({ path: 'test-results/screens/police-met.png', fullPage: false })
  expect(problems).toEqual([])
})

test('the Deadlines page lists a vehicle’s deadline and links to it', async ({ page }) => {
  const problems = watchConsole(page)
  await signInAs(page, 'office')
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Deadlines' }).click()
  await expect(page).toHaveURL(/\/deadlines$/)
  await expect(page.getByRole('heading', { name: 'Deadlines', level: 1 })).toBeVisible()
  // The demo's newest private-property tow has not been reported: overdue, first on the page.
  await page.getByTestId('deadlines-filter-police').click()
  await expect(page).toHaveURL(/\/deadlines\?kind=police$/)
  const entry = page.getByTestId('deadline-entry').first()
  await expect(entry).toHaveAttribute('data-kind', 'police')
  await expect(entry).toContainText('Overdue')
  await entry.getByText('Rule and citation').click()
  await expect(entry).toContainText('22658')
  const vehicleId = (await entry.getAttribute('data-vehicle'))!
  const stock = (await entry.locator('.deadline-entry__stock').textContent())!.trim()
  await entry.getByRole('link', { name: stock }).click()
  await expect(page).toHaveURL(new RegExp(`/vehicles/${vehicleId}$`))
  await expect(page.getByTestId('stock-number')).toHaveText(stock)
  await expect(page.getByTestId('police-panel')).toHaveAttribute('data-status', 'overdue')
  expect(problems).toEqual([])
})
