import { expect, test, type APIRequestContext } from '@playwright/test'
import { navLink, signInAs, watchConsole } from './helpers'
import { freshVin } from '../helpers/vins'

type Line = { code: string; unitCents: number }

/** A passenger car towed in just now (invented demo data). */
function towIn(checkedById: string) {
  const minutesAgo = (n: number) => new Date(Date.now() - n * 60_000).toISOString()
  const vin = freshVin()
  return {
    tow: {
      pickup: { lat: 36.4231, lng: -119.3377, address: 'Marlow Blvd & Kettle Ave, Orrin Flats' },
      roadMiles: null,
      winchingUnits: 0,
      dollies: false,
      afterHours: false,
      calledAt: minutesAgo(60),
      hookedAt: minutesAgo(30),
      arrivedAt: minutesAgo(5),
      reason: 'breakdown',
      requesterName: 'Owner by phone',
    },
    vehicle: { vin, plate: `8R${vin.slice(-5)}`, plateState: 'CA', year: 2005, make: 'Orlan', model: 'Sparrow', colour: 'Silver', vehicleClass: 'standard', odometer: 90_210, keys: 'yes' },
    holds: [],
    condition: { checkedById, property: [] },
    spaceId: null,
  }
}
async function storageRate(request: APIRequestContext, vehicleId: string): Promise<number> {
  const res = await request.get(`/api/vehicles/${vehicleId}/invoice`)
  expect(res.status()).toBe(200)
  return ((await res.json()).invoice.lines as Line[]).find((l) => l.code === 'storage')!.unitCents
}

