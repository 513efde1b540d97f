import { expect, test } from '@playwright/test'
import { openForm } from './tow-in-form'

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
  const today = page.locator('.el-date-table td.today').filter({ visible: true })
  await expect(today).not.toHaveClass(/disabled/)
  await expect(today.locator('xpath=following::td[1]')).toHaveClass(/disabled/)
})
