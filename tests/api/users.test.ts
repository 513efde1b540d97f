import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { users } from '@db/schema'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { makeCompany, makeStaff, makeUser } from '../helpers/factories'

let t: TestApp
let staff: Awaited<ReturnType<typeof makeStaff>>
// One database per file; each test makes its own company, so tests do not see each other's data.
beforeAll(async () => {
  t = await makeTestApp()
})
afterAll(() => t.close())
beforeEach(async () => {
  staff = await makeStaff(t.db)
})

describe('staff management', () => {
  it('a manager creates a user who can then sign in', async () => {
    const m = await signedIn(t.app, staff.manager)
    const res = await m.post('/api/users', { email: 'New.Hire@Test.example', name: 'New Hire', role: 'technician', password: 'a long passphrase' })
    expect(res.status).toBe(201)
    expect(res.body.user).toMatchObject({ email: 'new.hire@test.example', role: 'technician', active: true })
    expect(res.body.user.passwordHash).toBeUndefined()
    const stored = await t.db.select().from(users)
    expect(stored.find((u) => u.email === 'new.hire@test.example')!.passwordHash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/)
    const s = await signedIn(t.app, { email: 'new.hire@test.example', password: 'a long passphrase' })
    expect((await s.get('/api/session')).body.user.role).toBe('technician')
  })

  it('a refused create answers 400 naming each field and writes nothing', async () => {
    const m = await signedIn(t.app, staff.manager)
    const before = await t.db.select().from(users)
    const res = await m.post('/api/users', { email: 'not-an-email', name: '', role: 'owner', password: 'short' })
    expect(res.status).toBe(400)
    expect(res.body.issues.map((i: { path: string }) => i.path).sort()).toEqual(['email', 'name', 'password', 'role'])
    expect(await t.db.select().from(users)).toHaveLength(before.length)
  })

  it('a second user in the same company with the same e-mail in another case is a conflict (the manager sees the first in the list)', async () => {
    const m = await signedIn(t.app, staff.manager)
    const res = await m.post('/api/users', { email: staff.office.email.toUpperCase(), name: 'Dup', role: 'office', password: 'a long passphrase' })
    expect(res.status).toBe(409)
    expect(res.body.error).toMatch(/already on your staff list/)
  })
  it('deactivating a user ends their open sessions at once', async () => {
    const m = await signedIn(t.app, staff.manager)
    const d = await signedIn(t.app, staff.dispatcher)
    expect((await d.get('/api/board')).status).toBe(200)
    const res = await m.patch(`/api/users/${staff.dispatcher.id}`, { active: false })
    expect(res.status).toBe(200)
    expect(res.body.user.active).toBe(false)
    expect((await d.get('/api/board')).status).toBe(401)
  })

  it('changing a role takes effect on the next request', async () => {
    const m = await signedIn(t.app, staff.manager)
    const o = await signedIn(t.app, staff.office)
    await m.patch(`/api/users/${staff.office.id}`, { role: 'manager' }).expect(200)
    // The role change ended the old session; signing in again gives the new role.
    expect((await o.get('/api/users')).status).toBe(401)
    const again = await signedIn(t.app, staff.office)
    expect((await again.get('/api/users')).status).toBe(200)
  })

  it('renaming a user keeps them signed in and their session says the new name', async () => {
    const m = await signedIn(t.app, staff.manager)
    const o = await signedIn(t.app, staff.office)
    await m.patch(`/api/users/${staff.office.id}`, { name: 'Priya C. Okonjo' }).expect(200)
    const me = await o.get('/api/session').expect(200)
    expect(me.body.user).toMatchObject({ id: staff.office.id, name: 'Priya C. Okonjo', role: 'office' })
  })

  it('the last active manager cannot be deactivated or demoted', async () => {
    const m = await signedIn(t.app, staff.manager)
    expect((await m.patch(`/api/users/${staff.manager.id}`, { active: false })).status).toBe(422)
    expect((await m.patch(`/api/users/${staff.manager.id}`, { role: 'office' })).status).toBe(422)
    const [row] = await t.db.select().from(users).where((await import('drizzle-orm')).eq(users.id, staff.manager.id))
    expect(row).toMatchObject({ active: true, role: 'manager' })
  })

  it('a password reset signs the user out and the new password works', async () => {
    const m = await signedIn(t.app, staff.manager)
    const tech = await signedIn(t.app, staff.technician)
    await m.post(`/api/users/${staff.technician.id}/password`, { password: 'brand new passphrase' }).expect(204)
    expect((await tech.get('/api/board')).status).toBe(401)
    await signedIn(t.app, { email: staff.technician.email, password: 'brand new passphrase' })
  })

  it("a manager cannot see or change another company's users", async () => {
    const other = await makeCompany(t.db, 'Rival Recovery')
    const stranger = await makeUser(t.db, other.company.id, 'office')
    const m = await signedIn(t.app, staff.manager)
    const list = await m.get('/api/users')
    expect(list.body.users.map((u: { id: string }) => u.id)).not.toContain(stranger.id)
    expect((await m.patch(`/api/users/${stranger.id}`, { active: false })).status).toBe(404)
  })

  it('a non-manager cannot create users and nothing is written', async () => {
    const d = await signedIn(t.app, staff.dispatcher)
    const before = await t.db.select().from(users)
    const res = await d.post('/api/users', { email: 'x@test.example', name: 'X', role: 'manager', password: 'a long passphrase' })
    expect(res.status).toBe(403)
    expect(await t.db.select().from(users)).toHaveLength(before.length)
  })
})

