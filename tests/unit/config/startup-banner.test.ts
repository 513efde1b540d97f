import { describe, expect, it } from 'vitest'
import { startupBanner } from '../../../server/startup-banner'

const facts = {
  url: 'http://localhost:3000',
  database: 'embedded database in /srv/holdfast/data',
  filesDir: '/srv/holdfast/data/files',
  historyKeyFile: '/srv/holdfast/data.history-key',
  readyMs: 2_345,
}

describe('the start-up block a person at a terminal reads', () => {
  it('names the address, every demo sign-in with the password, and where the data lives', () => {
    const text = startupBanner({ ...facts, demo: { password: 'pw-demo', users: [{ role: 'manager', email: 'm@x.example' }, { role: 'office', email: 'o@x.example' }] } })
    expect(text).toContain('open http://localhost:3000')
    expect(text).toContain('(password: pw-demo)')
    expect(text).toMatch(/manager\s+m@x\.example/)
    expect(text).toMatch(/office\s+o@x\.example/)
    expect(text).toContain('/srv/holdfast/data.history-key')
    expect(text).toContain('/srv/holdfast/data/files')
    // Plain text for a terminal: no JSON log line.
    expect(text).not.toMatch(/^\s*\{/m)
  })

  it('says nothing of demo sign-ins for a real yard', () => {
    expect(startupBanner({ ...facts, demo: null })).not.toMatch(/sign-ins|password/)
  })
})
