import { expect, test } from '@playwright/test'
import { DEMO, mainNav, signInAs, watchConsole } from './helpers'

// Issue 12, "Today": the office lands on Today, follows the notice due there to the vehicle, and sends
// it. The demo's TC-2026-00041 (valued under $500) owes a notice of intent to dispose
// (Cal. Veh. Code § 22851.10) and has nobody on record yet: the clerk adds its owner first.
test('the office opens Today, follows a due notice to the vehicle and sends it', async ({ page }) => {
  test.slow()
  const problems = watchConsole(page)
  await page.goto('/sign-in')
  await page.getByLabel('E-mail').fill(DEMO.office)
  await page.getByLabel('Password', { exact: true }).fill(DEMO.password)
  const today = page.waitForResponse((r) => r.url().endsWith('/api/today') && r.status() === 200)
  await page.getByRole('button', { name: 'Sign in' }).click()
  await expect(page).toHaveURL(/\/today$/)
  await today
  await expect(page.getByRole('heading', { name: 'Today', level: 1 })).toBeVisible()

  const entry = page.getByTestId('today-entry').filter({ hasText: 'TC-2026-00041' }).and(page.locator('[data-kind="notice"]'))
  await expect(entry).toContainText('Notice to send')
  await expect(entry).toContainText('Notice of intent to dispose')
  await entry.getByRole('link', { name: 'Send the notice' }).click()
  await expect(page).toHaveURL(/\/vehicles\/[0-9a-f-]+#notices$/)
  const notices = page.getByTestId('notices-panel')
  await expect(notices).toBeInViewport()

  const who = page.getByTestId('contacts-panel')
  await who.getByRole('button', { name: 'Add a contact' }).click()
  let dialog = page.getByRole('dialog', { name: 'Add a contact' })
  await dialog.getByLabel('Name', { exact: true }).fill('Marisol Quenby')
  await dialog.getByLabel('Street address').fill('12 Alder Row')
  await dialog.getByLabel('City', { exact: true }).fill('Orrin Flats')
  await dialog.getByLabel('State', { exact: true }).fill('CA')
  await dialog.getByLabel('ZIP code').fill('93274')
  await dialog.getByLabel('Date of the records request').fill('2026-11-30')
  const saved = page.waitForResponse((r) => r.url().endsWith('/contacts') && r.request().method() === 'POST')
  await dialog.getByRole('button', { name: 'Save the contact' }).click()
  expect((await saved).status()).toBe(201)

  const made = page.waitForResponse((r) => /\/notices$/.test(r.url()) && r.request().method() === 'POST')
  await notices.getByTestId('planned-disposal_notice').getByRole('button', { name: 'Make the letters' }).click()
  expect((await made).status()).toBe(201)
  const letter = notices.getByTestId('notice-registered_owner')
  await expect(letter).toContainText('Marisol Quenby')
  await letter.getByRole('button', { name: 'Send' }).click()
  dialog = page.getByRole('dialog', { name: 'Send the notice' })
  await dialog.getByLabel('Tracking number').fill('9407 1112 0620 5555 0041 00')
  const sent = page.waitForResponse((r) => r.url().endsWith('/send') && r.request().method() === 'POST')
  await dialog.getByRole('button', { name: 'Record and send' }).click()
  expect((await sent).status()).toBe(200)
  await expect(letter).toContainText('Certified mail 9407 1112 0620 5555 0041 00, mailed')

  // Back on Today, the notice is no longer listed as one to send.
  const again = page.waitForResponse((r) => r.url().endsWith('/api/today') && r.status() === 200)
  await (await mainNav(page)).getByRole('link', { name: 'Today' }).click()
  await again
  await expect(page.getByTestId('today-entry').first()).toBeVisible()
  await expect(page.locator('[data-testid="today-entry"][data-kind="notice"]').filter({ hasText: 'TC-2026-00041' })).toHaveCount(0)
  expect(problems).toEqual([])
})

test('the technician\'s Today lists only what waits in Teardown, each a link to its inspection', async ({ page }) => {
  await signInAs(page, 'technician', '/today')
  const entries = page.getByTestId('today-entry')
  await expect(entries.first()).toBeVisible()
  for (const kind of await entries.evaluateAll((els) => els.map((e) => e.getAttribute('data-kind')))) expect(kind).toBe('inspection')
  await entries.first().getByRole('link', { name: 'Inspect' }).click()
  await expect(page).toHaveURL(/\/vehicles\/[0-9a-f-]+\/inspection$/)
})
