import { expect, test } from '@playwright/test'
import sharp from 'sharp'
import { watchConsole } from './helpers'
import { freshVin } from '../helpers/vins'
import { fillTheMinimum, openForm, VIN } from './tow-in-form'

const jpeg = (colour: string) => sharp({ create: { width: 640, height: 480, channels: 3, background: colour } }).jpeg().toBuffer()

test('a dispatcher logs a tow-in with a map pin and two photos, finds it on the board and sees its history', async ({ page }) => {
  // The whole intake, save and board round trip in one test: give it more than the default time.
  test.slow()
  const problems = watchConsole(page)
  await openForm(page)

  // Drop the pin north-east of the yard: the coordinates, the address and the charge follow.
  const map = page.getByTestId('map')
  await expect(map.locator('img.leaflet-tile-loaded').first()).toBeVisible()
  const box = (await map.boundingBox())!
  await page.mouse.click(box.x + box.width * 0.75, box.y + box.height * 0.3)
  // Leaflet copies the pin's markup into its marker pane; that copy is the one on the map.
  await expect(map.locator('.leaflet-marker-pane [data-testid="map-pin"]')).toBeVisible()
  await expect(page.getByLabel('Latitude')).not.toHaveValue('')
  await expect(page.getByTestId('tow-total')).toHaveText(/^\$\d{3},?\d*\.\d{2}$/)

  await page.getByText('Accident', { exact: true }).click()
  await page.getByLabel('Who asked for the tow').fill('Tule County Sheriff dispatch')
  await page.getByLabel('Agency or company (where one applies)').fill('Tule County Sheriff')
  await page.getByLabel('Driver', { exact: true }).fill('Jody Kincaid')

  await page.getByLabel('VIN', { exact: true }).fill(VIN.replace('4', '7'))
  await expect(page.getByTestId('vin-status')).toContainText('check digit')
  await page.getByLabel('VIN', { exact: true }).fill(VIN)
  await expect(page.getByTestId('vin-status')).toHaveText('Check digit correct. Model year 2005.')
  await expect(page.getByLabel('Year', { exact: true })).toHaveValue('2005')
  await page.getByLabel('Plate', { exact: true }).fill('8QAE310')
  await page.getByLabel('Plate state', { exact: true }).fill('CA')
  await page.getByLabel('Make', { exact: true }).fill('Nordsund')
  await page.getByLabel('Model', { exact: true }).fill('Fjellvik')
  await page.getByLabel('Colour', { exact: true }).fill('Teal')
  await page.getByLabel('Odometer', { exact: true }).fill('118204')
  await page.getByRole('radiogroup', { name: 'Keys with the vehicle' }).getByText('Yes', { exact: true }).click()

  await page.getByLabel('Choose photos').setInputFiles([
    { name: 'front.jpg', mimeType: 'image/jpeg', buffer: await jpeg('#3e6a8a') },
    { name: 'rear.jpg', mimeType: 'image/jpeg', buffer: await jpeg('#b4443a') },
  ])
  await expect(page.getByRole('img', { name: /^Photo \d: / })).toHaveCount(2)
  await page.getByLabel('Damage and condition notes').fill('Front bumper cracked; headlamp out.')

  await page.getByRole('button', { name: 'Log the vehicle' }).click()
  await expect(page).toHaveURL(/\/vehicles\/[0-9a-f-]{36}$/)
  const stock = (await page.getByTestId('stock-number').textContent())!.trim()
  expect(stock).toMatch(/^TC-\d{4}-\d{5}$/)
  await expect(page.getByTestId('gallery').getByRole('img')).toHaveCount(2)

  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Board' }).click()
  const card = page.locator(`[data-stock="${stock}"]`)
  await expect(card).toBeVisible()
  await card.getByRole('link', { name: stock }).click()
  await expect(page.getByTestId('vehicle-state')).toHaveText('Arrival')
  const towedIn = page.getByTestId('history').locator('[data-kind="towed_in"]')
  await expect(towedIn).toContainText('Towed in')
  await expect(towedIn).toContainText('Ruben Okafor')
  await expect(page.getByTestId('history').locator('[data-kind="file_added"]')).toContainText('Ruben Okafor')
  await page.getByRole('button', { name: 'Check the chain' }).click()
  await expect(page.getByRole('status').filter({ hasText: 'Intact' })).toHaveText(/Intact: all \d+ entries link and match\./)
  expect(problems).toEqual([])
})

