import path from 'node:path'
import { readFileSync } from 'node:fs'
import { devices, expect, test } from '@playwright/test'
import sharp from 'sharp'
import { readQrOfPdf } from '../helpers/pdf'
import { WALK_IN_INTERACTIONS } from '../helpers/walk-in'
import { CounterTally, fakeCameraLaunch, scanAndRecordOut } from './counter'
import { writeQrVideo } from './fake-camera'
import { apiSignIn, logFreshVehicle, signInAs, watchConsole } from './helpers'

// Issue 11: "an office clerk can take a walk-in owner from 'I'm here for my car' to the car leaving the gate
// in a few minutes". The demo yard (California sample: the vehicle owes its tow and a day's storage), a
// vehicle towed in a few minutes ago, and its owner at the counter. The clerk finds it by plate, sends it
// to Release, takes part in cash and the rest by card on the payment service's hosted page (the app's local
// stand-in), records the ID with its photo; the owner signs; the release form downloads and the gate pass
// prints; the gate's phone scans the pass and the card leaves the board on the desk's other tab. Every
// interaction at the counter is counted (CounterTally) and must match tests/helpers/walk-in.ts, the
// figures `npm run bench -- counter` reports against the goal.
test.describe.configure({ timeout: 360_000 })

const video = path.resolve('test-results', 'walk-in-gate-pass.y4m')
test.use({ launchOptions: fakeCameraLaunch(video) })