// The demo yard bills under the California sample, whose rates are sample figures (no statewide rate is
// published: server/rule-sets/samples/california.json). The manager copies it, sets the daily rate of a
// passenger car, watches the preview follow, saves and uses the copy at the yard: a tow-in logged next
// bills at the new rate, and a vehicle already on the lot keeps the rate of the version it arrived under.
test('the manager copies a sample rule set, changes the daily rate with a live preview, saves, and only new tow-ins take it', async ({ page, browser }) => {
  // Copy, two edits with the preview, a new fee, save, switch, a tow-in, the record: a long walk on 2 shared cores.
  test.setTimeout(240_000)
  const problems = watchConsole(page)
  await signInAs(page, 'manager')
  await (await navLink(page, 'Settings')).click()
  await expect(page.getByRole('heading', { name: 'Settings', exact: true })).toBeVisible()
  await expect(page.getByText('Every value here is a sample until you set your own')).toBeVisible()

  const sample = page.locator('[data-rule-set="california-sample"]')
  await expect(sample.getByText('In use at your yard')).toBeVisible()
  await sample.getByRole('button', { name: 'Copy' }).click()
  const dialog = page.getByRole('dialog', { name: 'Copy California (sample)' })
  await dialog.getByLabel('Name of the copy').fill('Tamsin Creek rates')
  await dialog.getByRole('button', { name: 'Make the copy' }).click()
  await expect(page).toHaveURL(/\/settings\/rule-sets\/tamsin-creek-rates-[0-9a-f]{6}$/)
  await expect(page.getByRole('heading', { name: /Tamsin Creek rates/ })).toBeVisible()
  const slug = page.url().split('/').pop()!

  // The preview: a passenger car, three days and two hours on the lot, billed in the browser.
  const preview = page.locator('[data-preview]')
  const storageLine = preview.locator('[data-line="storage"]')
  await expect(storageLine).toBeVisible()
  const before = await preview.locator('[data-preview-total]').textContent()
  const rate = page.locator('input[name="rate-standard"]')
  await expect(rate).toHaveValue('65.00')
  await rate.fill('77.00')
  await expect(preview.locator('[data-preview-total]')).not.toHaveText(before!)
  // The storage line counts its days at the rate just typed.
  await expect(storageLine).toContainText('× $77.00')

  // A refused value is named beside its field and nothing is sent.
  await rate.fill('-1')
  await expect(preview.getByText('Fix the fields marked in red to see the preview.')).toBeVisible()
  await page.getByRole('button', { name: 'Save as version 2' }).click()
  await expect(page.getByText('An amount cannot be negative.')).toBeVisible()
  await rate.fill('77.00')
  await expect(page.getByText('An amount cannot be negative.')).toHaveCount(0)

  // A fee of the yard's own, added: refused without its citation, then shown in the preview's bill.
  const fees = page.locator('[data-fee]')
  const feeCount = await fees.count()
  await page.getByRole('button', { name: 'Add a fee' }).click()
  await expect(fees).toHaveCount(feeCount + 1)
  const fee = fees.last()
  const feeCode = (await fee.getAttribute('data-fee'))!
  await fee.getByLabel('Fee', { exact: true }).fill('Gate opened after hours')
  await fee.locator(`input[name="fee-${feeCode}"]`).fill('25.00')
  await expect(preview.getByText('Fix the fields marked in red to see the preview.')).toBeVisible()
  await fee.getByLabel('Citation').fill('Yard policy (common trade practice)')
  await expect(preview.locator(`[data-line="${feeCode}"]`)).toContainText('$25.00')

  await page.getByLabel('Why this change (for the settings record)').fill('Rates the city approved')
  const saved = page.waitForResponse((r) => r.url().endsWith(`/api/settings/rule-sets/${slug}`) && r.request().method() === 'PUT')
  await page.getByRole('button', { name: 'Save as version 2' }).click()
  expect((await saved).status()).toBe(200)
  // The page now shows the saved version (the 3-second notice may be gone on a busy machine).
  await expect(page.getByRole('heading', { name: 'Tamsin Creek rates version 2' })).toBeVisible()
  const savedSet = await (await page.request.get(`/api/settings/rule-sets/${slug}`)).json()
  expect(savedSet.ruleSet.fees.find((f: { code: string }) => f.code === feeCode)).toMatchObject({ label: 'Gate opened after hours', amountCents: 2_500 })

  await page.getByRole('link', { name: 'All rule sets' }).click()
  const copy = page.locator(`[data-rule-set="${slug}"]`)
  await copy.getByRole('button', { name: 'Use at your yard' }).click()
  await page.getByRole('dialog').getByRole('button', { name: 'Use at your yard' }).click()
  await expect(copy.getByText('In use at your yard')).toBeVisible()

  // A vehicle already on the lot (the demo's, under California version 1) keeps its rate.
  const board = await (await page.request.get('/api/board')).json()
  const old = board.columns.flatMap((c: { cards: { id: string }[] }) => c.cards)[0].id as string
  const oldPage = await (await page.request.get(`/api/vehicles/${old}`)).json()
  const california = await (await page.request.get('/api/settings/rule-sets/california-sample')).json()
  const oldClassRate = california.ruleSet.vehicleClasses.find((c: { code: string }) => c.code === oldPage.vehicle.vehicleClass).dailyRateCents
  expect(await storageRate(page.request, old)).toBe(oldClassRate)

  // A tow-in logged now, by the dispatcher (its form has tests of its own), bills at the new rate.
  const dispatcher = await browser.newContext()
  const d = await dispatcher.newPage()
  await signInAs(d, 'dispatcher')
  const session = await (await d.request.get('/api/session')).json()
  const logged = await d.request.post('/api/vehicles', { headers: { 'x-csrf-token': session.csrfToken }, data: towIn(session.user.id) })
  expect(logged.status(), await logged.text()).toBe(201)
  const fresh = (await logged.json()).id as string
  await dispatcher.close()
  expect(await storageRate(page.request, fresh)).toBe(7_700)
  expect(await storageRate(page.request, old)).toBe(oldClassRate)

  // Both changes are in the settings record, with before and after.
  await page.getByRole('link', { name: 'Settings changes' }).click()
  const rows = page.locator('.settings-audit__table tbody tr')
  await expect(rows.first()).toContainText('Chose the rule set')
  await expect(rows.nth(1)).toContainText('Saved a new version')
  // Read as a person reads it: the class by its name, the rate as money, the new fee by its name.
  await expect(rows.nth(1)).toContainText('— daily rate')
  await expect(rows.nth(1)).toContainText('$65.00')
  await expect(rows.nth(1)).toContainText('$77.00')
  await expect(rows.nth(1)).toContainText('Gate opened after hours')
  await expect(rows.nth(1)).toContainText('Rates the city approved')

  // Put the demo yard back on the sample for the tests that follow on this server.
  await (await navLink(page, 'Settings')).click()
  await page.locator('[data-rule-set="california-sample"]').getByRole('button', { name: 'Use at your yard' }).click()
  await page.getByRole('dialog').getByRole('button', { name: 'Use at your yard' }).click()
  await expect(page.locator('[data-rule-set="california-sample"]').getByText('In use at your yard')).toBeVisible()
  expect(problems).toEqual([])
})
