import { expect, test } from '@playwright/test'
import { apiSignIn, logFreshVehicle, signInAs, watchConsole } from './helpers'

// Issue 16 item 16: a technician could start a teardown on a vehicle under a law-enforcement hold and the
// teardown never showed holds. An evidence hold usually means "do not touch": it is shown, and asked about.
test('a teardown under a law-enforcement hold shows the hold and asks before starting', async ({ page, request }) => {
  test.slow()
  const problems = watchConsole(page)
  const { csrfToken } = await apiSignIn(request, 'dispatcher')
  const { id: vehicleId } = await logFreshVehicle(request)
  const held = await request.post(`/api/vehicles/${vehicleId}/holds`, { headers: { 'x-csrf-token': csrfToken }, data: { kind: 'law_enforcement', agency: 'Orrin Flats Police Department', caseNumber: 'OF-26-20533' } })
  expect(held.status()).toBe(201)

  await signInAs(page, 'technician')
  await page.goto(`/vehicles/${vehicleId}/inspection`)
  const holds = page.getByTestId('inspection-holds')
  await expect(holds).toContainText('A hold is set on this vehicle')
  await expect(holds).toContainText('OF-26-20533')
  await expect(holds).toContainText('do not take it apart')

  const start = page.getByRole('button', { name: /Start the teardown|Start the inspection/ }).first()
  await start.click()
  const ask = page.getByRole('dialog', { name: 'Start the teardown under a hold?' })
  await expect(ask).toContainText('Law-enforcement hold')
  await ask.getByRole('button', { name: 'Do not start' }).click()
  await expect(ask).toBeHidden()
  await expect(page.getByTestId('vehicle-state')).toHaveText('Arrival')

  await start.click()
  const moved = page.waitForResponse((r) => r.url().endsWith('/inspection') && r.request().method() === 'POST')
  await page.getByRole('dialog', { name: 'Start the teardown under a hold?' }).getByRole('button', { name: 'Start anyway' }).click()
  expect((await moved).status()).toBe(201)
  await expect(page.getByTestId('vehicle-state')).toHaveText('Teardown')
  expect(problems).toEqual([])
})

// Issue 16 item 16, the board's side: a drag, Shift+→ or "Move to…" took a held vehicle from Arrival to
// Teardown without a word. Every way into Teardown under a law-enforcement hold now asks first, naming the
// hold and its caution; Cancel leaves it in Arrival and sends nothing.
test('Shift+→ on a card under a law-enforcement hold asks first; Cancel leaves it in Arrival', async ({ page, request }) => {
  test.slow()
  const problems = watchConsole(page)
  const { csrfToken } = await apiSignIn(request, 'dispatcher')
  const { id: vehicleId, stockNumber } = await logFreshVehicle(request)
  const held = await request.post(`/api/vehicles/${vehicleId}/holds`, { headers: { 'x-csrf-token': csrfToken }, data: { kind: 'law_enforcement', agency: 'Orrin Flats Police Department', caseNumber: 'OF-26-20611' } })
  expect(held.status()).toBe(201)

  await signInAs(page, 'technician')
  await page.goto(`/board?q=${stockNumber}`)
  const card = (column: string) => page.locator(`[data-column="${column}"] [data-stock="${stockNumber}"]`)
  let posted = 0
  page.on('request', (r) => r.method() === 'POST' && r.url().endsWith(`/api/vehicles/${vehicleId}/moves`) && posted++)

  await card('arrival').focus()
  await page.keyboard.press('Shift+ArrowRight')
  const ask = page.getByRole('dialog', { name: `Move ${stockNumber}` })
  await expect(ask.getByTestId('move-hold')).toContainText('Under a law-enforcement hold: Orrin Flats Police Department, case OF-26-20611')
  await expect(ask).toContainText('do not take it apart until the agency says so')
  await ask.getByRole('button', { name: 'Cancel' }).click()
  await expect(ask).toBeHidden()
  await expect(card('arrival')).toBeVisible()
  expect(posted).toBe(0)

  await card('arrival').focus()
  await page.keyboard.press('Shift+ArrowRight')
  const moved = page.waitForResponse((r) => r.url().endsWith(`/api/vehicles/${vehicleId}/moves`) && r.request().method() === 'POST')
  await page.getByRole('dialog', { name: `Move ${stockNumber}` }).getByRole('button', { name: 'Move to Teardown anyway' }).click()
  const answer = await moved
  expect(answer.status()).toBe(200)
  expect(answer.request().postDataJSON()).toMatchObject({ to: 'teardown', confirmHold: true })
  await expect(card('teardown')).toBeVisible()
  expect(problems).toEqual([])
})
