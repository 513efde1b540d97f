import { expect, test } from '@playwright/test'
import { boardBodySchema } from '@shared/schemas/board'
import { DEMO, watchConsole } from './helpers'

// A phone whose browser reads Spanish: the board, a vehicle's history and two refusals — the shared
// lifecycle's (why a move cannot be made now) and the server's (a 422 with its code) — read in Spanish.
test.use({ locale: 'es-ES' })

test.setTimeout(90_000)

test('en un teléfono en español: del tablero al historial de un vehículo retenido, y sus rechazos en español', async ({ page }) => {
  const problems = watchConsole(page)
  await page.goto('/sign-in?next=/board')
  await page.getByLabel('Correo electrónico').fill(DEMO.manager)
  await page.getByLabel('Contraseña', { exact: true }).fill(DEMO.password)
  await page.getByRole('button', { name: 'Entrar' }).click()
  // The path itself, not the sign-in page's own next=/board.
  await expect(page).toHaveURL(/^[^?]*\/board$/)
  await expect(page.getByRole('navigation', { name: 'Columnas' }).getByRole('button').first()).toContainText('Llegada')

  // A vehicle in Arrival under a police hold.
  const board = boardBodySchema.parse(await page.evaluate(async () => (await fetch('/api/board')).json()))
  const held = board.columns.find((c) => c.column === 'arrival')!.cards.find((c) => c.holds.some((h) => h.kind === 'law_enforcement'))!
  expect(held).toBeDefined()
  // A value on record, so that saving it again changes nothing (set through the API when the demo has none).
  const session = await (await page.request.get('/api/session')).json()
  const current = await (await page.request.get(`/api/vehicles/${held.id}`)).json()
  if (current.vehicle.valueCents == null) {
    const valued = await page.request.put(`/api/vehicles/${held.id}/value`, { headers: { 'x-csrf-token': session.csrfToken }, data: { version: current.vehicle.version, valueCents: 320_000, source: 'Price guide' } })
    expect(valued.status()).toBe(200)
  }
  const card = page.locator(`[data-stock="${held.stockNumber}"]`)
  await expect(card).toBeVisible()
  await card.getByRole('link').first().tap()
  await expect(page).toHaveURL(new RegExp(`/vehicles/${held.id}$`))

  // The history: kinds, the tow reason and the hold in words, no codes.
  const history = page.getByTestId('history')
  await expect(history).toContainText('Ingresó por arrastre')
  await expect(history).toContainText('A pedido de la policía')
  await expect(history).toContainText('Retención puesta')
  await expect(history).toContainText('Retención policial')
  await expect(history).not.toContainText(/law.enforcement|standard|motorcycle/)
  await history.scrollIntoViewIfNeeded()
  await page.screenshot({ path: 'test-results/spanish-history-phone.png' })

  // The lifecycle refuses Entrega while the hold stands, and says so in Spanish.
  await page.getByTestId('vehicle-move').tap()
  const moves = page.getByRole('dialog')
  await expect(moves).toContainText(/Retención policial \(.+\), puesta hasta el .+: no puede pasar a Entrega\./)
  await page.screenshot({ path: 'test-results/spanish-move-refused-phone.png' })
  await page.keyboard.press('Escape')
  await expect(moves).toBeHidden()

  // The server refuses a value that changes nothing (422, code nothingChanged): the dialog says it in Spanish.
  await page.getByRole('button', { name: 'Anotar el valor' }).tap()
  const value = page.getByRole('dialog', { name: 'Valor del vehículo' })
  await expect(value.locator('input[name="valueAmount"]')).not.toHaveValue('')
  const refused = page.waitForResponse((r) => r.url().endsWith(`/api/vehicles/${held.id}/value`) && r.status() === 422)
  await value.getByRole('button', { name: 'Guardar el valor' }).tap()
  expect((await (await refused).json()).code).toBe('nothingChanged')
  await expect(value).toContainText('No se guardó nada: No se cambió nada: el registro ya dice eso.')
  await page.screenshot({ path: 'test-results/spanish-server-refusal-phone.png' })
  expect(problems.filter((p) => !p.includes('422'))).toEqual([])
})
