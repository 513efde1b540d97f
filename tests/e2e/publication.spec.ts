import { expect, test } from '@playwright/test'
import { PDFDocument } from 'pdf-lib'
import { apiSignIn, logFreshVehicle, signInAs, watchConsole } from './helpers'

const dayAfter = (day: string, n: number) => {
  const [y, m, d] = day.split('-').map(Number) as [number, number, number]
  return new Date(Date.UTC(y, m - 1, d + n)).toISOString().slice(0, 10)
}

// Issue 10/11: a vehicle valued over $4,000 under the demo yard's California sample (Civ. Code § 3071) is
// advertised in a newspaper before its lien sale. The office records the paper and the day it ran, files
// the publisher's affidavit, and sets the sale date — an early one refused beside the field, then one the law allows.
test('the office records the newspaper publication, its affidavit, and a sale date the law allows', async ({ page, request }) => {
  test.slow()
  const problems = watchConsole(page)
  // A vehicle of its own (fresh VIN and plate), towed in by the dispatcher; no demo vehicle is relied on.
  await apiSignIn(request, 'dispatcher')
  const { id: vehicleId } = await logFreshVehicle(request)

  await signInAs(page, 'office')
  const session = await (await page.request.get('/api/session')).json()
  const headers = { 'x-csrf-token': session.csrfToken }
  const vehicle = await (await page.request.get(`/api/vehicles/${vehicleId}`)).json()
  // Over $4,000: the branch of § 3071 that advertises the sale.
  const valued = await page.request.put(`/api/vehicles/${vehicleId}/value`, { headers, data: { version: vehicle.vehicle.version, valueCents: 650_000, source: 'Price guide, clean retail' } })
  expect(valued.status()).toBe(200)

  await page.goto(`/vehicles/${vehicleId}`)
  const section = page.getByTestId('publication-section')
  await expect(section.getByTestId('publication-state')).toHaveText('Planned — not yet in print')
  await expect(section).toContainText('§ 3071')
  await expect(section).toContainText('Requirements vary by state and locality; check with your local code and counsel.')
  await section.getByText('Text for the newspaper').click()
  await expect(section.getByTestId('publication-text')).toContainText('NOTICE OF LIEN SALE')
  await expect(section.getByTestId('publication-text')).toContainText(vehicle.vehicle.stockNumber)

  // The newspaper and the day it ran (today, on the yard's calendar).
  await section.getByRole('button', { name: 'Record a publication' }).click()
  const dialog = page.getByRole('dialog', { name: 'Record a newspaper publication' })
  await dialog.getByLabel('Newspaper').fill('Orrin Flats Ledger')
  await dialog.getByPlaceholder('Pick each day').click()
  const panel = page.locator('.el-picker-panel:visible')
  // The yard's today (its zone, not the browser's): days after it are disabled.
  const yardToday = new Intl.DateTimeFormat('en-CA', { timeZone: vehicle.yard.timeZone }).format(new Date())
  await panel.locator('td.available:not(.prev-month):not(.next-month)').filter({ hasText: new RegExp(`^${Number(yardToday.slice(8))}$`) }).click()
  await panel.getByRole('button', { name: 'OK' }).click()
  await expect(panel).toBeHidden()
  const recorded = page.waitForResponse((r) => r.url().endsWith('/publications') && r.request().method() === 'POST')
  await dialog.getByRole('button', { name: 'Save the publication' }).click()
  expect((await recorded).status()).toBe(201)
  await expect(section.getByTestId('publication-runs')).toContainText('Orrin Flats Ledger')
  await expect(section.getByTestId('publication-state')).toHaveText('Ran — affidavit still to file')

  // The publisher's affidavit, a PDF.
  const doc = await PDFDocument.create()
  doc.addPage([612, 792]).drawText('Affidavit of publication — Orrin Flats Ledger (demo)', { x: 48, y: 720, size: 12 })
  const proof = page.waitForResponse((r) => r.url().endsWith('/proof') && r.request().method() === 'POST')
  const chooser = page.waitForEvent('filechooser')
  await section.getByRole('button', { name: 'Upload the affidavit' }).click()
  await (await chooser).setFiles({ name: 'affidavit.pdf', mimeType: 'application/pdf', buffer: Buffer.from(await doc.save()) })
  expect((await proof).status()).toBe(201)
  await expect(section.getByTestId('publication-state')).toHaveText('Ran — affidavit on file')
  const file = await page.request.get((await section.getByTestId('publication-proof-open').getAttribute('href'))!)
  expect(file.headers()['content-type']).toMatch(/application\/pdf/)

  // The sale date: the day before the earliest the law allows is refused beside the field, nothing saved.
  const sale = page.getByTestId('sale-date-section')
  await expect(sale.getByTestId('sale-date-scheduled')).toHaveText('No sale date set')
  const { earliest } = (await (await page.request.get(`/api/vehicles/${vehicleId}/sale-date`)).json()) as { earliest: string }
  expect(earliest).toMatch(/^\d{4}-\d{2}-\d{2}$/)
  await sale.getByRole('button', { name: 'Set the sale date' }).click()
  const saleDialog = page.getByRole('dialog', { name: 'Lien sale date' })
  const day = saleDialog.getByPlaceholder('Pick the day')
  await day.fill(dayAfter(earliest, -1))
  await day.press('Enter')
  let put = page.waitForResponse((r) => r.url().endsWith('/sale-date') && r.request().method() === 'PUT')
  await saleDialog.getByRole('button', { name: 'Save the sale date' }).click()
  expect((await put).status()).toBe(400)
  await expect(saleDialog.locator('.el-form-item.is-error').filter({ hasText: 'Day of the sale' })).toContainText('The earliest sale date the law allows is')
  await day.fill(earliest)
  await day.press('Enter')
  put = page.waitForResponse((r) => r.url().endsWith('/sale-date') && r.request().method() === 'PUT')
  await saleDialog.getByRole('button', { name: 'Save the sale date' }).click()
  expect((await put).status()).toBe(200)
  await expect(saleDialog).toBeHidden()
  await expect(sale.getByTestId('sale-date-scheduled')).toContainText('Sale set for')
  await expect(page.getByText('Lien sale date set')).toBeVisible()
  // The one refusal the test asked for (the early sale date), and nothing else.
  expect(problems).toEqual(['Failed to load resource: the server responded with a status of 400 (Bad Request)'])
})
