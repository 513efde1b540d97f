import type { Locator, Page } from '@playwright/test'

/** Presses on a card and starts it moving, as a person picks it up. */
async function pickUp(page: Page, card: Locator) {
  await card.scrollIntoViewIfNeeded()
  const from = (await card.boundingBox())!
  await page.mouse.move(from.x + from.width / 2, from.y + 20)
  await page.mouse.down()
  await page.mouse.move(from.x + from.width / 2 + 10, from.y + 30, { steps: 4 })
}

/** Travels to a point near the top of `target` (where its list begins), or its middle. */
async function travelTo(page: Page, target: Locator, where: 'list' | 'middle') {
  const to = (await target.boundingBox())!
  await page.mouse.move(to.x + to.width / 2, where === 'list' ? to.y + 40 : to.y + to.height / 2, { steps: 12 })
}

/**
 * Drags a card onto a column's drop area with the mouse, as a person would: press, travel,
 * release. Returns the moment of release (performance.now()), for timing what follows.
 */
export async function dragCard(page: Page, card: Locator, target: Locator): Promise<number> {
  await pickUp(page, card)
  await travelTo(page, target, 'list')
  const releasedAt = performance.now()
  await page.mouse.up()
  return releasedAt
}

/**
 * Drags a card over `via` (so the list there takes it in passing) and lets go over `release`:
 * where a person changes their mind mid-drag, or misses the column they aimed at.
 */
export async function dragVia(page: Page, card: Locator, via: Locator, release: Locator): Promise<void> {
  await pickUp(page, card)
  await travelTo(page, via, 'list')
  await travelTo(page, release, 'middle')
  await page.mouse.up()
}
