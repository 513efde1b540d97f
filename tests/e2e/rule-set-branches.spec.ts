import { expect, test } from '@playwright/test'
import { signInAs, watchConsole } from './helpers'

// The California sample (server/rule-sets/samples/california.json) asks for a lien-sale application within
// 30 days of the lien arising only for vehicles valued over $4,000 (Cal. Civ. Code § 3071; the sample's
// bands as it cites them). A manager widens that branch on a copy and the preview, for a $3,000 vehicle,
// shows the step's date before anything is saved; the saved version keeps the new band.
test('the manager edits a step\'s value branch, sees the preview date appear, saves, and the value is there after a reload', async ({ page }) => {
  // A copy, the editor's first load, a save and a reload: a long walk on 2 shared cores.
  test.setTimeout(300_000)
  const problems = watchConsole(page)
  await signInAs(page, 'manager')
  const session = await (await page.request.get('/api/session')).json()
  const copied = await page.request.post('/api/settings/rule-sets/california-sample/copy', {
    headers: { 'x-csrf-token': session.csrfToken },
    data: { name: 'Wrenfield branch test' },
  })
  expect(copied.status()).toBe(201)
  const slug = (await copied.json()).id as string

  await page.goto(`/settings/rule-sets/${slug}`)
  // The editor's chunk and the holiday lists load on first visit: slow on a shared machine.
  await expect(page.getByRole('heading', { name: /Wrenfield branch test/ })).toBeVisible({ timeout: 60_000 })
  const preview = page.locator('[data-preview]')
  await page.locator('input[name="preview-value"]').fill('3000.00')
  // Every vehicle's records request has its date; the application step is not this vehicle's yet.
  await expect(preview.locator('[data-deadline="records-request"] [data-due]')).toBeVisible()
  await expect(preview.locator('[data-deadline="lien-sale-application"]')).toHaveCount(0)

  const step = page.locator('[data-step="lien-sale-application"]')
  const over = step.locator('input[name$="-value-over"]')
  await expect(over).toHaveValue('4000.00')
  await over.fill('2500.00')
  await expect(preview.locator('[data-deadline="lien-sale-application"] [data-due]')).toBeVisible()

  // A band no vehicle falls in is refused beside the field on saving, nothing is sent, and the preview waits for a fix.
  const atMost = step.locator('input[name$="-value-atMost"]')
  await atMost.fill('1000.00')
  let puts = 0
  page.on('request', (r) => {
    if (r.method() === 'PUT' && r.url().endsWith(`/api/settings/rule-sets/${slug}`)) puts++
  })
  await page.getByRole('button', { name: 'Save as version 2' }).click()
  await expect(step.getByText('No vehicle falls in this band: the upper end must be above the lower one.')).toBeVisible()
  expect(puts).toBe(0)
  await expect(preview.getByText('Fix the fields marked in red to see the preview.')).toBeVisible()
  await atMost.fill('')
  await expect(preview.locator('[data-deadline="lien-sale-application"] [data-due]')).toBeVisible()

  await page.getByLabel('Why this change (for the settings record)').fill('Counsel reads the band lower')
  const saved = page.waitForResponse((r) => r.url().endsWith(`/api/settings/rule-sets/${slug}`) && r.request().method() === 'PUT')
  await page.getByRole('button', { name: 'Save as version 2' }).click()
  expect((await saved).status()).toBe(200)
  await expect(page.getByRole('heading', { name: 'Wrenfield branch test version 2' })).toBeVisible()

  await page.reload()
  await expect(page.getByRole('heading', { name: 'Wrenfield branch test version 2' })).toBeVisible({ timeout: 60_000 })
  await expect(page.locator('[data-step="lien-sale-application"] input[name$="-value-over"]')).toHaveValue('2500.00')
  await expect(page.locator('[data-step="lien-sale-application"] input[name$="-value-atMost"]')).toHaveValue('')
  expect(problems).toEqual([])
})
