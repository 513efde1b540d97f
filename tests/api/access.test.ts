import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ACCESS, ruleFor } from '../../server/access'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { makeStaff } from '../helpers/factories'

let t: TestApp
// One database per file; each test makes its own company, so tests do not see each other's data.
beforeAll(async () => {
  t = await makeTestApp()
})
afterAll(() => t.close())

describe('access table', () => {
  it('every non-public route answers 401 when signed out', async () => {
    const routes = Object.entries(ACCESS).filter(([, rule]) => rule !== 'public')
    for (const [key] of routes) {
      const [method, path] = key.split(' ') as [string, string]
      const url = path.replace(/:(\w+)/g, '00000000-0000-4000-8000-000000000000')
      const res = await request(t.app)[method.toLowerCase() as 'get'](url)
      // State-changing requests without a session token are refused by CSRF first (403); both write nothing.
      expect([401, 403], `${key}`).toContain(res.status)
      if (method === 'GET') expect(res.status, key).toBe(401)
    }
  })

  it('an /api route missing from the table answers 403 to a signed-in user and 401 when signed out', async () => {
    const staff = await makeStaff(t.db)
    const s = await signedIn(t.app, staff.manager)
    expect((await s.get('/api/not-in-the-table')).status).toBe(403)
    expect((await request(t.app).get('/api/not-in-the-table')).status).toBe(401)
  })

  it.each([
    ['manager', 200],
    ['dispatcher', 403],
    ['technician', 403],
    ['office', 403],
  ] as const)('GET /api/users as %s answers %i', async (role, status) => {
    const staff = await makeStaff(t.db)
    const s = await signedIn(t.app, staff[role])
    expect((await s.get('/api/users')).status).toBe(status)
  })

  it.each(['manager', 'dispatcher', 'technician', 'office'] as const)('GET /api/board is open to a signed-in %s', async (role) => {
    const staff = await makeStaff(t.db)
    const s = await signedIn(t.app, staff[role])
    expect((await s.get('/api/board')).status).toBe(200)
  })

  it('ruleFor matches a parameterised path and not a longer one', () => {
    expect(ruleFor('PATCH', '/api/users/abc')).toBe('admin')
    expect(ruleFor('PATCH', '/api/users/abc/extra')).toBeUndefined()
  })
})

describe('errors', () => {
  it('a malformed JSON body answers 400 JSON without a stack trace', async () => {
    const res = await request(t.app).post('/api/session').set('content-type', 'application/json').send('{"email":')
    expect([400, 403]).toContain(res.status)
    expect(res.headers['content-type']).toMatch(/json/)
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.ts:\d+/)
  })

  it('GET /api/health reports the version and the database', async () => {
    const res = await request(t.app).get('/api/health').expect(200)
    expect(res.body).toEqual({ status: 'ok', db: 'ok', version: 'test' })
  })

  it('security headers forbid framing and base URIs', async () => {
    const res = await request(t.app).get('/api/health')
    expect(res.headers['content-security-policy']).toMatch(/frame-ancestors 'none'/)
    expect(res.headers['content-security-policy']).toMatch(/base-uri 'none'/)
    expect(res.headers['x-content-type-options']).toBe('nosniff')
    // Plain HTTP on a yard LAN must keep working: no HSTS unless served over HTTPS.
    expect(res.headers['strict-transport-security']).toBeUndefined()
  })
})

describe('input the database cannot store or the router cannot read', () => {
  it('a NUL character in a query or a JSON body answers 400 naming the field, and writes nothing', async () => {
    const staff = await makeStaff(t.db)
    const m = await signedIn(t.app, staff.manager)
    const search = await m.get('/api/vehicles/search?q=%00%00')
    expect(search.status).toBe(400)
    expect(search.body.issues[0].path).toBe('q')
    const before = (await m.get('/api/users')).body.users.length
    const create = await m.post('/api/users', { email: 'nul@test.example', name: 'a\u0000b', role: 'office', password: 'a long passphrase' })
    expect(create.status).toBe(400)
    expect(create.body.issues[0]).toMatchObject({ path: 'name' })
    expect((await m.get('/api/users')).body.users).toHaveLength(before)
  })

  it('a broken %-escape in the address answers 400, signed in or not', async () => {
    expect((await request(t.app).get('/api/vehicles/%E0%A4%A')).status).toBe(400)
  })
})
