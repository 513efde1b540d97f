import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { DISPOSITIONS } from '@shared/domain/lifecycle'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { DAY } from '../helpers/board'
import { makeStaff, makeVehicle } from '../helpers/factories'

let t: TestApp
beforeAll(async () => {
  t = await makeTestApp()
})
afterAll(() => t.close())

async function closedYard() {
  const staff = await makeStaff(t.db)
  const now = Date.now()
  for (let i = 0; i < 30; i++) {
    await makeVehicle(t.db, staff.yard.id, {
      state: 'closed',
      disposition: DISPOSITIONS[i % DISPOSITIONS.length],
      plate: `8ARC${String(i).padStart(3, '0')}`,
      make: i === 7 ? 'Veyland' : 'Halvard',
      model: i === 7 ? 'Solace' : 'Finch',
      arrivedAt: new Date(now - (40 + i) * DAY),
      closedAt: new Date(now - i * DAY),
    })
  }
  await makeVehicle(t.db, staff.yard.id, { state: 'storage', plate: '8ARC999' })
  return staff
}

describe('GET /api/vehicles/closed', () => {
  it('archive_pages_mostRecentlyClosedFirstWithTheTotal', async () => {
    const staff = await closedYard()
    const s = await signedIn(t.app, staff.technician)
    const first = await s.get('/api/vehicles/closed?pageSize=25')
    expect(first.status).toBe(200)
    expect(first.body).toMatchObject({ total: 30, page: 1, pageSize: 25 })
    expect(first.body.rows).toHaveLength(25)
    expect(first.body.rows[0].plate).toBe('8ARC000')
    const closedAts = first.body.rows.map((r: { closedAt: string }) => r.closedAt)
    expect([...closedAts].sort().reverse()).toEqual(closedAts)
    const second = await s.get('/api/vehicles/closed?pageSize=25&page=2')
    expect(second.body.rows.map((r: { plate: string }) => r.plate)).toEqual(['8ARC025', '8ARC026', '8ARC027', '8ARC028', '8ARC029'])
  })

  it.each([
    { q: '8arc007', plates: ['8ARC007'], why: 'plate, any case' },
    { q: 'solace veyland', plates: [], why: 'words out of order do not match' },
    { q: 'Veyland Solace', plates: ['8ARC007'], why: 'make and model as said' },
    { q: 'no such thing', plates: [], why: 'nothing matches' },
  ])('archive_search_$why', async ({ q, plates }) => {
    const staff = await closedYard()
    const s = await signedIn(t.app, staff.office)
    const res = await s.get(`/api/vehicles/closed?q=${encodeURIComponent(q)}`)
    expect(res.body.rows.map((r: { plate: string }) => r.plate)).toEqual(plates)
    expect(res.body.total).toBe(plates.length)
  })

  it('archive_byDisposition_listsOnlyThoseThatLeftThatWay', async () => {
    const staff = await closedYard()
    const s = await signedIn(t.app, staff.manager)
    const res = await s.get('/api/vehicles/closed?disposition=scrapped&pageSize=50')
    expect(res.body.total).toBe(6)
    expect(new Set(res.body.rows.map((r: { disposition: string }) => r.disposition))).toEqual(new Set(['scrapped']))
  })

  it('archive_neverShowsActiveVehiclesOrAnotherCompanys', async () => {
    const ours = await closedYard()
    const theirs = await closedYard()
    const s = await signedIn(t.app, ours.dispatcher)
    const res = await s.get('/api/vehicles/closed?pageSize=100')
    expect(res.body.total).toBe(30)
    expect(res.body.rows.map((r: { plate: string }) => r.plate)).not.toContain('8ARC999')
    const theirIds = new Set((await signedIn(t.app, theirs.manager).then((x) => x.get('/api/vehicles/closed?pageSize=100'))).body.rows.map((r: { id: string }) => r.id))
    expect(res.body.rows.some((r: { id: string }) => theirIds.has(r.id))).toBe(false)
  })

  it.each([
    { query: 'pageSize=7', path: 'pageSize' },
    { query: 'page=0', path: 'page' },
    { query: 'disposition=sold', path: 'disposition' },
    { query: `q=${'x'.repeat(61)}`, path: 'q' },
  ])('archive_badQuery_$query_answers400NamingTheField', async ({ query, path }) => {
    const staff = await makeStaff(t.db)
    const s = await signedIn(t.app, staff.manager)
    const res = await s.get(`/api/vehicles/closed?${query}`)
    expect(res.status).toBe(400)
    expect(res.body.issues.map((i: { path: string }) => i.path)).toEqual([path])
  })
})
