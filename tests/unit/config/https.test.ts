import { describe, expect, it } from 'vitest'
import { loadConfig } from '../../../server/config'

// The app listens on plain HTTP; with HOLDFAST_HTTPS=1 its cookies are Secure, and express-session
// only sets a Secure cookie on a request it knows came over HTTPS: through a trusted proxy's
// X-Forwarded-Proto. Without HOLDFAST_TRUST_PROXY no sign-in could ever keep its session.
describe('HOLDFAST_HTTPS', () => {
  it('=1 without HOLDFAST_TRUST_PROXY stops the start with a message that says what to set', () => {
    expect(() => loadConfig({ HOLDFAST_HTTPS: '1' })).toThrow(/HOLDFAST_HTTPS=1 needs HOLDFAST_TRUST_PROXY/)
    expect(() => loadConfig({ HOLDFAST_HTTPS: 'true' })).toThrow(/HOLDFAST_TRUST_PROXY=loopback/)
  })

  it('=1 with a trusted proxy starts', () => {
    expect(loadConfig({ HOLDFAST_HTTPS: '1', HOLDFAST_TRUST_PROXY: 'loopback' })).toMatchObject({ https: true, trustProxy: 'loopback' })
  })

  it('unset, nothing else is needed', () => {
    expect(loadConfig({})).toMatchObject({ https: false, trustProxy: undefined })
  })
})
