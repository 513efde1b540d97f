import { readFileSync } from 'node:fs'
import path from 'node:path'
import { expect, test } from '@playwright/test'
import { DEMO, mainNav, watchConsole } from './helpers'

// A phone whose browser reads Spanish first: Holdfast opens in Spanish without anyone choosing it.
// The account's own language is not touched here (tests/api/session.test.ts covers it), so the demo
// staff still sign in to English in the other specs.
test.use({ locale: 'es-ES' })

const SPANISH_STEPS = ['california', 'florida', 'ordinance-24h'].flatMap((f) =>
  (JSON.parse(readFileSync(path.resolve(`server/rule-sets/samples/${f}.json`), 'utf8')) as { timeline: { es?: { label?: string } }[] }).timeline.map((s) => s.es?.label),
)

async function signInInSpanish(page: import('@playwright/test').Page) {
  await page.goto('/sign-in')
  await expect(page.locator('html')).toHaveAttribute('lang', 'es')
  await expect(page.getByRole('button', { name: 'Entrar' })).toBeVisible()
  await page.getByLabel('Correo electrónico').fill(DEMO.dispatcher)
  await page.getByLabel('Contraseña', { exact: true }).fill(DEMO.password)
  await page.getByRole('button', { name: 'Entrar' }).click()
  await expect(page).toHaveURL(/\/board/)
}

test('en un teléfono en español: la entrada, el tablero y el registro de un ingreso se leen en español', async ({ page }) => {
  const problems = watchConsole(page)
  await signInInSpanish(page)

  // The board: the column tabs, a card's words and the top bar.
  await expect(page.getByRole('navigation', { name: 'Columnas' }).getByRole('button').first()).toContainText('Llegada')
  const card = page.locator('[data-column="arrival"] [data-stock]').first()
  await expect(card).toBeVisible()
  await expect(card.getByRole('button', { name: /^Mover .* a…$/ })).toHaveText('Mover a…')
  // A card's next legal date names its step in the rule set's own Spanish (server/rule-sets/samples/*.json).
  const step = page.locator('[data-column="arrival"] .board-deadline__what').first()
  await expect(step).toBeVisible()
  expect(SPANISH_STEPS).toContain((await step.textContent())?.trim())
  await expect(page.getByRole('button', { name: 'Menú' })).toBeVisible()
  const main = await mainNav(page, 'Principal')
  await expect(main.getByRole('link')).toHaveText(['Hoy', 'Tablero', 'Registrar ingreso'])
  await expect(page.getByRole('navigation', { name: 'Más páginas' }).getByRole('link')).toHaveText(['Archivo'])
  await expect(page.getByRole('button', { name: 'Salir' })).toBeVisible()

  // The tow-in form: its heading and sections, and the quote once the pickup is on the map.
  await main.getByRole('link', { name: 'Registrar ingreso' }).tap()
  await expect(page.getByRole('heading', { name: 'Registrar ingreso' })).toBeVisible()
  await expect(page.getByRole('heading', { name: 'Dónde se recogió' })).toBeVisible()
  await expect(page.getByRole('heading', { name: 'Cuándo, por qué y quién lo pidió' })).toBeVisible()
  const map = page.getByTestId('map')
  await expect(map.locator('img.leaflet-tile-loaded').first()).toBeVisible()
  const box = (await map.boundingBox())!
  await page.touchscreen.tap(box.x + box.width * 0.3, box.y + box.height * 0.6)
  await expect(page.getByTestId('tow-quote')).toContainText('al patio en línea recta')
  await expect(page.getByTestId('tow-quote')).toContainText('Enganche')
  await expect(page.getByRole('button', { name: 'Registrar el vehículo' })).toBeInViewport()

  // Saving an empty form is refused in Spanish, the count of fields to check with it.
  await page.getByRole('button', { name: 'Registrar el vehículo' }).tap()
  await expect(page.locator('.tow-in-view__errors')).toContainText(/campos? por revisar/)

  // One column, nothing wider than the screen.
  const widths = await page.evaluate(() => [document.documentElement.scrollWidth, document.documentElement.clientWidth])
  expect(widths[0]).toBeLessThanOrEqual(widths[1]!)
  expect(problems).toEqual([])
})

