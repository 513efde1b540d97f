import { expect, test } from '@playwright/test'
import { signInAs, watchConsole, mainNav } from './helpers'

test('on a phone the dispatcher reaches the tow-in form, taps the pickup on the map and can use the camera', async ({ page }) => {
  const problems = watchConsole(page)
  await signInAs(page, 'dispatcher')
  await (await mainNav(page)).getByRole('link', { name: 'Log a tow-in' }).tap()
  await expect(page.getByRole('heading', { name: 'Log a tow-in' })).toBeVisible()

  const map = page.getByTestId('map')
  await expect(map.locator('img.leaflet-tile-loaded').first()).toBeVisible()
  const box = (await map.boundingBox())!
  await page.touchscreen.tap(box.x + box.width * 0.3, box.y + box.height * 0.6)
  await expect(map.locator('.leaflet-marker-pane [data-testid="map-pin"]')).toBeVisible()
  await expect(page.getByTestId('tow-total')).toBeVisible()

  // One column: nothing wider than the screen, so nothing needs a sideways scroll.
  const widths = await page.evaluate(() => [document.documentElement.scrollWidth, document.documentElement.clientWidth])
  expect(widths[0]).toBeLessThanOrEqual(widths[1]!)
  await expect(page.locator('input[type=file][capture=environment]')).toHaveCount(1)
  await expect(page.getByRole('button', { name: 'Log the vehicle' })).toBeInViewport()
  expect(problems).toEqual([])
})

test('on a phone a time picker opens whole with OK on the screen, and Now beside the field is the yard clock', async ({ page }) => {
  await signInAs(page, 'dispatcher')
  await (await mainNav(page)).getByRole('link', { name: 'Log a tow-in' }).tap()
  const called = page.getByLabel('Called', { exact: true })
  await called.tap()
  const panel = page.locator('.el-picker-panel').filter({ visible: true })
  await expect(panel.getByRole('button', { name: 'OK' })).toBeInViewport({ ratio: 1 })
  // The panel's own "Now" would be the phone's clock, not the yard's: it is not offered.
  await expect(panel.getByRole('button', { name: 'Now' })).toBeHidden()
  await page.keyboard.press('Escape')
  await expect(panel).toBeHidden()

  const field = page.locator('.el-form-item').filter({ has: called })
  await field.getByRole('button', { name: 'Now' }).tap()
  const yardNow = (offsetMs: number) =>
    new Intl.DateTimeFormat('en-GB', { timeZone: 'America/Los_Angeles', day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' })
      .format(new Date(Date.now() + offsetMs))
  const earliest = yardNow(0)
  await expect(called).not.toHaveValue('')
  expect([earliest, yardNow(60_000)]).toContain(await called.inputValue())
})
