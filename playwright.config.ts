import { defineConfig, devices } from '@playwright/test'
import { chromiumLaunch } from './tests/e2e/chromium'

const port = Number(process.env.E2E_PORT ?? 3210)

export default defineConfig({
  testDir: 'tests/e2e',
  fullyParallel: false,
  workers: 1,
  retries: 0,
  // A 2-core machine building or testing something else (a load of 20 is ordinary while several
  // builds run) can take ten times as long as an idle one: a test whose steps each wait on the app's
  // own signals gets the time for them. A real failure still fails, only later.
  timeout: 120_000,
  expect: { timeout: 20_000 },
  reporter: [['list']],
  outputDir: 'test-results',
  use: {
    baseURL: `http://127.0.0.1:${port}`,
    launchOptions: chromiumLaunch,
    trace: 'retain-on-failure',
    screenshot: 'only-on-failure',
  },
  projects: [
    { name: 'desktop', use: { ...devices['Desktop Chrome'], launchOptions: chromiumLaunch }, testIgnore: /\.phone\.spec\.ts$/ },
    { name: 'phone', use: { ...devices['Pixel 7'], launchOptions: chromiumLaunch }, testMatch: /\.phone\.spec\.ts$/ },
  ],
  webServer: {
    command: `node scripts/e2e-server.mjs ${port}`,
    url: `http://127.0.0.1:${port}/api/health`,
    // A fresh data directory is copied from the build's demo template (server/demo/template.ts); without a recent one it
    // plays the demo yard through the services first: slow on a busy machine.
    timeout: 180_000,
    reuseExistingServer: false,
    stdout: 'ignore',
    stderr: 'pipe',
  },
})
