import { spawn, type ChildProcess } from 'node:child_process'
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { expect, test } from '@playwright/test'
import { expectAccessible, watchConsole } from './helpers'

// Issue 12, "Settings": a fresh install without the demo is set up from the browser. This spec starts a
// server of its own (the built one, as scripts/e2e-server.mjs does) on an empty data directory with
// HOLDFAST_DEMO=0, so no company exists; the sign-in page sends the visitor to the first-run page.
const port = Number(process.env.E2E_FIRST_RUN_PORT ?? 5223)
const base = `http://127.0.0.1:${port}`
let server: ChildProcess
let dataDir: string

test.beforeAll(async () => {
  dataDir = mkdtempSync(path.join(tmpdir(), 'holdfast-e2e-first-run-'))
  server = spawn(process.execPath, ['dist/server/index.js'], {
    stdio: ['ignore', 'ignore', 'inherit'],
    env: { ...process.env, PORT: String(port), HOST: '127.0.0.1', HOLDFAST_DATA_DIR: dataDir, HOLDFAST_DEMO: '0', LOG_LEVEL: 'warn' },
  })
  // Ready once its health answers (a fresh directory is migrated first).
  await expect
    .poll(
      async () =>
        fetch(`${base}/api/health`).then(
          (r) => r.status,
          () => 0,
        ),
      { timeout: 120_000 },
    )
    .toBe(200)
})

test.afterAll(async () => {
  if (server && server.exitCode === null) {
    const exited = new Promise((resolve) => server.once('exit', resolve))
    server.kill('SIGTERM')
    await exited
  }
  rmSync(dataDir, { recursive: true, force: true })
})

test('the first manager sets up the company and its first yard, and lands signed in on its board', async ({ page }) => {
  const problems = watchConsole(page)
  await page.goto(`${base}/`)
  await expect(page).toHaveURL(/\/first-run$/)
  await expect(page.getByRole('heading', { name: 'Set up your yard' })).toBeVisible()

  // Sent empty: every field the manager must fill is named.
  await page.getByRole('button', { name: 'Set up and sign in' }).click()
  await expect(page.getByText('Enter the company name.')).toBeVisible()
  await expect(page.getByText('Give the yard a name.')).toBeVisible()
  // Issue 16 item 17: the page passes axe (WCAG 2.2 AA), its field messages showing.
  await expectAccessible(page)

  await page.getByLabel('Company name').fill('Quarry Road Towing')
  await page.getByLabel('Name', { exact: true }).fill('Quarry Road lot')
  // The stock-number prefix follows the yard's initials.
  await expect(page.getByLabel('Stock-number prefix')).toHaveValue('QRL')
  // The yard is placed by its address: the search fills the address and the position, and the pin shows it.
  await page.getByLabel("Find the yard's address").fill('45 Cinder')
  await page.getByRole('option', { name: '45 Cinder Ln, Orrin Flats' }).click()
  await expect(page.getByLabel('Address', { exact: true })).toHaveValue('45 Cinder Ln, Orrin Flats')
  await expect(page.getByLabel('Latitude')).toHaveValue('36.41090')
  await expect(page.getByLabel('Longitude')).toHaveValue('-119.34550')
  await expect(page.getByTestId('map').locator('.leaflet-marker-pane [data-testid="map-pin"]')).toBeVisible()
  // The rule set: the shipped samples, each with its caution; the manager picks Florida's.
  // The yard's address names no state (the demo town's geocoder): the first sample is offered.
  const ruleSet = page.getByRole('combobox', { name: 'Rule set the yard starts from' })
  await expect(page.locator('.el-select__wrapper', { has: ruleSet })).toContainText('California (sample)')
  await page.locator('.el-select__wrapper', { has: ruleSet }).click()
  await page.getByRole('option', { name: /Florida \(sample\)/ }).click()
  await expect(page.getByTestId('rule-set-where')).toContainText('State of Florida, USA')
  await expect(page.getByTestId('rule-set-caution')).toContainText('Sample — verify with your local code.')
  await page.getByLabel('Rows').fill('2')
  await page.getByLabel('Spaces in each row').fill('5')
  await page.getByLabel('Your name').fill('Rosa Quarry')
  await page.getByLabel('E-mail').fill('rosa@quarry-road.example')
  await page.getByLabel('Password', { exact: true }).fill('gravel-pit-owl-93')

  const setUp = page.waitForResponse((r) => r.url().endsWith('/api/first-run') && r.request().method() === 'POST')
  const signedIn = page.waitForResponse((r) => r.url().endsWith('/api/session') && r.request().method() === 'POST')
  await page.getByRole('button', { name: 'Set up and sign in' }).click()
  expect((await setUp).status()).toBe(201)
  expect((await signedIn).status()).toBe(200)
  await expect(page).toHaveURL(/\/board$/)
  await expect(page.getByRole('heading', { name: 'Quarry Road lot', level: 1 })).toBeVisible()
  await expect(page.getByTestId('who')).toContainText('Rosa Quarry')
  // Saved where the search placed it, under the sample chosen.
  const yards = (await (await page.request.get(`${base}/api/settings/yards`)).json()).yards
  expect(yards).toEqual([expect.objectContaining({ name: 'Quarry Road lot', address: '45 Cinder Ln, Orrin Flats', lat: 36.4109, lng: -119.3455, ruleSetName: 'Florida (sample)' })])

  // Set up once: the first-run page now sends everyone to sign-in, and the route refuses.
  expect((await page.request.get(`${base}/api/first-run`)).ok()).toBe(true)
  expect(await (await page.request.get(`${base}/api/first-run`)).json()).toEqual({ needed: false })
  expect(problems).toEqual([])
})
