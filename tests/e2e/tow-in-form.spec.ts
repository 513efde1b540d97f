import { expect, test } from '@playwright/test'
import { fillTheMinimum, openForm } from './tow-in-form'

test('the map passes under the sticky top bar when the form scrolls', async ({ page }) => {
  await openForm(page)
  const zoomIn = page.getByTestId('map').locator('.leaflet-control-zoom-in')
  await expect(zoomIn).toBeVisible()
  // Tiles let pointers through, so hit-testing cannot see them: the zoom button can, and Leaflet
  // stacks it highest of all. Scroll it behind the bar's middle and ask what is on top there.
  const onTop = await zoomIn.evaluate((button) => {
    const bar = document.querySelector('.top-bar')!.getBoundingClientRect()
    const before = button.getBoundingClientRect()
    window.scrollBy(0, before.top + before.height / 2 - (bar.top + bar.height / 2))
    const at = button.getBoundingClientRect()
    return document.elementFromPoint(at.left + at.width / 2, at.top + at.height / 2)?.closest('.top-bar, .leaflet-control')?.className
  })
  expect(onTop).toContain('top-bar')
})

test('leaving the form asks only once something was entered, and staying keeps it', async ({ page }) => {
  await openForm(page)
  const board = page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Board' })
  await board.click()
  await expect(page).toHaveURL(/\/board$/)

  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Log a tow-in' }).click()
  await page.getByLabel('Who asked for the tow').fill('Owner by phone')
  await board.click()
  const question = page.getByRole('dialog', { name: 'Leave this tow-in?' })
  await expect(question).toContainText('has not been logged')
  await question.getByRole('button', { name: 'Stay on the form' }).click()
  await expect(page).toHaveURL(/\/tow-in$/)
  await expect(page.getByLabel('Who asked for the tow')).toHaveValue('Owner by phone')

  await board.click()
  await question.getByRole('button', { name: 'Leave without saving' }).click()
  await expect(page).toHaveURL(/\/board$/)
})

test('the times show their year and no day after today can be picked', async ({ page }) => {
  await openForm(page)
  const arrived = page.getByLabel('Arrived at the gate')
  await expect(arrived).toHaveValue(new RegExp(`\\b${new Date().getFullYear()}\\b`))
  await page.getByLabel('Called', { exact: true }).click()
  // "Today" is the yard's (the demo yard keeps Pacific time), not the browser's: between midnight UTC and
  // midnight in Los Angeles the two differ, and the browser's today is rightly not pickable yet.
  const yardToday = new Intl.DateTimeFormat('en-US', { timeZone: 'America/Los_Angeles', day: 'numeric' }).format(new Date())
  const today = page
    .locator('.el-date-table td:not(.prev-month):not(.next-month)')
    .filter({ visible: true })
    .filter({ hasText: new RegExp(`^\\s*${yardToday}\\s*$`) })
  await expect(today).not.toHaveClass(/disabled/)
  await expect(today.locator('xpath=following::td[1]')).toHaveClass(/disabled/)
})

// Issue 16 items 8 and 15: typed in a browser set to another zone, times were saved hours off. The demo
// yard is in Los Angeles (Pacific Standard Time in December, UTC−8); this browser is in Tokyo (UTC+9).
test.describe('in a browser seventeen hours ahead of the yard', () => {
  test.use({ timezoneId: 'Asia/Tokyo' })

  test('times are typed and shown on the yard clock, labelled with its zone', async ({ page }) => {
    await openForm(page)
    const arrived = page.getByLabel('Arrived at the gate')
    // The default arrival is the yard's now, not Tokyo's (a day ahead most of the time).
    const yardNow = (offsetMs: number) =>
      new Intl.DateTimeFormat('en-GB', { timeZone: 'America/Los_Angeles', day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' })
        .format(new Date(Date.now() + offsetMs))
    const before = yardNow(0)
    const shown = await arrived.inputValue()
    expect([before, yardNow(60_000)]).toContain(shown)
    await expect(page.getByText('Yard time — Pacific Time').first()).toBeVisible()

    await fillTheMinimum(page)
    // Yesterday at 09:15 on the yard's calendar, typed as the picker shows dates.
    const yesterday = new Intl.DateTimeFormat('en-GB', { timeZone: 'America/Los_Angeles', day: 'numeric', month: 'short', year: 'numeric' })
      .format(new Date(Date.now() - 86_400_000))
    for (const [label, time] of [['Called', '09:15'], ['Arrived at the gate', '10:40']]) {
      const field = page.getByLabel(label!, { exact: true })
      await field.click()
      await field.fill(`${yesterday}, ${time}`)
      await field.press('Enter')
      await expect(field).toHaveValue(`${yesterday}, ${time}`)
    }
    const created = page.waitForResponse((r) => r.url().endsWith('/api/vehicles') && r.request().method() === 'POST')
    await page.getByRole('button', { name: 'Log the vehicle' }).click()
    const { id } = (await (await created).json()) as { id: string }
    const record = (await (await page.request.get(`/api/vehicles/${id}`)).json()) as { tow: { calledAt: string; arrivedAt: string } }
    // The saved instants, read on the yard's clock by the browser's own Intl (the oracle), are what was typed.
    const onTheYardClock = (iso: string) =>
      new Intl.DateTimeFormat('en-GB', { timeZone: 'America/Los_Angeles', day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' })
        .format(new Date(iso))
    expect(onTheYardClock(record.tow.calledAt)).toBe(`${yesterday}, 09:15`)
    expect(onTheYardClock(record.tow.arrivedAt)).toBe(`${yesterday}, 10:40`)
    // The vehicle page shows the same yard times, each labelled with the yard's zone: Pacific Standard
    // Time in winter, Pacific Daylight Time from the second Sunday of March to the first Sunday of November.
    await expect(page).toHaveURL(new RegExp(`/vehicles/${id}$`))
    const zone = new Intl.DateTimeFormat('en-US', { timeZone: 'America/Los_Angeles', timeZoneName: 'short' })
      .formatToParts(new Date(record.tow.arrivedAt)).find((p) => p.type === 'timeZoneName')!.value
    expect(zone).toMatch(/^P[SD]T$/)
    await expect(page.getByText(`${yesterday}, 09:15 ${zone}`, { exact: true })).toBeVisible()
    await expect(page.getByText(`${yesterday}, 10:40 ${zone}`, { exact: true })).toBeVisible()
  })
})
