import { expect, test } from '@playwright/test'
import { signInAs } from './helpers'

test('on a phone a form dialog takes the whole screen and a new yard space shows on the page once saved', async ({ page }) => {
  await signInAs(page, 'dispatcher')
  await page.getByRole('textbox', { name: /Find a vehicle/ }).fill('5SAT616')
  await page.getByRole('option').filter({ hasText: 'Nimbus Ember' }).tap()
  const free = await page.evaluate(async () => {
    const { spaces } = (await (await fetch('/api/spaces')).json()) as { spaces: { label: string; size: string; occupant: unknown }[] }
    return spaces.find((s) => s.size === 'standard' && !s.occupant)!.label
  })

  await page.getByRole('button', { name: 'Yard space' }).tap()
  const dialog = page.getByRole('dialog', { name: 'Yard space' })
  await expect(dialog.getByRole('button', { name: 'Save the space' })).toBeInViewport({ ratio: 1 })
  const box = (await dialog.boundingBox())!
  expect([box.x, box.y, box.width, box.height]).toEqual([0, 0, page.viewportSize()!.width, page.viewportSize()!.height])

  await dialog.getByRole('combobox', { name: 'Yard space' }).tap()
  await page.locator('.el-select-dropdown__item').filter({ hasText: new RegExp(`^${free}(?!\\d)`) }).tap()
  await dialog.getByRole('button', { name: 'Save the space' }).tap()
  await expect(dialog).toBeHidden()
  await expect(page.locator('.vehicle-header')).toContainText(`Space ${free}`)
})
