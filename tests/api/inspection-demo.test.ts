import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { historyOf, verifyChain } from '@db/history'
import * as t from '@db/schema'
import { DEMO_PASSWORD } from '../../server/demo/scenario'
import { loadDemoIfEmpty } from '../../server/demo/seed'
import { makeTestApp, signedIn, type BrowserSession, type TestApp, TEST_HISTORY_KEY } from '../helpers/app'

let app: TestApp
let tech: BrowserSession
beforeAll(async () => {
  app = await makeTestApp()
  await loadDemoIfEmpty(app.db, TEST_HISTORY_KEY)
  tech = await signedIn(app.app, { email: 'sunny@tamsincreek.example', password: DEMO_PASSWORD })
  // The demo is played through the services: hundreds of changes, slow on a busy machine.
}, 180_000)
afterAll(() => app.close())

async function demoVehicle(model: string) {
  const [v] = await app.db.select().from(t.vehicles).where(eq(t.vehicles.model, model))
  return v!
}

describe('the demo yard’s finished teardowns', () => {
  it.each([
    // Invented figures; the demo rule set is the California sample (Total Loss Formula) at $125.00 an hour.
    { model: 'Wren', state: 'decision', broken: ['drive-shafts'], pickup: 'Flatbed or dollies', recommendation: 'repair' },
    { model: 'Brio', state: 'decision', broken: ['ball-joints', 'control-arms'], pickup: 'Flatbed or dollies', recommendation: 'repair' },
    { model: 'S6', state: 'storage', broken: ['front-body', 'struts-shocks', 'drive-shafts', 'frame-rails', 'windshield'], pickup: 'Flatbed or dollies', recommendation: 'salvage' },
    { model: 'Homestead', state: 'storage', broken: ['engine'], pickup: 'Wheel-lift', recommendation: 'salvage' },
  ])('demo $model: finished, priced and advised as its notes say', async ({ model, state, broken, pickup, recommendation }) => {
    const v = await demoVehicle(model)
    const page = (await tech.get(`/api/vehicles/${v.id}/inspection`).expect(200)).body
    expect(page.vehicle.state).toBe(state)
    expect(page.inspection.finished.at).toBe(v.inspectedAt!.toISOString())
    expect(page.inspection.items.filter((i: { status: string }) => i.status === 'broken').map((i: { code: string }) => i.code)).toEqual(broken)
    expect(page.inspection.values.actualCashValueCents).toBe(v.estimatedValueCents)
    expect(page.pickup.label).toBe(pickup)
    expect(page.recommendation.recommendation).toBe(recommendation)
  })

  it('demo teardowns sit in each chain of custody between the move to Teardown and the move on', async () => {
    const v = await demoVehicle('Brio')
    const events = await historyOf(app.db, v.id)
    expect(verifyChain(TEST_HISTORY_KEY, events).ok).toBe(true)
    const kinds = events.map((e) => `${e.kind}${e.toState ? `:${e.toState}` : ''}`)
    const [teardown, started, finished, decision] = ['moved:teardown', 'inspection_started', 'inspection_finished', 'moved:decision'].map((k) => kinds.indexOf(k))
    expect(teardown).toBeLessThan(started!)
    expect(started).toBeLessThan(finished!)
    expect(finished).toBeLessThan(decision!)
  })
})
