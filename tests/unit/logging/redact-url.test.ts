import { describe, expect, it } from 'vitest'
import { redactUrl } from '../../../server/logging'

const TOKEN = 'k3Vd9Qx_2mPzR7wLs0aYb8NcTe4UfHgJ1iOq5-ZvWxA' // 43 characters: 32 random bytes in base64url

describe('redactUrl', () => {
  it.each([
    ['an owner link on the API', `/api/owner/${TOKEN}`, '/api/owner/[Redacted]'],
    ['an owner link with more path after the token', `/api/owner/${TOKEN}/payments`, '/api/owner/[Redacted]/payments'],
    ['a short owner token still goes', '/api/owner/abc123', '/api/owner/[Redacted]'],
    ['the owner page a text message links to', `/o/${TOKEN}`, '/o/[Redacted]'],
    ['a gate pass, on the API and as a page', `/api/gate/${TOKEN}`, '/api/gate/[Redacted]'],
    ['a gate pass page', '/g/XYZ987', '/g/[Redacted]'],
    ['Express routes ignore case, so the pattern does too', `/API/OWNER/${TOKEN}`, '/API/OWNER/[Redacted]'],
    ['a token-like segment on an unlisted path', `/api/anything/${TOKEN}/scan`, '/api/anything/[Redacted]/scan'],
    ['token and code parameters', '/api/x?token=abc&code=123456&page=2', '/api/x?token=[Redacted]&code=[Redacted]&page=2'],
    ['parameter names are matched decoded and in any case', '/api/x?access%5Ftoken=abc&CSRFToken=def', '/api/x?access%5Ftoken=[Redacted]&CSRFToken=[Redacted]'],
  ])('removes %s', (_what, url, logged) => {
    expect(redactUrl(url)).toBe(logged)
  })

  it.each([
    ['record ids (UUIDs)', '/api/vehicles/1669b5e7-7055-45d3-afb1-e2a417a9da27/moves'],
    ['stock numbers and short slugs', '/api/vehicles/TYXI-2026-00001?include=history'],
    ['hashed asset names', '/assets/BoardView-CvQ1x2aZ.js'],
    ['search words', '/api/vehicles/search?q=silver%20sedan&limit=20'],
    ['a path that only starts like an owner link', '/api/owners/list'],
  ])('keeps %s', (_what, url) => {
    expect(redactUrl(url)).toBe(url)
  })
})
