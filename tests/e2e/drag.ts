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

/**
 * Drags a card over `via` (so the list there takes it in passing) and lets go over `release`:
 * where a person changes their mind mid-drag, or misses the column they aimed at.
 */
export async function dragVia(page: Page, card: Locator, via: Locator, release: Locator): Promise<void> {
  await card.scrollIntoViewIfNeeded()
  const from = (await card.boundingBox())!
  const over = (await via.boundingBox())!
  const to = (await release.boundingBox())!
  await page.mouse.move(from.x + from.width / 2, from.y + 20)
  await page.mouse.down()
  await page.mouse.move(from.x + from.width / 2 + 10, from.y + 30, { steps: 4 })
  await page.mouse.move(over.x + over.width / 2, over.y + 40, { steps: 12 })
  await page.mouse.move(to.x + to.width / 2, to.y + to.height / 2, { steps: 12 })
  await page.mouse.up()
}
