// @vitest-environment happy-dom
import { readFileSync } from 'node:fs'
import path from 'node:path'
import { describe, expect, it } from 'vitest'
import { routes } from '@/router'
import { AXE_ROUTES, isElsewhere } from '../../e2e/axe-routes'

// Issue 16 item 17: the browser tests' table of pages checked with axe follows the router. A route added to
// src/router/index.ts without a line in tests/e2e/axe-routes.ts fails here, naming it.
const named = routes.filter((r) => !r.redirect).map((r) => String(r.name))

describe('every route is checked with axe', () => {
  it('names each route of the router, and nothing the router no longer has', () => {
    expect(named.filter((name) => !(name in AXE_ROUTES)), 'routes without an axe check').toEqual([])
    expect(Object.keys(AXE_ROUTES).filter((name) => !named.includes(name)), 'checks of routes that are gone').toEqual([])
  })

  it('a route checked elsewhere is checked in the file it names', () => {
    for (const [name, entry] of Object.entries(AXE_ROUTES)) {
      if (!isElsewhere(entry)) continue
      const spec = readFileSync(path.resolve('tests/e2e', entry.file), 'utf8')
      expect(spec, `${name} in ${entry.file}`).toContain('expectAccessible(')
    }
  })
})
