import type { Locator, Page } from '@playwright/test'

/**
 * Drags a card onto a column's drop area with the mouse, as a person would: press, travel,
 * release. Returns the moment of release (performance.now()), for timing what follows.
 */
export async function dragCard(page: Page, card: Locator, target: Locator): Promise<number> {
  await card.scrollIntoViewIfNeeded()
  const from = (await card.boundingBox())!
  const to = (await target.boundingBox())!
  await page.mouse.move(from.x + from.width / 2, from.y + 20)
  await page.mouse.down()
  await page.mouse.move(from.x + from.width / 2 + 10, from.y + 30, { steps: 4 })
  await page.mouse.move(to.x + to.width / 2, to.y + 40, { steps: 12 })
  const releasedAt = performance.now()
  await page.mouse.up()
  return releasedAt
}
