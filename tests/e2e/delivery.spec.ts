import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs'
import path from 'node:path'
import { expect, test, type Response } from '@playwright/test'

// The browser tests run against `npm run build`'s output, served by the built server.
const CLIENT_DIR = path.resolve(process.env.HOLDFAST_CLIENT_DIR ?? 'dist/client')

test('the sign-in page\'s scripts and styles come from the build\'s Brotli files', async ({ page }) => {
  const assets: Response[] = []
  page.on('response', (r) => /\/assets\/[^/]+\.(js|css)$/.test(new URL(r.url()).pathname) && assets.push(r))
  await page.goto('/sign-in')
  await expect(page.getByRole('button', { name: 'Sign in' })).toBeVisible()
  await page.waitForLoadState('load')

  // The build skips a file its compression would not shrink (a few bytes of glue), and only that.
  const worthCompressing = assets.filter((r) => statSync(path.join(CLIENT_DIR, new URL(r.url()).pathname)).size > 1024)
  expect(worthCompressing.length).toBeGreaterThan(3)
  for (const r of worthCompressing) {
    const file = new URL(r.url()).pathname
    expect(existsSync(path.join(CLIENT_DIR, `${file}.br`)), `${file}.br in the build`).toBe(true)
    const headers = await r.allHeaders()
    expect(headers['content-encoding'], file).toBe('br')
    expect(headers['vary'], file).toMatch(/accept-encoding/i)
    expect(headers['cache-control'], file).toContain('immutable')
  }
})

test('the build holds one copy of Leaflet', () => {
  // A class name in Leaflet's own code, in its ES module and UMD builds alike.
  const scripts = readdirSync(path.join(CLIENT_DIR, 'assets')).filter((f) => f.endsWith('.js'))
  const withLeaflet = scripts.filter((f) => readFileSync(path.join(CLIENT_DIR, 'assets', f), 'utf8').includes('leaflet-zoom-animated'))
  expect(withLeaflet).toHaveLength(1)
})
