import { expect, test, type Page } from '@playwright/test'
import { anotherVehicle, towInBody } from '../helpers/tow-in'
import { DEMO, watchConsole } from './helpers'

// A manager on a 390 px phone reading Spanish gives back a card payment made on the hosted page. The
// payment's row on the bill once pushed its buttons past the screen's edge, and the refund dialog's long
// Spanish send button ("Reembolsar por el servicio de pagos") pushed the whole dialog past it, out of reach.
test.use({ locale: 'es-ES', viewport: { width: 390, height: 844 } })
test.describe.configure({ timeout: 240_000 })

async function signInInSpanish(page: Page) {
  await page.goto('/sign-in')
  await page.getByLabel('Correo electrónico').fill(DEMO.manager)
  await page.getByLabel('Contraseña', { exact: true }).fill(DEMO.password)
  await page.getByRole('button', { name: 'Entrar' }).click()
  await expect(page).toHaveURL(/\/(board|today)/)
}

const sideways = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)

test('en un teléfono en español: la fila del pago con tarjeta y el reembolso caben en la pantalla, y el reembolso se hace', async ({ page }) => {
  const problems = watchConsole(page)
  await signInInSpanish(page)
  const session = await (await page.request.get('/api/session')).json()
  const created = await page.request.post('/api/vehicles', { headers: { 'x-csrf-token': session.csrfToken }, data: towInBody(session.user.id, anotherVehicle) })
  expect(created.status()).toBe(201)
  const vehicleId = (await created.json()).id as string
  // $50.00 paid by card on the payment service's hosted page (the local stand-in), recorded by its webhook.
  const opened = await page.request.post(`/api/vehicles/${vehicleId}/card-checkouts`, {
    headers: { 'x-csrf-token': session.csrfToken },
    data: { idempotencyKey: crypto.randomUUID(), amountCents: 5_000, receiptEmail: null, language: 'es' },
  })
  expect(opened.status()).toBe(201)
  const paid = await fetch((await opened.json()).checkout.url, { method: 'POST', body: new URLSearchParams({ card: '4242424242424242' }), redirect: 'manual' })
  expect(paid.status).toBe(303)

  await page.goto(`/vehicles/${vehicleId}`)
  const bill = page.getByTestId('billing')
  const refund = bill.getByRole('button', { name: 'Reembolsar a la tarjeta' })
  await expect(refund).toBeVisible()
  for (const button of [refund, bill.getByRole('link', { name: 'Recibo' })]) {
    const box = (await button.boundingBox())!
    expect(box.x + box.width).toBeLessThanOrEqual(390)
  }
  expect(await sideways(page)).toBe(0)

  await refund.click()
  const dialog = page.getByRole('dialog', { name: 'Reembolsar un pago con tarjeta' })
  const send = dialog.getByRole('button', { name: 'Reembolsar por el servicio de pagos' })
  await expect(send).toBeInViewport({ ratio: 1 })
  await expect(dialog.getByRole('button', { name: 'Cancelar' })).toBeInViewport({ ratio: 1 })
  expect((await dialog.boundingBox())!.width).toBe(390)
  await dialog.getByLabel('Por qué se devuelve el dinero').fill('Un día de almacenaje cobrado de más')
  const answered = page.waitForResponse((r) => r.url().endsWith('/card-refunds') && r.request().method() === 'POST')
  await send.click()
  expect((await answered).status()).toBe(201)
  await expect(page.getByText('$50.00 reembolsados a la tarjeta.')).toBeVisible()
  await expect(dialog).toBeHidden()
  expect(problems).toEqual([])
})
