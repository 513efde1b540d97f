import { expect, type Page } from '@playwright/test'
import { freshVin } from '../helpers/vins'
import { signInAs } from './helpers'

// 49 CFR 565's own sample VIN: check digit 4, model year 2005.
export const VIN = '1G4AH59H45G118341'

export async function openForm(page: Page) {
  await signInAs(page, 'dispatcher')
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Log a tow-in' }).click()
  await expect(page.getByRole('heading', { name: 'Log a tow-in' })).toBeVisible()
}

/** What the schema cannot do without, with the pin dropped on the map. */
export async function fillTheMinimum(page: Page) {
  const map = page.getByTestId('map')
  await expect(map.locator('img.leaflet-tile-loaded').first()).toBeVisible()
  const box = (await map.boundingBox())!
  await page.mouse.click(box.x + box.width * 0.6, box.y + box.height * 0.4)
  await page.getByText('Breakdown', { exact: true }).click()
  await page.getByLabel('Who asked for the tow').fill('Owner by phone')
  await page.getByLabel('VIN', { exact: true }).fill(freshVin())
  await page.getByLabel('Make', { exact: true }).fill('Nordsund')
  await page.getByLabel('Colour', { exact: true }).fill('Grey')
  await page.getByLabel('Odometer', { exact: true }).fill('90210')
  await page.getByRole('radiogroup', { name: 'Keys with the vehicle' }).getByText('Yes', { exact: true }).click()
}
