import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { companies, ruleSets, yards } from '@db/schema'
import { createYard } from '../../server/yards/yards.service'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { makeUser } from '../helpers/factories'

let t: TestApp
beforeAll(async () => {
  t = await makeTestApp()
})
afterAll(() => t.close())

const setup = { name: 'Dock Road yard', code: 'DR', address: '9 Dock Rd', lat: 45.5, lng: -122.6, timeZone: 'America/Los_Angeles', ruleSet: 'florida-sample' }

describe('a real yard without the demo', () => {
  it('createYard loads the sample rule sets on first use and the new manager sees an empty board', async () => {
    const [company] = await t.db.insert(companies).values({ name: 'Harbor Light Recovery' }).returning()
    const yard = await createYard(t.db, company!.id, setup)
    const [set] = await t.db.select().from(ruleSets).where(eq(ruleSets.id, yard.ruleSetId!))
    expect(set!.slug).toBe('florida-sample')
    const manager = await makeUser(t.db, company!.id, 'manager')
    const s = await signedIn(t.app, manager)
    const board = await s.get('/api/board').expect(200)
    expect(board.body.yard.name).toBe('Dock Road yard')
    expect(board.body.columns.every((c: { cards: unknown[] }) => c.cards.length === 0)).toBe(true)
  })

  it('a second yard with the same code is refused, so stock numbers cannot repeat', async () => {
    const [company] = await t.db.insert(companies).values({ name: 'Second Co' }).returning()
    await expect(createYard(t.db, company!.id, { ...setup, code: 'DR' })).rejects.toThrow(/already used/)
    expect((await t.db.select().from(yards).where(eq(yards.companyId, company!.id))).length).toBe(0)
  })
})