describe("another company's e-mail addresses cannot be discovered", () => {
  const answerOf = (res: { status: number; body: { user?: Record<string, unknown> } }) => ({ status: res.status, keys: Object.keys(res.body.user ?? {}).sort() })

  it("adding an address another company uses answers exactly as a free one does, and each account keeps its own password", async () => {
    const rival = await makeCompany(t.db, 'Rival Recovery')
    const theirs = await makeUser(t.db, rival.company.id, 'office')
    const m = await signedIn(t.app, staff.manager)
    const free = await m.post('/api/users', { email: `free-${Date.now()}@test.example`, name: 'Free', role: 'office', password: 'a long passphrase' })
    const taken = await m.post('/api/users', { email: theirs.email.toUpperCase(), name: 'Same Address', role: 'technician', password: 'our own passphrase' })
    expect(answerOf(taken)).toEqual(answerOf(free))
    expect(answerOf(taken).status).toBe(201)

    // Each password reaches its own company's account; neither learns anything of the other.
    const ours = await signedIn(t.app, { email: theirs.email, password: 'our own passphrase' })
    expect((await ours.get('/api/session')).body.user).toMatchObject({ id: taken.body.user.id, role: 'technician' })
    const them = await signedIn(t.app, theirs)
    expect((await them.get('/api/session')).body.user).toMatchObject({ id: theirs.id, role: 'office' })
  })

  it('when both accounts have the same password, the older one signs in', async () => {
    const rival = await makeCompany(t.db, 'Rival Recovery')
    const theirs = await makeUser(t.db, rival.company.id, 'dispatcher')
    const m = await signedIn(t.app, staff.manager)
    expect((await m.post('/api/users', { email: theirs.email, name: 'Same Address', role: 'office', password: theirs.password })).status).toBe(201)
    const s = await signedIn(t.app, theirs)
    expect((await s.get('/api/session')).body.user.id).toBe(theirs.id)
  })

  it('a deactivated account does not hide an active one with the same address and password', async () => {
    const rival = await makeCompany(t.db, 'Rival Recovery')
    const gone = await makeUser(t.db, rival.company.id, 'dispatcher', { active: false })
    const m = await signedIn(t.app, staff.manager)
    const made = await m.post('/api/users', { email: gone.email, name: 'Moved Here', role: 'office', password: gone.password })
    expect(made.status).toBe(201)
    const s = await signedIn(t.app, gone)
    expect((await s.get('/api/session')).body.user.id).toBe(made.body.user.id)
  })
})
