import { devices, expect, test } from '@playwright/test'
import { ownerPageSchema } from '@shared/schemas/owner'
import { signInAs, watchConsole } from './helpers'

// Issue 10: the office gives the owner a link; the owner, on a phone, checks the cost of collecting
// next week and signs the vehicle over; the office's board shows it at once, without a reload.
test("the owner opens the office's link on a phone, prices next week, signs the vehicle over, and the board shows it live", async ({ page, browser }) => {
  // Two browsers on a freshly started server on a busy 2-core machine; every step waits on what the page shows.
  test.slow()
  const problems = watchConsole(page)
  await signInAs(page, 'office')
  const card = page.locator('[data-column="storage"] [data-stock]').filter({ hasText: 'Nordsund S6' }).first()
  const vehicleId = (await card.getAttribute('data-id'))!
  await card.locator('a').first().click()
  await expect(page.getByRole('heading', { name: "Owner's page" })).toBeVisible()
  await page.getByRole('button', { name: 'New owner link' }).click()
  const url = await page.getByTestId('owner-link-url').inputValue()
  expect(url).toMatch(/\/o\/[A-Za-z0-9_-]{43}$/)
  await expect(page.getByTestId('owner-link-code')).toHaveText(/^[2-9A-HJ-NP-Z]{5}-[2-9A-HJ-NP-Z]{5}$/)
  await expect(page.getByRole('img', { name: "QR code of the owner's link" })).toBeVisible()

  await page.goto('/board')
  await expect(page.getByRole('status').filter({ hasText: 'Live' })).toBeVisible()
  const boardCard = page.locator(`[data-id="${vehicleId}"]`)
  await expect(boardCard).toBeVisible()
  await expect(boardCard.getByTestId('owner-badge')).toHaveCount(0)

  const ownerContext = await browser.newContext({ ...devices['Pixel 7'] })
  const owner = await ownerContext.newPage()
  const ownerProblems = watchConsole(owner)
  const loaded = owner.waitForResponse((r) => r.url().includes('/api/owner/') && r.request().method() === 'GET' && !r.url().includes('/quote'))
  await owner.goto(url)
  const ownerPage = ownerPageSchema.parse(await (await loaded).json())
  await expect(owner.getByRole('heading', { name: 'Your vehicle at the yard' })).toBeVisible()
  await expect(owner.getByText('2009 Nordsund S6')).toBeVisible()

  // Next week on the yard's calendar.
  const [y, m, d] = ownerPage.yard.today.split('-').map(Number) as [number, number, number]
  const nextWeek = new Date(Date.UTC(y, m - 1, d + 7)).toISOString().slice(0, 10)
  const quoted = owner.waitForResponse((r) => r.url().includes(`/quote?date=${nextWeek}`))
  const picker = owner.getByPlaceholder('Choose a day')
  await picker.fill(nextWeek)
  await picker.press('Enter')
  const quote = await (await quoted).json()
  expect(quote.daysOnLot).toBe(ownerPage.bill!.daysOnLot + 7)
  await expect(owner.getByTestId('owner-quote')).toContainText(`$${(quote.balanceCents / 100).toLocaleString('en-US', { minimumFractionDigits: 2 })}`)

  await owner.getByText('Sign it over', { exact: true }).click()
  await owner.getByText('To the yard', { exact: true }).click()
  await owner.getByLabel('Your full name').fill('Marisol Vantongeren')
  const sent = owner.waitForResponse((r) => r.url().endsWith('/decision') && r.request().method() === 'POST')
  await owner.getByRole('button', { name: 'Send my choice' }).click()
  expect((await sent).status()).toBe(201)
  await expect(owner.getByTestId('owner-decision')).toContainText('You chose to sign it over.')

  // The office's board, never reloaded, gets the badge over its live stream.
  await expect(boardCard.getByTestId('owner-badge')).toHaveText(/Owner: sign over/)
  await ownerContext.close()
  expect(problems).toEqual([])
  expect(ownerProblems).toEqual([])
})
