import { expect, test } from '@playwright/test'
import { logFreshVehicle, signInAs, watchConsole } from './helpers'

// Issue 11, card payments: a freshly logged vehicle; the clerk takes part of the bill in cash and the
// rest by card on the payment service's hosted page (the app's local stand-in, reached through the SDK),
// and the bill says paid in full once the service's signed webhook has been recorded.
test.describe.configure({ timeout: 360_000 })

test('part in cash, the rest by card on the hosted page: the bill is paid in full and the card has its reference', async ({ page }) => {
  const problems = watchConsole(page)
  await signInAs(page, 'manager')
  const { id: vehicleId } = await logFreshVehicle(page.request)

  await page.goto(`/vehicles/${vehicleId}`)
  const bill = page.getByTestId('billing')
  await expect(bill.getByTestId('billing-due')).toContainText('Balance due')

  await bill.getByRole('button', { name: 'Take a payment' }).click()
  const cash = page.getByRole('dialog', { name: 'Take a payment' })
  await cash.getByRole('radio', { name: 'Cash' }).check({ force: true })
  await cash.getByLabel('Amount paid').fill('50.00')
  const paidCash = page.waitForResponse((r) => r.url().endsWith('/payments') && r.request().method() === 'POST')
  await cash.getByRole('button', { name: 'Record the payment' }).click()
  expect((await paidCash).status()).toBe(201)
  await expect(bill.getByTestId('invoice-paid')).toHaveText('-$50.00')
  const rest = (await bill.getByTestId('invoice-due').innerText()).trim()

  // The rest by card: the dialog offers what is still due; an amount above it is refused beside the field.
  await bill.getByTestId('card-checkout').click()
  const card = page.getByRole('dialog', { name: 'Card on the payment page' })
  await expect(card.locator('input[name="cardAmount"]')).toHaveValue(rest.replace(/[$,]/g, ''))
  await card.locator('input[name="cardAmount"]').fill('99999.00')
  await card.getByRole('button', { name: 'Open the payment page' }).click()
  await expect(card.getByText(/more than is due/)).toBeVisible()
  await card.locator('input[name="cardAmount"]').fill(rest.replace(/[$,]/g, ''))
  await card.getByRole('button', { name: 'Open the payment page' }).click()

  await page.waitForURL(/\/pay\/cs_test_/)
  await expect(page.getByRole('heading', { name: 'Test payment' })).toBeVisible()
  await expect(page.getByText(rest).first()).toBeVisible()
  await page.getByLabel('Card number').fill('4000 0000 0000 0002')
  await page.getByRole('button', { name: /^Pay \$/ }).click()
  await expect(page.getByRole('alert')).toContainText('declined')
  await page.getByLabel('Card number').fill('4242 4242 4242 4242')
  await page.getByRole('button', { name: /^Pay \$/ }).click()

  await page.waitForURL(new RegExp(`/vehicles/${vehicleId}`))
  await expect(page.getByTestId('card-return')).toContainText(`Card payment of ${rest} received and recorded.`)
  await expect(bill.getByTestId('billing-due')).toContainText('Paid in full')
  await expect(bill.getByTestId('invoice-due')).toHaveText('$0.00')
  await expect(bill.getByTestId('payments')).toContainText(`${rest} Card on the payment page`)
  // The one refusal the test asked for (the over-payment) is the only failed request.
  expect(problems).toEqual(['Failed to load resource: the server responded with a status of 400 (Bad Request)'])
})
