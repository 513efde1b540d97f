import type { Locator, Page } from '@playwright/test'
import type { DemoRole } from './helpers'

// Issue 16 item 17: every route of src/router/index.ts is checked with axe (WCAG 2.2 A and AA) in a state
// with real content. This table names, for every route, how it is checked; a unit test
// (tests/unit/components/axe-routes.test.ts, beside the other tests that load Vue code) fails when the router
// has a route this table does not name, so a new page cannot go unchecked. Type imports only from Playwright:
// the unit test reads this file too.

export interface AxePage {
  /** Who opens it (signed in as the demo's person in that role); null: nobody signed in. */
  role: DemoRole | null
  /** Where to go; a function when the address has to be found first (a rule set's id). */
  path: string | ((page: Page) => Promise<string>)
  /** The page's own sign that what it shows has arrived. */
  ready: (page: Page) => Locator
  /** Buttons on the page that open its main dialogs, each checked open too (by the button's name). */
  dialogs?: string[]
}

/** A route checked by a test of its own (a server of its own, a vehicle found first): the file says where. */
export interface AxeElsewhere {
  /** The spec file (under tests/e2e/) that calls expectAccessible on this route. */
  file: string
  /** Why it is not in the table's loop. */
  why: string
}

const h1 = (p: Page) => p.getByRole('heading', { level: 1 })

async function firstRuleSet(page: Page) {
  await page.goto('/settings')
  const link = page.locator('[data-rule-set] a').first()
  await link.waitFor()
  return (await link.getAttribute('href'))!
}

export const AXE_ROUTES: Record<string, AxePage | AxeElsewhere> = {
  home: { file: 'accessibility.spec.ts', why: 'no page of its own: it sends each role to Today or the board, both checked' },
  'sign-in': { role: null, path: '/sign-in', ready: (p) => p.getByRole('button', { name: 'Sign in' }) },
  'first-run': { file: 'first-run.spec.ts', why: 'shown only by a server with no company: that spec starts one' },
  today: { role: 'office', path: '/today', ready: (p) => p.locator('[data-group]') },
  board: { role: 'manager', path: '/board', ready: (p) => p.getByRole('status').filter({ hasText: 'Live' }) },
  archive: { role: 'manager', path: '/archive', ready: (p) => p.getByRole('table') },
  'tow-in': { role: 'dispatcher', path: '/tow-in', ready: (p) => p.getByTestId('map') },
  vehicle: { file: 'accessibility.spec.ts', why: 'a vehicle found on the board first, with its print view' },
  inspection: { file: 'accessibility.spec.ts', why: 'a vehicle found on the board first' },
  'cash-drawer': { role: 'office', path: '/cash-drawer', ready: h1 },
  deadlines: { role: 'office', path: '/deadlines', ready: h1 },
  receivables: { role: 'office', path: '/reports/receivables', ready: (p) => p.getByTestId('receivables-table').getByRole('row').nth(1) },
  aged: { role: 'office', path: '/reports/aged', ready: (p) => p.getByTestId('aged-table').getByRole('row').nth(1) },
  salvage: { role: 'office', path: '/reports/salvage', ready: (p) => p.getByTestId('salvage-table') },
  daily: { role: 'office', path: '/reports/daily', ready: (p) => p.getByTestId('daily-storage') },
  glance: { file: 'accessibility.spec.ts', why: 'waits for its charts to draw (their own chunk)' },
  gate: { role: 'office', path: '/gate', ready: h1 },
  // A pass the demo issued is re-sealed at the first start (no token of the build opens anything), so the page
  // is checked as the gate sees an unknown pass: its refusal.
  'gate-pass': { role: 'office', path: `/g/${'A'.repeat(43)}`, ready: (p) => p.getByTestId('gate-refused') },
  outbox: { role: 'manager', path: '/outbox', ready: (p) => p.getByRole('table') },
  'owner-start': { role: null, path: '/o', ready: (p) => p.getByRole('heading', { name: 'Find your vehicle' }) },
  // Back from the card page in a tab that kept no owner key: the page says so and offers the code instead.
  'owner-payment-return': { role: null, path: '/o/payment-return?result=paid', ready: (p) => p.getByRole('link', { name: /code/i }) },
  owner: { file: 'accessibility.spec.ts', why: "an owner link made on a vehicle's page first, in English and Spanish" },
  settings: { role: 'manager', path: '/settings', ready: (p) => p.locator('[data-rule-set]'), dialogs: ['Copy'] },
  'settings-rule-set': { role: 'manager', path: firstRuleSet, ready: (p) => p.getByRole('heading', { level: 1 }) },
  'settings-yards': { role: 'manager', path: '/settings/yards', ready: (p) => p.locator('[data-yard]'), dialogs: ['Add a yard'] },
  'settings-audit': { role: 'manager', path: '/settings/audit', ready: (p) => p.getByRole('table') },
  users: { role: 'manager', path: '/users', ready: (p) => p.getByRole('table'), dialogs: ['Add a staff member'] },
  'not-found': { role: null, path: '/nowhere-at-all', ready: (p) => p.getByRole('heading').first() },
}

export const isElsewhere = (entry: AxePage | AxeElsewhere): entry is AxeElsewhere => 'file' in entry