test('an incomplete tow-in shows each message beside its field and saves nothing', async ({ page }) => {
  await openForm(page)
  await page.getByLabel('VIN', { exact: true }).fill('1G4AH59H45G11834O')
  await page.getByRole('button', { name: 'Log the vehicle' }).click()
  await expect(page.getByText('Drop a pin on the map or search for the address.')).toBeVisible()
  await expect(page.getByText('Choose why the vehicle was towed.')).toBeVisible()
  await expect(page.getByText('Enter the make, or "Unknown".')).toBeVisible()
  await expect(page.locator('.el-form-item.is-error').filter({ hasText: 'VIN' }).first()).toContainText('is the letter O')
  await expect(page).toHaveURL(/\/tow-in$/)

  // Issue 16: a message goes as soon as its field is right, and the count with it — not at the next save.
  const count = page.getByText(/\d+ fields? to check/)
  const before = Number((await count.textContent())!.match(/(\d+) field/)![1])
  await page.getByRole('radiogroup', { name: 'Why it was towed' }).getByText('Breakdown').click()
  await expect(page.getByText('Choose why the vehicle was towed.')).toBeHidden()
  await expect(count).toHaveText(`${before - 1} ${before - 1 === 1 ? 'field' : 'fields'} to check`)
  await expect(page.getByText('Enter the make, or "Unknown".')).toBeVisible()
})

test('the address search places the pin and the top-bar search finds a vehicle by plate', async ({ page }) => {
  await openForm(page)
  await page.getByLabel('Search for the address or a place').fill('Sunridge')
  await page.getByRole('option', { name: /Sunridge Plaza, 300 Harrow Way/ }).click()
  await expect(page.getByLabel('Pickup address as you would tell the driver')).toHaveValue('Sunridge Plaza, 300 Harrow Way, Orrin Flats')
  await expect(page.getByLabel('Latitude')).toHaveValue('36.418800')
  // Coordinates typed by hand move the pin somewhere else: the searched place no longer describes it.
  await page.getByLabel('Latitude').fill('36.4109')
  await page.getByLabel('Longitude').fill('-119.3455')
  await expect(page.getByLabel('Pickup address as you would tell the driver')).not.toHaveValue(/Sunridge Plaza/)

  await page.getByRole('textbox', { name: /Find a vehicle/ }).fill('7KQM214')
  await page.getByRole('option', { name: /Orlan Sparrow/ }).click()
  await page.getByRole('dialog', { name: 'Leave this tow-in?' }).getByRole('button', { name: 'Leave without saving' }).click()
  await expect(page.getByTestId('stock-number')).toHaveText(/^TC-\d{4}-\d{5}$/)
  await expect(page.getByText('7KQM214').first()).toBeVisible()
})

test('road miles to the tenth are saved, the toast is styled and the vehicle page opens at its top', async ({ page }) => {
  await openForm(page)
  await fillTheMinimum(page)
  await page.getByLabel('Road miles from the driver (leave empty to use the pin)').fill('12.3')
  // The message shows for a few seconds: it is caught as it appears, not looked for later (a loaded
  // machine can take longer than its life to get there).
  const toastPosition = page.evaluate(
    () =>
      new Promise<string>((resolve) => {
        const found = () => {
          const toast = [...document.querySelectorAll('.el-message')].find((m) => m.textContent?.includes('It is in Arrival on the board.'))
          if (toast) resolve(getComputedStyle(toast).position)
          return Boolean(toast)
        }
        if (!found()) new MutationObserver((_, watcher) => found() && watcher.disconnect()).observe(document.body, { childList: true, subtree: true })
      }),
  )
  await page.getByRole('button', { name: 'Log the vehicle' }).click()
  await expect(page).toHaveURL(/\/vehicles\/[0-9a-f-]{36}$/)
  // Its own stylesheet places the message over the page; unstyled it would sit in the page's flow.
  expect(await toastPosition).toBe('fixed')
  await expect(page.getByText(/^12\.3 road miles/).first()).toBeVisible()
  expect(await page.evaluate(() => window.scrollY)).toBe(0)
})

