import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { historyOf } from '@db/history'
import * as t from '@db/schema'
import { duplicateTowInSchema } from '@shared/schemas/tow-in'
import { makeTestApp, signedIn, type BrowserSession, type TestApp } from '../helpers/app'
import { makeStaff } from '../helpers/factories'
import { counts, towInBody } from '../helpers/tow-in'

// Issue 16, item 14: the same vehicle logged twice, both billed. A tow-in that matches a vehicle still
// in the yard (same VIN, or same plate and state) is answered with the match and a link, and goes
// ahead only with the dispatcher's reason.
let app: TestApp
let staff: Awaited<ReturnType<typeof makeStaff>>
let d: BrowserSession
beforeAll(async () => {
  app = await makeTestApp()
})
afterAll(() => app.close())
beforeEach(async () => {
  staff = await makeStaff(app.db)
  d = await signedIn(app.app, staff.dispatcher)
})

const logged = async (edit: Parameters<typeof towInBody>[1] = () => {}) => (await d.post('/api/vehicles', towInBody(staff.dispatcher.id, edit)).expect(201)).body as { id: string; stockNumber: string }

describe('a vehicle already on the lot', () => {
  it('the same VIN is refused with the vehicle it matches, and nothing is written', async () => {
    const first = await logged()
    const before = await counts(app.db)
    const res = await d.post('/api/vehicles', towInBody(staff.dispatcher.id, (b) => (b.vehicle.plate = 'OTHER1')))
    expect(res.status).toBe(409)
    const body = duplicateTowInSchema.parse(res.body)
    expect(body.duplicates).toEqual([{ id: first.id, stockNumber: first.stockNumber, matches: ['vin'] }])
    expect(body.error).toContain(`${first.stockNumber} has the same VIN`)
    expect(await counts(app.db)).toEqual(before)
  })

  it('the same plate from the same state, spaced or lower-case, is found too', async () => {
    const first = await logged((b) => ((b.vehicle.vin = null), (b.vehicle.vinOverrideReason = 'VIN plate burnt'), (b.vehicle.plate = '7ABC123')))
    const res = await d.post('/api/vehicles', towInBody(staff.dispatcher.id, (b) => ((b.vehicle.vin = null), (b.vehicle.vinOverrideReason = 'Plate only'), (b.vehicle.plate = '7abc 123'))))
    expect(res.status).toBe(409)
    expect(duplicateTowInSchema.parse(res.body).duplicates).toEqual([{ id: first.id, stockNumber: first.stockNumber, matches: ['plate'] }])
  })

  it('with the dispatcher’s reason it is logged, and the history says which vehicle it resembled and why', async () => {
    const first = await logged()
    const second = await logged((b) => (b.duplicateReason = 'Second tow: released yesterday, towed again today'))
    const [event] = await historyOf(app.db, second.id)
    expect(event!.after).toMatchObject({ alsoOnTheLot: [first.stockNumber], whySeparate: 'Second tow: released yesterday, towed again today' })
  })

  it('a closed vehicle, or another company’s, does not count', async () => {
    const first = await logged()
    await app.db.update(t.vehicles).set({ state: 'closed', disposition: 'returned_to_owner', spaceId: null, closedAt: new Date() }).where(eq(t.vehicles.id, first.id))
    await logged()
    const other = await makeStaff(app.db)
    const theirs = await signedIn(app.app, other.dispatcher)
    await theirs.post('/api/vehicles', towInBody(other.dispatcher.id)).expect(201)
  })
})
