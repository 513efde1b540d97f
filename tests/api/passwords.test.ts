import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { users } from '@db/schema'
import { makeTestApp, signedIn, type BrowserSession, type TestApp } from '../helpers/app'
import { makeStaff } from '../helpers/factories'

let t: TestApp
let staff: Awaited<ReturnType<typeof makeStaff>>
let m: BrowserSession
beforeAll(async () => {
  t = await makeTestApp()
})
afterAll(() => t.close())
beforeEach(async () => {
  staff = await makeStaff(t.db)
  m = await signedIn(t.app, staff.manager)
})

type Issue = { path: string; message: string }
let n = 0
const newUser = (password: string) => ({ email: `pw-${n++}-${Date.now()}@test.example`, name: 'New Hire', role: 'office', password })

// OWASP ASVS 5.0 V6.2 (and NIST SP 800-63B 5.1.1.2): a minimum length, no composition rules, and a
// refusal of passwords on a list of common, repetitive or sequential ones. The common list is
// @zxcvbn-ts/language-common 4.1.3 `passwords-common`; each listed value below was looked up in it.
describe('a new password is refused, naming the field, when it is easy to guess', () => {
  it.each([
    ['ten spaces', ' '.repeat(10)],
    ['ten zero-width spaces', '\u200b'.repeat(10)],
    ['one letter among nine zero-width spaces (one character long)', `a${'\u200b'.repeat(9)}`],
    ['one character ten times', 'aaaaaaaaaa'],
    ['a short unit repeated', 'abcabcabcabc'],
    ['a run of letters', 'abcdefghijk'],
    ['a run of digits backwards', '9876543210'],
    ['on the common list: 1234567890', '1234567890'],
    ['on the common list: password12', 'password12'],
    ['on the common list in capitals: Password12', 'Password12'],
    ['on the common list once NFKC-normalised: fullwidth ｐａｓｓｗｏｒｄ１２', 'ｐａｓｓｗｏｒｄ１２'],
    ['on the common list: qwertyuiop', 'qwertyuiop'],
  ])('%s', async (_name, password) => {
    const before = await t.db.$count(users)
    const res = await m.post('/api/users', newUser(password))
    expect(res.status, JSON.stringify(res.body)).toBe(400)
    expect(res.body.issues).toHaveLength(1)
    expect(res.body.issues[0]).toMatchObject({ path: 'password', message: expect.stringMatching(/password/i) })
    expect(await t.db.$count(users)).toBe(before)
  })

  it('a password reset to a common password is refused and the old one still works', async () => {
    const res = await m.post(`/api/users/${staff.office.id}/password`, { password: 'password12' })
    expect(res.status).toBe(400)
    expect(res.body.issues).toEqual([{ path: 'password', message: expect.stringMatching(/common/), code: 'users.commonPassword' }])
    await signedIn(t.app, staff.office)
  })

  it('every problem shows at once: a common password beside a missing name', async () => {
    const res = await m.post('/api/users', { ...newUser('1234567890'), name: '' })
    expect(res.status).toBe(400)
    expect(res.body.issues.map((i: Issue) => i.path).sort()).toEqual(['name', 'password'])
  })
})

describe('a good password is kept in one normal form', () => {
  it('a passphrase with spaces and no digits or capitals is accepted', async () => {
    const body = newUser('wheelbarrow under the ladder')
    expect((await m.post('/api/users', body)).status).toBe(201)
    await signedIn(t.app, body)
  })

  it('NFKC: a password set with a ligature signs in typed with plain letters, and the other way round', async () => {
    const body = newUser('ﬁrst-rate gravel yard')
    expect((await m.post('/api/users', body)).status).toBe(201)
    await signedIn(t.app, { email: body.email, password: 'first-rate gravel yard' })
    await signedIn(t.app, body)
  })

  it('an invisible character inside a password is dropped on both sides', async () => {
    const body = newUser('pass\u200bphrase by the gate')
    expect((await m.post('/api/users', body)).status).toBe(201)
    await signedIn(t.app, { email: body.email, password: 'passphrase by the gate' })
  })

  it('the stored hash is of the normal form', async () => {
    const body = newUser('ｔｏｗ ｔｒｕｃｋ ｃｈａｉｎ')
    const res = await m.post('/api/users', body)
    expect(res.status).toBe(201)
    const [row] = await t.db.select().from(users).where(eq(users.id, res.body.user.id))
    const argon2 = (await import('argon2')).default
    expect(await argon2.verify(row!.passwordHash, 'tow truck chain')).toBe(true)
  })
})
