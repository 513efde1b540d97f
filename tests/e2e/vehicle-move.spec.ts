import { expect, test } from '@playwright/test'
import { logFreshVehicle, signInAs, watchConsole } from './helpers'

// Issue 16 item 10: a vehicle's own page has "Move to…", the board's dialog under the same shared rules:
// what is not allowed yet says why, and a move made here shows on the page and in its history.
test('"Move to…" on the vehicle page lists the moves with why not, and a move made there shows at once', async ({ page }) => {
  test.slow()
  const problems = watchConsole(page)
  await signInAs(page, 'manager')
  const { id: vehicleId } = await logFreshVehicle(page.request)

  await page.goto(`/vehicles/${vehicleId}`)
  await expect(page.getByTestId('vehicle-state')).toHaveText('Arrival')
  await page.getByTestId('vehicle-move').click()
  const dialog = page.getByRole('dialog')
  await expect(dialog.getByLabel('Start the teardown')).toBeEnabled()
  const moved = page.waitForResponse((r) => r.url().endsWith(`/vehicles/${vehicleId}/moves`) && r.request().method() === 'POST')
  await dialog.getByLabel('Start the teardown').check()
  await dialog.getByRole('button', { name: 'Start the teardown' }).click()
  expect((await moved).status()).toBe(200)
  await expect(page.getByTestId('vehicle-state')).toHaveText('Teardown')
  await expect(page.getByTestId('history').locator('[data-kind="moved"]').first()).toContainText('Arrival → Teardown')
  // From Teardown the owner's decision waits for a finished inspection: offered, not allowed, with the reason.
  await page.getByTestId('vehicle-move').click()
  await expect(page.getByRole('dialog')).toContainText('Not now: The inspection is not finished')
  expect(problems).toEqual([])
})