test('a walk-in owner: found by plate, part cash and the rest by card, ID, signature, release form, gate pass scanned, off the board', async ({ browser, request }) => {
  // A vehicle of its own (a fresh VIN and plate), towed in five minutes ago: no demo position is touched.
  const desk = await browser.newContext({ ...devices['Desktop Chrome'], acceptDownloads: true })
  const board = await desk.newPage()
  const problems = watchConsole(board)
  // The dispatcher logged it with a photo (a clerk does not log tow-ins).
  await apiSignIn(request, 'dispatcher')
  const front = await sharp({ create: { width: 320, height: 200, channels: 3, background: '#3e6a8a' } }).jpeg().toBuffer()
  const { id, stockNumber, plate } = await logFreshVehicle(request, { photo: front })
  await signInAs(board, 'office')
  await expect(board.getByText(stockNumber)).toBeVisible()

  // The counter, a second tab of the same desk. From here on every interaction is counted.
  const counter = await desk.newPage()
  problems.push(...watchConsole(counter))
  const tally = new CounterTally(counter)
  await counter.goto('/today')

  tally.at('find')
  const search = counter.getByRole('textbox', { name: /Find a vehicle/ })
  await tally.fill(search, plate)
  await expect(counter.locator('.shell-search__popper').getByRole('option')).toHaveCount(1)
  await tally.press(search, 'Enter')
  await expect(counter).toHaveURL(new RegExp(`/vehicles/${id}$`))
  await expect(counter.getByTestId('vehicle-state')).toHaveText('Arrival')
  await expect(search).toHaveValue('')
  await expect(counter.locator('.shell-search__popper')).toBeHidden()

  tally.at('toRelease')
  await tally.click(counter.getByTestId('vehicle-move'))
  const move = counter.getByRole('dialog')
  await expect(move).toBeVisible()
  // The one move an office clerk may make from Arrival, so the dialog has it chosen already.
  await expect(move.getByLabel('Owner collects — go to Release')).toBeChecked()
  const moved = counter.waitForResponse((r) => r.url().endsWith(`/vehicles/${id}/moves`) && r.request().method() === 'POST')
  await tally.click(move.getByRole('button', { name: 'Owner collects — go to Release' }))
  expect((await moved).status()).toBe(200)
  await expect(counter.getByTestId('vehicle-state')).toHaveText('Release')

  // Part in cash: $100.00 of it, with $120 handed over.
  tally.at('cash')
  const bill = counter.getByTestId('billing')
  await expect(bill.getByTestId('billing-due')).toContainText('Balance due')
  const owed = (await bill.getByTestId('invoice-due').innerText()).trim()
  await tally.click(bill.getByRole('button', { name: 'Take a payment' }))
  const cash = counter.getByRole('dialog', { name: 'Take a payment' })
  await expect(cash.getByRole('radio', { name: 'Cash' })).toBeChecked()
  await tally.fill(cash.getByLabel('Amount paid'), '100.00')
  await tally.fill(cash.getByLabel('Cash handed over'), '120')
  await expect(cash.getByTestId('change')).toHaveText('Give back in change: $20.00')
  const paidCash = counter.waitForResponse((r) => r.url().endsWith('/payments') && r.request().method() === 'POST')
  await tally.click(cash.getByRole('button', { name: 'Record the payment' }))
  expect((await paidCash).status()).toBe(201)
  await expect(counter.getByText('Payment of $100.00 recorded. Give $20.00 in change.')).toBeVisible()
  await expect(bill.getByTestId('invoice-paid')).toHaveText('-$100.00')
  const rest = (await bill.getByTestId('invoice-due').innerText()).trim()
  expect(rest).not.toBe(owed)

  // The rest by card, on the payment service's hosted page: the customer types the card there.
  tally.at('card')
  await tally.click(bill.getByTestId('card-checkout'))
  const card = counter.getByRole('dialog', { name: 'Card on the payment page' })
  await expect(card.locator('input[name="cardAmount"]')).toHaveValue(rest.replace(/[$,]/g, ''))
  await tally.click(card.getByRole('button', { name: 'Open the payment page' }))
  await counter.waitForURL(/\/pay\/cs_test_/)
  await expect(counter.getByText(rest).first()).toBeVisible()
  await tally.fill(counter.getByLabel('Card number'), '4242 4242 4242 4242', 'customer')
  await tally.click(counter.getByRole('button', { name: /^Pay \$/ }), 'customer')
  await counter.waitForURL(new RegExp(`/vehicles/${id}`))
  await expect(counter.getByTestId('card-return')).toContainText(`Card payment of ${rest} received and recorded.`)
  await expect(bill.getByTestId('billing-due')).toContainText('Paid in full')
  const section = counter.getByTestId('release-section')
  await expect(section.getByTestId('release-step-balance')).toContainText('Done')

  tally.at('claimant')
  await tally.click(section.getByTestId('release-claimant'))
  const who = counter.getByRole('dialog', { name: 'Who is collecting' })
  await tally.fill(who.getByTestId('claimant-name'), 'Marisol Vantongeren')
  await tally.fill(who.getByTestId('claimant-id-number'), 'D5520981')
  await tally.fill(who.getByTestId('claimant-id-issuer'), 'California')
  await tally.fill(who.locator('.el-date-editor input'), '2031-08-31')
  await tally.press(who.locator('.el-date-editor input'), 'Enter')
  await tally.fill(who.getByTestId('claimant-authority'), `Registration card, plate ${plate}`)
  await tally.click(who.getByRole('button', { name: 'Save' }))
  await expect(section.getByTestId('release-step-claimant')).toContainText('Done')

  tally.at('idPhoto')
  const licence = await sharp({ create: { width: 400, height: 250, channels: 3, background: '#c9822b' } }).jpeg().toBuffer()
  await tally.chooseFile(section.getByRole('button', { name: 'Add the ID photo' }), section.getByTestId('release-id-file'), { name: 'licence.jpg', mimeType: 'image/jpeg', buffer: licence })
  await expect(section.getByTestId('release-step-id-photo')).toContainText('Done')
  await expect(section.getByRole('img', { name: "Photo of the claimant's ID" })).toBeVisible()

  tally.at('handover')
  await tally.click(section.getByTestId('release-handover'))
  const handover = counter.getByRole('dialog', { name: 'Odometer and property at release' })
  await tally.fill(handover.getByTestId('handover-odometer').locator('input'), '168410')
  await tally.click(handover.getByRole('button', { name: 'Save' }))
  await expect(section.getByTestId('release-step-handover')).toContainText('Done')

  tally.at('signature')
  await tally.click(section.getByTestId('release-sign'))
  const sign = counter.getByRole('dialog', { name: 'Sign the release' })
  await tally.sign(sign.getByTestId('signature-pad'))
  await tally.click(sign.getByRole('button', { name: 'Save the signature' }))
  await expect(section.getByTestId('release-step-signature')).toContainText('Signed by Marisol Vantongeren')

  tally.at('releaseForm')
  const [download] = await Promise.all([counter.waitForEvent('download'), tally.click(section.getByTestId('release-form'))])
  expect(download.suggestedFilename()).toBe(`release-${stockNumber}.pdf`)
  expect(readFileSync((await download.path())!).subarray(0, 5).toString()).toBe('%PDF-')

  tally.at('gatePass')
  await expect(section.getByTestId('release-gate')).toContainText('Everything is done')
  const answer = counter.waitForResponse((r) => r.url().includes('/release/gate-pass') && r.status() === 201)
  const [printed] = await Promise.all([counter.waitForEvent('popup'), tally.click(section.getByTestId('release-gate-pass'))])
  await printed.close()
  await expect(section.getByTestId('release-gate-issued')).toContainText(/code [2-9A-Z]{5}-[2-9A-Z]{5}/)

  // The counter's part is done: what was counted is what the bench reports.
  expect(tally.byStep()).toEqual(WALK_IN_INTERACTIONS)

  // The printed pass's QR, read off its PDF and held to the gate phone's camera.
  const link = await readQrOfPdf(Buffer.from((await (await answer).json()).pdf, 'base64'), 'walk-in-gate-pass')
  expect(link).toMatch(/\/g\/[A-Za-z0-9_-]{43}$/)
  writeQrVideo(video, link)
  const phone = await browser.newContext({ ...devices['Pixel 7'] })
  const gate = await phone.newPage()
  problems.push(...watchConsole(gate))
  await signInAs(gate, 'office', '/gate')
  await scanAndRecordOut(gate, { stockNumber, claimant: 'Marisol Vantongeren', closedAs: 'Returned to owner' }, 'test-results/walk-in-gate-phone.png')

  // The board in the desk's first tab hears of it and drops the card, with no reload.
  await expect(board.getByText(stockNumber)).toHaveCount(0)
  expect(problems).toEqual([])
  await desk.close()
  await phone.close()
})
