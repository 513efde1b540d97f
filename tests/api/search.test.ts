import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { makeTestApp, signedIn, type BrowserSession, type TestApp } from '../helpers/app'
import { makeCompany, makeStaff, makeUser, makeVehicle } from '../helpers/factories'
import { towInBody } from '../helpers/tow-in'

let app: TestApp
let staff: Awaited<ReturnType<typeof makeStaff>>
let d: BrowserSession
let stock: string
beforeAll(async () => {
  app = await makeTestApp()
})
afterAll(() => app.close())
beforeEach(async () => {
  staff = await makeStaff(app.db)
  d = await signedIn(app.app, staff.dispatcher)
  stock = (await d.post('/api/vehicles', towInBody(staff.dispatcher.id)).expect(201)).body.stockNumber
})

const find = async (q: string, s = d) => {
  const res = await s.agent.get('/api/vehicles/search').query({ q })
  expect(res.status, JSON.stringify(res.body)).toBe(200)
  return res.body.hits as { stockNumber: string; matched: string; title: string }[]
}

describe('search from the top bar', () => {
  it.each([
    ['the stock number', () => stock, 'stock number'],
    ['the stock number without dashes, lower case', () => stock.toLowerCase().replaceAll('-', ''), 'stock number'],
    ['the plate with a space in it', () => '7kq m214', 'plate'],
    ['the last six of the VIN', () => '118341', 'VIN'],
    ["part of the owner's name", () => 'vantong', 'owner'],
    // Issue 16 item 17: people describe the car ("the silver Sparrow") as often as they read its numbers.
    ['the make and model, any case', () => 'orlan SPARROW', 'vehicle'],
    ['the model and colour', () => 'sparrow silver', 'vehicle'],
  ])('finds a vehicle by %s', async (_what, q, matched) => {
    expect(await find(q())).toEqual([expect.objectContaining({ stockNumber: stock, matched, title: '2005 Orlan Sparrow Silver' })])
  })

  it('a VIN fragment shorter than six characters is not searched', async () => {
    expect(await find('18341')).toEqual([])
  })

  it('percent and underscore are typed characters, not wildcards', async () => {
    expect(await find('%%')).toEqual([])
    expect(await find('__')).toEqual([])
  })

  it("never shows another company's vehicles", async () => {
    const other = await makeCompany(app.db, 'Rival Recovery')
    await makeVehicle(app.db, other.yard.id, { plate: '7KQM214', ownerName: 'Marisol Vantongeren' })
    const stranger = await signedIn(app.app, await makeUser(app.db, other.company.id, 'office'))
    expect((await find('7KQM214')).map((h) => h.stockNumber)).toEqual([stock])
    expect((await find(stock, stranger))).toEqual([])
  })

  it('a one-letter search is refused with the reason', async () => {
    const res = await d.agent.get('/api/vehicles/search').query({ q: 'a' })
    expect(res.status).toBe(400)
    expect(res.body.issues).toEqual([{ path: 'q', message: 'Type at least 2 characters.', code: 'search.typeAtLeast2' }])
  })
})
