import { expect, test } from '@playwright/test'
import { signInAs, watchConsole } from './helpers'

test('a hold set and lifted from the vehicle page shows on the page at once; the dialog starts at its first box', async ({ page }) => {
  const problems = watchConsole(page)
  await signInAs(page, 'dispatcher')
  await page.getByRole('textbox', { name: /Find a vehicle/ }).fill('5SAT616')
  await page.getByRole('option').filter({ hasText: 'Nimbus Ember' }).click()
  const holds = page.locator('.holds-panel')
  await expect(holds).toContainText('No holds.')

  // The first box to type in has the focus; Escape gives it back to the button that opened the dialog.
  const opener = page.getByRole('button', { name: 'Set a hold' })
  await opener.click()
  const setting = page.getByRole('dialog', { name: 'Set a hold' })
  await expect(setting.getByLabel('Agency', { exact: true })).toBeFocused()
  await page.keyboard.press('Escape')
  await expect(setting).toBeHidden()
  await expect(opener).toBeFocused()

  // A box typed into before the dialog has finished opening keeps the focus: the opening never pulls a fast
  // typist's cursor back to the first box mid-word (a full browser run once lost a password that way).
  await opener.click()
  await setting.getByLabel('Case number').fill('OF-26-20001')
  await expect(page.locator('.dialog-fade-enter-active')).toHaveCount(0)
  await expect(setting.getByLabel('Case number')).toBeFocused()
  await setting.getByLabel('Agency', { exact: true }).fill('Orrin Flats Police Department')
  await setting.getByRole('button', { name: 'Set the hold' }).click()
  await expect(setting).toBeHidden()
  await expect(holds).toContainText('Law-enforcement hold — in force')
  await expect(holds).toContainText('Orrin Flats Police Department, case OF-26-20001')
  await expect(page.getByTestId('history').locator('[data-kind="hold_set"]')).toHaveCount(1)

  await holds.getByRole('button', { name: 'Lift this hold' }).click()
  const lifting = page.getByRole('dialog', { name: 'Lift the law-enforcement hold' })
  await lifting.getByRole('button', { name: 'Lift the hold' }).click()
  await expect(lifting.locator('.el-form-item.is-error')).toContainText('Say why the hold is lifted')
  await lifting.getByLabel('Why it is lifted (release letter, who authorised it)').fill('Release letter from Det. Ames, faxed 9:10')
  await lifting.getByRole('button', { name: 'Lift the hold' }).click()
  await expect(lifting).toBeHidden()
  await expect(holds).toContainText('Law-enforcement hold — lifted')
  await expect(holds).toContainText('Release letter from Det. Ames, faxed 9:10')
  expect(problems).toEqual([])
})
