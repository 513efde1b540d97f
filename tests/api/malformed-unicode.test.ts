import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { browserSession, makeTestApp, signedIn, type BrowserSession, type TestApp } from '../helpers/app'
import { makeStaff } from '../helpers/factories'
import { counts, sampleRuleSet, towInBody } from '../helpers/tow-in'

// A lone UTF-16 surrogate is valid in a JSON string ("\ud800") but is no character at all: PostgreSQL's
// jsonb refuses it (a 500 from the history insert) and a text column silently stores U+FFFD instead.
const HIGH = 'Owner \ud83d disputes'
const LOW = 'Reyna \udc00'

let app: TestApp
let staff: Awaited<ReturnType<typeof makeStaff>>
let d: BrowserSession
let id: string
beforeAll(async () => {
  app = await makeTestApp()
})
afterAll(() => app.close())
beforeEach(async () => {
  staff = await makeStaff(app.db)
  await app.db.update(t.yards).set({ ruleSetId: await sampleRuleSet(app.db) }).where(eq(t.yards.id, staff.yard.id))
  d = await signedIn(app.app, staff.dispatcher)
  id = (await d.post('/api/vehicles', towInBody(staff.dispatcher.id)).expect(201)).body.id
})

type Issue = { path: string; message: string }
const BROKEN = /broken character/

describe('text with a lone surrogate is refused as a 400 naming the field, and nothing is written', () => {
  it.each<[string, () => Promise<{ status: number; body: { issues?: Issue[] } }>, string]>([
    ['a move reason (history)', () => d.post(`/api/vehicles/${id}/moves`, { to: 'teardown', version: 1, reason: HIGH }), 'reason'],
    ['a hold note (history)', () => d.post(`/api/vehicles/${id}/holds`, { kind: 'dispute', note: HIGH }), 'note'],
    ['a correction reason (history)', () => d.patch(`/api/vehicles/${id}`, { version: 1, reason: LOW, conditionNotes: 'Scrape' }), 'reason'],
    ['a tow-in requester', () => d.post('/api/vehicles', towInBody(staff.dispatcher.id, (b) => (b.tow.requesterName = LOW))), 'tow.requesterName'],
    ['a property item on a tow-in', () => d.post('/api/vehicles', towInBody(staff.dispatcher.id, (b) => (b.condition.property = [{ item: HIGH }]))), 'condition.property.0.item'],
  ])('%s', async (_name, send, path) => {
    const before = await counts(app.db)
    const res = await send()
    expect(res.status, JSON.stringify(res.body)).toBe(400)
    expect(res.body.issues).toEqual([{ path, message: expect.stringMatching(BROKEN), code: 'common.containsBrokenCharacterLone' }])
    expect(await counts(app.db)).toEqual(before)
  })

  it('a user rename (no history) is refused instead of storing a replacement character', async () => {
    const m = await signedIn(app.app, staff.manager)
    const res = await m.patch(`/api/users/${staff.office.id}`, { name: LOW })
    expect(res.status).toBe(400)
    expect(res.body.issues).toEqual([{ path: 'name', message: expect.stringMatching(BROKEN), code: 'common.containsBrokenCharacterLone' }])
    const [row] = await app.db.select().from(t.users).where(eq(t.users.id, staff.office.id))
    expect(row!.name).toBe('Test office')
  })

  it('a new user with a broken name or password is refused and not created', async () => {
    const m = await signedIn(app.app, staff.manager)
    const before = await app.db.$count(t.users)
    const res = await m.post('/api/users', { email: 'broken@test.example', name: HIGH, role: 'office', password: `wheelbarrow ${LOW} ladder` })
    expect(res.status).toBe(400)
    expect(res.body.issues.map((i: Issue) => i.path).sort()).toEqual(['name', 'password'])
    expect(await app.db.$count(t.users)).toBe(before)
  })

  it('a sign-in password with a lone surrogate is refused before it is hashed (U+FFFD would match any other)', async () => {
    const s = await browserSession(app.app)
    const res = await s.signIn(staff.office.email, '\ud800\ud800\ud800')
    expect(res.status).toBe(400)
    expect(res.body.issues).toEqual([{ path: 'password', message: expect.stringMatching(BROKEN), code: 'common.containsBrokenCharacterLone' }])
  })

  it('a paired surrogate (an emoji) is a real character and is kept as typed', async () => {
    const m = await signedIn(app.app, staff.manager)
    await m.patch(`/api/users/${staff.office.id}`, { name: 'Priya 🚗 Okonjo' }).expect(200)
    const [row] = await app.db.select().from(t.users).where(eq(t.users.id, staff.office.id))
    expect(row!.name).toBe('Priya 🚗 Okonjo')
  })
})