test('en un teléfono en español: el selector de idioma cambia la pantalla al momento, y se queda con la elección', async ({ page }) => {
  await page.goto('/sign-in')
  await expect(page.getByRole('button', { name: 'Entrar' })).toBeVisible()
  const languages = page.getByRole('group', { name: 'Idioma' })
  await languages.getByRole('button', { name: 'English' }).tap()
  await expect(page.getByRole('button', { name: 'Sign in' })).toBeVisible()
  await expect(page.locator('html')).toHaveAttribute('lang', 'en')
  await page.reload()
  await expect(page.getByRole('button', { name: 'Sign in' })).toBeVisible()
  await page.getByRole('group', { name: 'Language' }).getByRole('button', { name: 'Español' }).tap()
  await expect(page.getByRole('button', { name: 'Entrar' })).toBeVisible()
})

test('en un teléfono en español: un campo rechazado dice por qué en español, lo revise el navegador o el servidor', async ({ page }) => {
  await page.goto('/sign-in?next=/users')
  await page.getByLabel('Correo electrónico').fill(DEMO.manager)
  await page.getByLabel('Contraseña', { exact: true }).fill(DEMO.password)
  await page.getByRole('button', { name: 'Entrar' }).click()
  await expect(page).toHaveURL(/\/users$/)
  await page.getByRole('button', { name: 'Agregar a alguien del personal' }).tap()
  const dialog = page.getByRole('dialog', { name: 'Agregar a alguien del personal' })
  const emailField = dialog.locator('.el-form-item', { has: page.locator('input[name="email"]') })
  await dialog.locator('input[name="name"]').fill('Marta Quiroga')
  await dialog.locator('input[name="password"]').fill('gravel-lantern-harbor')

  // The shared schema's own check, made in the browser before anything is sent.
  await dialog.locator('input[name="email"]').fill('marta en el patio')
  await dialog.getByRole('button', { name: 'Agregar' }).tap()
  await expect(emailField.locator('.el-form-item__error')).toHaveText('Escriba un correo electrónico válido.')

  // Only the server knows the address is already on the list: its 409 names the field, in Spanish.
  await dialog.locator('input[name="email"]').fill(DEMO.dispatcher)
  const answered = page.waitForResponse((r) => r.url().endsWith('/api/users') && r.request().method() === 'POST')
  await dialog.getByRole('button', { name: 'Agregar' }).tap()
  expect((await answered).status()).toBe(409)
  await expect(emailField.locator('.el-form-item__error')).toHaveText(`${DEMO.dispatcher} ya está en su lista de personal. Búsquelo ahí o use otra dirección.`)
})

test('en un teléfono en español: lo que necesita la recogida y la explicación de un plazo se leen en español', async ({ page }) => {
  const problems = watchConsole(page)
  await signInInSpanish(page)

  // A card the technician has marked: its pickup badge, by code, in the driver's Spanish (GLOSSARY.md).
  await page.getByRole('navigation', { name: 'Columnas' }).getByRole('button', { name: /Decisión del dueño/ }).tap()
  const card = page.locator('[data-column="decision"] [data-stock]').filter({ has: page.getByTestId('pickup-badge') }).first()
  await expect(card.getByTestId('pickup-badge')).toContainText(/De arrastre|Plataforma/)
  await expect(card.getByTestId('pickup-badge')).not.toContainText(/Wheel-lift|Flatbed/)

  // Its page: the badge again, and the next deadline's worked-out explanation in Spanish.
  await card.locator('.board-card__stock').tap()
  await expect(page).toHaveURL(/\/vehicles\//)
  await expect(page.getByTestId('pickup-badge')).toContainText(/De arrastre|Plataforma/)
  const explanation = page.getByTestId('deadline-explanation')
  await expect(explanation).toContainText(/\d+ días? (hábil(es)?|calendario) (después|antes) d/)
  await expect(explanation).not.toContainText(/ days? (after|before) | due by /)
  expect(problems).toEqual([])
})
