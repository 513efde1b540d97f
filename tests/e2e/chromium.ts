// Debian's Chromium, never a browser downloaded by the test tool (the network here only reaches npm and Debian).
export const chromiumLaunch = {
  executablePath: process.env.HOLDFAST_CHROMIUM ?? '/usr/bin/chromium',
  args: [
    '--headless',
    '--no-sandbox',
    '--disable-gpu',
    '--disable-quic',
    '--no-first-run',
    '--disable-background-networking',
    '--disable-component-update',
    '--disable-sync',
  ],
}
