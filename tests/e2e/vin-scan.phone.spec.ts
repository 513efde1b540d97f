import { expect, test } from '@playwright/test'
import { mkdirSync } from 'node:fs'
import path from 'node:path'
import { chromiumLaunch } from './chromium'
import { writeDataMatrixVideo } from './fake-camera'
import { signInAs, watchConsole, mainNav } from './helpers'

// A real WMI and VDS (a Honda Accord in NHTSA vPIC), check digit computed.
const VIN = '1HGCM82633A004352'
// Written when the file loads, before the browser starts: Chromium reads its fake camera's picture from it.
// Under test-results/ (ignored by git), which Playwright empties at each run.
const video = path.resolve('test-results', 'vin-label.y4m')
mkdirSync(path.dirname(video), { recursive: true })
writeDataMatrixVideo(video, VIN)
test.use({
  launchOptions: {
    ...chromiumLaunch,
    args: [...chromiumLaunch.args, '--use-fake-device-for-media-stream', '--use-fake-ui-for-media-stream', `--use-file-for-fake-video-capture=${video}`],
  },
})

test('on a phone the dispatcher scans the VIN label with the camera and the vehicle fills in', async ({ page }) => {
  // The server opens its vPIC database on the first decode: on a busy machine that alone can take seconds.
  test.slow()
  const problems = watchConsole(page)
  await signInAs(page, 'dispatcher')
  await (await mainNav(page)).getByRole('link', { name: 'Log a tow-in' }).tap()
  const decoded = page.waitForResponse((r) => r.url().endsWith(`/api/vin-decode/${VIN}`) && r.ok())
  await page.getByRole('button', { name: 'Scan' }).tap()
  await expect(page.getByLabel('VIN', { exact: true })).toHaveValue(VIN)
  await expect(page.getByRole('dialog', { name: 'Scan the VIN barcode' })).toBeHidden()
  await decoded
  await expect(page.getByLabel('Make', { exact: true })).toHaveValue('Honda')
  await expect(page.getByTestId('vin-status')).toHaveText('Check digit correct. Model year 2003.')
  expect(problems).toEqual([])
})
