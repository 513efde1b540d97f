import { expect, test } from '@playwright/test'
import { apiSignIn, logFreshVehicle, signInAs, watchConsole } from './helpers'

// Issue 10: a California vehicle valued over $4,000 waits for the DMV's own notice to the owners
// (Cal. Civ. Code § 3071(b)–(c), as the demo yard's sample cites it) — a step only the office can
// witness. The office records its day from the vehicle page; the owners' 10 days to oppose then show a date.
test('the office records the state notice from the vehicle page and the step it starts gets its date', async ({ page, request }) => {
  test.slow()
  const problems = watchConsole(page)
  await apiSignIn(request, 'dispatcher')
  const { id: vehicleId } = await logFreshVehicle(request)

  await signInAs(page, 'office')
  const session = await (await page.request.get('/api/session')).json()
  const vehicle = await (await page.request.get(`/api/vehicles/${vehicleId}`)).json()
  const valued = await page.request.put(`/api/vehicles/${vehicleId}/value`, { headers: { 'x-csrf-token': session.csrfToken }, data: { version: vehicle.vehicle.version, valueCents: 650_000, source: 'Price guide, clean retail' } })
  expect(valued.status()).toBe(200)

  await page.goto(`/vehicles/${vehicleId}`)
  const section = page.getByTestId('clock-steps-section')
  const step = section.getByTestId('clock-step-state-notice-mailed')
  await expect(step).toContainText("The state's notice mailed to the owners")
  await expect(step.getByTestId('clock-step-recorded')).toHaveText('Not recorded yet')
  await expect(step.getByTestId('clock-step-deadline-opposition-period')).toContainText('waits for this step')
  await expect(section).toContainText('§ 3071')
  await expect(section).toContainText('Requirements vary by state and locality; check with your local code and counsel.')

  await step.getByRole('button', { name: 'Record the day' }).click()
  const dialog = page.getByRole('dialog', { name: "Record: The state's notice mailed to the owners" })
  // The yard's today (its zone, not the browser's): the vehicle arrived today, so no other day is allowed.
  const yardToday = new Intl.DateTimeFormat('en-CA', { timeZone: vehicle.yard.timeZone }).format(new Date())
  await dialog.getByPlaceholder('Pick the day').fill(yardToday)
  await dialog.getByPlaceholder('Pick the day').press('Enter')
  await dialog.getByLabel('Note (optional)').fill('DMV ref 99-1208')
  const saved = page.waitForResponse((r) => r.url().endsWith('/clock-events') && r.request().method() === 'POST')
  await dialog.getByRole('button', { name: 'Save the step' }).click()
  expect((await saved).status()).toBe(201)
  await expect(dialog).toBeHidden()
  await expect(step.getByTestId('clock-step-recorded')).toHaveText(/^Recorded: /)
  // § 3071(b)–(c): 10 days from the mailing — the step now has a date and is upcoming.
  await expect(step.getByTestId('clock-step-deadline-opposition-period')).toContainText('upcoming')
  await expect(step.getByRole('button', { name: 'Change the day' })).toBeVisible()
  expect(problems).toEqual([])
})
