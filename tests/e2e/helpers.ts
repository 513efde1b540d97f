import { type APIRequestContext, expect, type Page } from '@playwright/test'
import type { TowInInput } from '@shared/schemas/tow-in'
import { anotherVehicle, towInBody } from '../helpers/tow-in'

export const DEMO = {
  password: 'quarry-spur-demo',
  manager: 'delia@tamsincreek.example',
  dispatcher: 'ruben@tamsincreek.example',
  technician: 'sunny@tamsincreek.example',
  office: 'priya@tamsincreek.example',
} as const

export type DemoRole = 'manager' | 'dispatcher' | 'technician' | 'office'

/**
 * Signs in and opens `landing` (the board unless said otherwise). Without it the office and managers
 * land on Today and the others on the board; tests/e2e/today.spec.ts checks that landing itself.
 */
export async function signInAs(page: Page, role: DemoRole, landing = '/board') {
  await page.goto(`/sign-in?next=${encodeURIComponent(landing)}`)
  await page.getByLabel('E-mail').fill(DEMO[role])
  await page.getByLabel('Password', { exact: true }).fill(DEMO.password)
  await page.getByRole('button', { name: 'Sign in' }).click()
  await expect(page).toHaveURL(new RegExp(`${landing}$`))
}

/**
 * Signs `request` (an API context of its own, such as the test's `request` fixture) in as a demo role, with no
 * page: for the set-up a test then looks at in a browser. Answers the session's CSRF token and user id.
 */
export async function apiSignIn(request: APIRequestContext, role: DemoRole) {
  const { csrfToken } = (await (await request.get('/api/session')).json()) as { csrfToken: string }
  const res = await request.post('/api/session', { data: { email: DEMO[role], password: DEMO.password }, headers: { 'x-csrf-token': csrfToken } })
  expect(res.status(), await res.text()).toBe(200)
  const session = (await res.json()) as { csrfToken: string; user: { id: string } }
  return { csrfToken: session.csrfToken, userId: session.user.id }
}

/**
 * A vehicle of its own, towed in now with a fresh VIN and plate (so no demo position is touched), logged over
 * the API by whoever `request` is signed in as. `edit` changes the tow-in after the fresh VIN and plate are set;
 * `photo` goes with it as a JPEG.
 */
export async function logFreshVehicle(request: APIRequestContext, { edit, photo }: { edit?: (b: TowInInput) => void; photo?: Buffer } = {}) {
  const session = (await (await request.get('/api/session')).json()) as { csrfToken: string; user: { id: string } }
  const body = towInBody(session.user.id, (b) => {
    anotherVehicle(b)
    edit?.(b)
  })
  const headers = { 'x-csrf-token': session.csrfToken }
  const res = await request.post(
    '/api/vehicles',
    photo ? { headers, multipart: { data: JSON.stringify(body), photos: { name: 'front.jpg', mimeType: 'image/jpeg', buffer: photo } } } : { headers, data: body },
  )
  expect(res.status(), await res.text()).toBe(201)
  const created = (await res.json()) as { id: string; stockNumber: string }
  return { id: created.id, stockNumber: created.stockNumber, plate: body.vehicle.plate!, csrfToken: session.csrfToken }
}

/** Fails the test on any console error or failed request the page makes. */
export function watchConsole(page: Page): string[] {
  const problems: string[] = []
  page.on('console', (m) => m.type() === 'error' && problems.push(m.text()))
  page.on('pageerror', (e) => problems.push(e.message))
  return problems
}

/**
 * The main navigation. On a phone it sits behind the top bar's menu button, which this opens
 * (and leaves open) first; on a desk it is in the bar.
 */
export async function mainNav(page: Page, name = 'Main') {
  const nav = page.getByRole('navigation', { name })
  const menu = page.locator('button[aria-controls="top-bar-panel"]')
  // The top bar is drawn after the page's own content: wait for it before asking what it shows.
  await expect(nav.or(menu).first()).toBeVisible()
  if (!(await nav.isVisible())) await openMenu(page)
  await expect(nav).toBeVisible()
  return nav
}

/**
 * A page's link in the top bar, wherever this width puts it: the everyday pages in the main navigation,
 * the others ("More pages") in the menu at a desk; on a phone both are in the menu.
 */
export async function navLink(page: Page, name: string) {
  await mainNav(page)
  const link = page.getByRole('navigation', { name: /^(Main|More pages)$/ }).getByRole('link', { name, exact: true })
  if (!(await link.isVisible())) await openMenu(page)
  await expect(link).toBeVisible()
  return link
}

/** Opens the top bar's menu where the bar has one (a desk: the person and sign-out; a phone: everything). */
export async function openMenu(page: Page) {
  const menu = page.locator('button[aria-controls="top-bar-panel"]')
  const signOut = page.locator('.top-bar__signout')
  await expect(menu.or(signOut).first()).toBeVisible()
  if ((await menu.isVisible()) && (await menu.getAttribute('aria-expanded')) !== 'true') await menu.click()
}

/**
 * Runs axe-core over the page as it stands against WCAG 2.2 level A and AA and fails with what broke
 * (rule, and the first elements), so a regression names its element (issue 16 item 17).
 */
export async function expectAccessible(page: Page) {
  const { default: AxeBuilder } = await import('@axe-core/playwright')
  const { violations } = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa']).analyze()
  const found = violations.map((v) => `${v.id} (${v.impact}): ${v.nodes.slice(0, 3).map((n) => n.target.join(' ')).join(' | ')}`)
  expect(found, `axe on ${new URL(page.url()).pathname}`).toEqual([])
}
