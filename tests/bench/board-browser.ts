import { chromium, type Page } from '@playwright/test'
import { chromiumLaunch } from '../e2e/chromium'
import { dragCard } from '../e2e/drag'

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!
const round = (n: number) => Math.round(n)

/**
 * Milliseconds since navigation started when `selector` is on screen: seen in an animation frame,
 * then read after that frame has been laid out and painted.
 */
async function paintedAt(page: Page, selector: string): Promise<number> {
  await page.waitForFunction((s) => document.querySelector(s) !== null, selector, { polling: 'raf' })
  return page.evaluate(() => new Promise<number>((done) => requestAnimationFrame(() => setTimeout(() => done(performance.now())))))
}

// Sent as text: a function compiled by tsx would carry its helper names into the page.
const CLICK_AND_WAIT_FOR_MENU = `new Promise((done) => {
  document.querySelector('[data-column="arrival"] .board-card__move').click()
  const look = () => document.querySelector('.el-dialog .move-option') ? setTimeout(() => done(performance.now())) : requestAnimationFrame(look)
  requestAnimationFrame(look)
})`

/** A click on the first card's "Move to…" made in the page itself, and when its menu is painted. */
function menuAnsweredAt(page: Page): Promise<number> {
  return page.evaluate(CLICK_AND_WAIT_FOR_MENU) as Promise<number>
}

/** The board page on a big yard: time to first render and to the first answered click; drags persisted. */
export async function boardInBrowser(base: string) {
  const browser = await chromium.launch(chromiumLaunch)
  try {
    const context = await browser.newContext({ baseURL: base, viewport: { width: 1600, height: 1000 } })
    const page = await context.newPage()
    await page.goto('/sign-in')
    await page.getByLabel('E-mail').fill('ruben@tamsincreek.example')
    await page.getByLabel('Password', { exact: true }).fill('quarry-spur-demo')
    await page.getByRole('button', { name: 'Sign in' }).click()
    await page.waitForURL(/\/board/)
    await page.locator('[data-ready="true"]').waitFor()

    const runs: { readyMs: number; interactiveMs: number; renderedCards: number }[] = []
    for (let i = 0; i < 3; i++) {
      await page.goto('about:blank')
      await page.goto('/board', { waitUntil: 'commit' })
      const readyMs = await paintedAt(page, '[data-ready="true"] [data-stock]')
      const interactiveMs = await menuAnsweredAt(page)
      const renderedCards = await page.locator('[data-stock]').count()
      await page.keyboard.press('Escape')
      await page.locator('.el-dialog').waitFor({ state: 'hidden' })
      runs.push({ readyMs: round(readyMs), interactiveMs: round(interactiveMs), renderedCards })
    }

    const drags: number[] = []
    for (let i = 0; i < 5; i++) {
      const card = page.locator('[data-column="arrival"] [data-stock]:not([data-pending])').first()
      const stock = (await card.getAttribute('data-stock'))!
      const answered = page.waitForResponse((r) => r.request().method() === 'POST' && r.url().includes('/moves'))
      const releasedAt = await dragCard(page, card, page.locator('[data-drop="teardown"]'))
      await answered
      await page.locator(`[data-column="teardown"] [data-stock="${stock}"]:not([data-pending])`).waitFor()
      drags.push(round(performance.now() - releasedAt))
    }
    return {
      runs,
      readyMs: median(runs.map((r) => r.readyMs)),
      interactiveMs: median(runs.map((r) => r.interactiveMs)),
      dragPersisted: { runsMs: drags, medianMs: median(drags), maxMs: Math.max(...drags) },
      measuredAs:
        'Page clock from navigation start. ready: the cards painted; interactive: a click on the first card\'s "Move to…", made in the page as soon as it can run after the cards are drawn, answered by its menu on screen; drag persisted: mouse released → the move\'s POST answered and the card settled in Teardown (Node clock).',
    }
  } finally {
    await browser.close()
  }
}
