import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from 'vitest'
import { browserSession, makeTestApp, signedIn, type BrowserSession, type TestApp } from '../helpers/app'
import { makeStaff } from '../helpers/factories'

// Holds a sign-in between its password check and its new session, where a manager's change can land.
const gate = vi.hoisted(() => ({ hold: null as Promise<void> | null, reached: () => {} }))
vi.mock('../../server/users/passwords', async (importOriginal) => {
  const real = await importOriginal<typeof import('../../server/users/passwords')>()
  return {
    ...real,
    verifyPassword: async (hash: string | undefined, password: string) => {
      const ok = await real.verifyPassword(hash, password)
      if (gate.hold) {
        gate.reached()
        await gate.hold
      }
      return ok
    },
  }
})

let t: TestApp
let staff: Awaited<ReturnType<typeof makeStaff>>
beforeAll(async () => {
  t = await makeTestApp()
})
afterAll(() => t.close())
beforeEach(async () => {
  staff = await makeStaff(t.db)
})

/** Starts the office user's sign-in, runs `change` while it is held after the password check, then lets it finish. */
async function signInRacing(change: () => Promise<unknown>): Promise<{ status: number; tab: BrowserSession }> {
  const tab = await browserSession(t.app)
  let release = () => {}
  gate.hold = new Promise<void>((r) => (release = r))
  const reached = new Promise<void>((r) => (gate.reached = r))
  const answer = tab.signIn(staff.office.email, staff.office.password)
  await reached
  gate.hold = null
  await change()
  release()
  return { status: (await answer).status, tab }
}

describe('a sign-in racing a change to the same account', () => {
  it('signIn_deactivatedWhileSigningIn_isRefusedAndLeavesNoSession', async () => {
    const m = await signedIn(t.app, staff.manager)
    const { status, tab } = await signInRacing(() => m.patch(`/api/users/${staff.office.id}`, { active: false }).expect(200))
    expect(status).toBe(401)
    expect((await tab.get('/api/session')).body.user).toBeNull()
    expect((await tab.get('/api/board')).status).toBe(401)
  })

  it('signIn_roleChangedWhileSigningIn_isRefusedSoTheOldRoleIsNeverHeld', async () => {
    const m = await signedIn(t.app, staff.manager)
    const { status, tab } = await signInRacing(() => m.patch(`/api/users/${staff.office.id}`, { role: 'technician' }).expect(200))
    expect(status).toBe(401)
    expect((await tab.get('/api/session')).body.user).toBeNull()
  })

  it('signIn_passwordResetWhileSigningIn_isRefusedForTheOldPassword', async () => {
    const m = await signedIn(t.app, staff.manager)
    const { status, tab } = await signInRacing(() => m.post(`/api/users/${staff.office.id}/password`, { password: 'a brand new passphrase' }).expect(204))
    expect(status).toBe(401)
    expect((await tab.get('/api/session')).body.user).toBeNull()
  })

  it('signIn_renamedWhileSigningIn_stillSignsIn', async () => {
    const m = await signedIn(t.app, staff.manager)
    const { status } = await signInRacing(() => m.patch(`/api/users/${staff.office.id}`, { name: 'Renamed Clerk' }).expect(200))
    expect(status).toBe(200)
  })
})