test('a space taken while the form was open is refused beside the field and shown as taken at once', async ({ page }) => {
  await openForm(page)
  await fillTheMinimum(page)
  const { label, spaceId, occupantId } = await page.evaluate(async () => {
    const { spaces } = (await (await fetch('/api/spaces')).json()) as { spaces: { id: string; label: string; size: string; occupant: { id: string } | null }[] }
    const free = spaces.find((s) => s.size === 'standard' && !s.occupant)!
    return { label: free.label, spaceId: free.id, occupantId: spaces.find((s) => s.occupant)!.occupant!.id }
  })
  await page.getByRole('combobox', { name: 'Yard space' }).click()
  await page.keyboard.type(label)
  const option = page.locator('.el-select-dropdown__item').filter({ hasText: new RegExp(`^${label}(?!\\d)`) })
  await option.click()

  // Another dispatcher moves a vehicle into that space first.
  const moved = await page.evaluate(
    async ({ spaceId, occupantId }) => {
      const { csrfToken } = (await (await fetch('/api/session')).json()) as { csrfToken: string }
      const { vehicle } = (await (await fetch(`/api/vehicles/${occupantId}`)).json()) as { vehicle: { version: number } }
      const res = await fetch(`/api/vehicles/${occupantId}/space`, {
        method: 'PUT',
        headers: { 'content-type': 'application/json', 'x-csrf-token': csrfToken },
        body: JSON.stringify({ version: vehicle.version, spaceId }),
      })
      return res.status
    },
    { spaceId, occupantId },
  )
  expect(moved).toBe(200)

  await page.getByRole('button', { name: 'Log the vehicle' }).click()
  await expect(page.locator('.el-form-item.is-error').filter({ hasText: 'Yard space' })).toContainText(`Space ${label} already holds`)
  await expect(page).toHaveURL(/\/tow-in$/)
  await page.getByRole('combobox', { name: 'Yard space' }).click()
  await expect(option).toContainText('taken by')
})

test('logging a VIN that is still in the yard asks why, and logs it with the reason', async ({ page }) => {
  test.slow()
  const vin = freshVin()
  await openForm(page)
  await fillTheMinimum(page)
  await page.getByLabel('VIN', { exact: true }).fill(vin)
  await page.getByRole('button', { name: 'Log the vehicle' }).click()
  await expect(page).toHaveURL(/\/vehicles\/[0-9a-f-]{36}$/)
  const first = (await page.getByTestId('stock-number').textContent())!.trim()

  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Log a tow-in' }).click()
  await fillTheMinimum(page)
  await page.getByLabel('VIN', { exact: true }).fill(vin)
  await page.getByRole('button', { name: 'Log the vehicle' }).click()
  const ask = page.getByRole('dialog', { name: 'Already on the lot?' })
  await expect(ask).toContainText(`${first} has the same VIN`)
  await expect(ask.getByRole('button', { name: `Open ${first}` })).toBeVisible()
  await ask.getByRole('textbox').fill('Released yesterday, towed again today')
  await ask.getByRole('button', { name: 'Log it anyway' }).click()
  await expect(page).toHaveURL(/\/vehicles\/[0-9a-f-]{36}$/)
  await expect(page.getByTestId('stock-number')).not.toHaveText(first)
})

// Issue 16 item 4: after a search, a pin moved on the map left the box showing the searched place while
// the record got the address at the pin. The box, the pin and the saved record agree.
test('a pin moved after a search puts the new address in the box, and that address is saved', async ({ page }) => {
  await openForm(page)
  await fillTheMinimum(page)
  const search = page.getByLabel('Search for the address or a place')
  const address = page.getByLabel('Pickup address as you would tell the driver')
  await search.fill('Sunridge')
  await page.getByRole('option', { name: /Sunridge Plaza, 300 Harrow Way/ }).click()
  await expect(address).toHaveValue('Sunridge Plaza, 300 Harrow Way, Orrin Flats')
  await expect(search).toHaveValue('Sunridge Plaza, 300 Harrow Way, Orrin Flats')

  // The map zooms to 16 on the searched place: 256 * 2^16 px around the world, so 0.0038° of longitude is
  // 177 px and 0.0011° of latitude (Web Mercator, at 36.42°) 64 px. 730 Harrow Way, a named place of the
  // local geocoder stand-in (server/fakes/orrin-flats.ts), is that far west and south of Sunridge Plaza.
  const map = page.getByTestId('map')
  await expect(map.locator('img.leaflet-tile-loaded[src*="/tiles/16/"]').first()).toBeVisible()
  await expect(map.locator('.leaflet-zoom-anim')).toHaveCount(0)
  // The pin's point is its icon's anchor, 15 px in and 40 px down (src/components/map/MapPicker.vue).
  const pin = (await map.locator('.leaflet-marker-pane .leaflet-marker-icon', { has: page.locator('[data-testid="map-pin"]') }).boundingBox())!
  const looked = page.waitForResponse((r) => r.url().includes('/reverse?'))
  await page.mouse.click(pin.x + 15 - 177, pin.y + 40 + 64)
  await looked
  await expect(address).toHaveValue(/^730 Harrow Way/)
  const moved = await address.inputValue()
  await expect(search).toHaveValue(moved)

  await page.getByRole('button', { name: 'Log the vehicle' }).click()
  await expect(page).toHaveURL(/\/vehicles\/[0-9a-f-]{36}$/)
  const id = page.url().split('/').at(-1)!
  const vehicle = await (await page.request.get(`/api/vehicles/${id}`)).json()
  expect(vehicle.tow.pickupAddress).toBe(moved)
})
