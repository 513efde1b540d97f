import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { sampleVersion } from '../helpers/board'
import { makeStaff, makeVehicle } from '../helpers/factories'

// A refusal carries a code and its parameters beside the English sentence, so the client says it in the
// reader's language (shared/messages/<locale>/refusals.json); the sentence stays for API clients.
let t_: TestApp
beforeAll(async () => {
  t_ = await makeTestApp()
})
afterAll(() => t_.close())

const catalog = (locale: string) => JSON.parse(readFileSync(join(import.meta.dirname, `../../shared/messages/${locale}/refusals.json`), 'utf8')).refusals as Record<string, unknown>
const spoken = (code: unknown) => ['en', 'es'].every((l) => typeof catalog(l)[String(code)] === 'string')

describe('refusal codes in the answers', () => {
  it('a stale move answers 409 with movedElsewhere, the stock number and the column it is in now', async () => {
    const staff = await makeStaff(t_.db)
    const v = await makeVehicle(t_.db, staff.yard.id)
    const s = await signedIn(t_.app, staff.dispatcher)
    expect((await s.post(`/api/vehicles/${v.id}/moves`, { to: 'teardown', version: 1 })).status).toBe(200)
    const stale = await s.post(`/api/vehicles/${v.id}/moves`, { to: 'teardown', version: 1 })
    expect(stale.status).toBe(409)
    expect(stale.body).toMatchObject({ code: 'movedElsewhere', params: { stock: v.stockNumber, column: 'teardown' } })
    expect(stale.body.error).toContain(v.stockNumber)
    expect(spoken(stale.body.code)).toBe(true)
  })

  it('a hold lifted twice answers 409 with holdLifted and the day it was lifted', async () => {
    const staff = await makeStaff(t_.db)
    const v = await makeVehicle(t_.db, staff.yard.id, { state: 'storage' })
    const d = await signedIn(t_.app, staff.dispatcher)
    const set = await d.post(`/api/vehicles/${v.id}/holds`, { kind: 'dispute', note: 'Owner disputes the tow' })
    expect(set.status).toBe(201)
    const holdId = set.body.holds[0].id
    expect((await d.post(`/api/vehicles/${v.id}/holds/${holdId}/lift`, { reason: 'Settled' })).status).toBe(200)
    const again = await d.post(`/api/vehicles/${v.id}/holds/${holdId}/lift`, { reason: 'Settled' })
    expect(again.status).toBe(409)
    expect(again.body).toMatchObject({ code: 'holdLifted', params: { date: expect.stringMatching(/^\d{4}-\d{2}-\d{2}$/) } })
    expect(spoken(again.body.code)).toBe(true)
  })

  it('a role the access table refuses answers 403 with forbidden; an unknown vehicle 404 with notFound', async () => {
    const staff = await makeStaff(t_.db)
    const tech = await signedIn(t_.app, staff.technician)
    const refused = await tech.post('/api/users', { email: 'new@example.test', name: 'New', role: 'office' })
    expect(refused.status).toBe(403)
    expect(refused.body.code).toBe('forbidden')
    const missing = await (await signedIn(t_.app, staff.manager)).get('/api/vehicles/00000000-0000-4000-8000-000000000000')
    expect(missing.status).toBe(404)
    expect(missing.body.code).toBe('notFound')
    expect([refused.body.code, missing.body.code].every(spoken)).toBe(true)
  })

  it('a computation’s refusal (a release before arrival) answers its DomainError code, worded under refusals', async () => {
    await sampleVersion(t_.db, 'california-sample')
    const staff = await makeStaff(t_.db)
    const s = await signedIn(t_.app, staff.office)
    const res = await s.post('/api/quotes/storage', {
      ruleSetId: 'california-sample',
      stay: { arrivedAt: '2026-03-02T09:00:00-08:00', releasedAt: '2026-03-01T09:00:00-08:00', vehicleClass: 'standard' },
      asOf: '2026-03-04T12:00:00-08:00',
    })
    expect(res.status).toBe(400)
    expect(res.body).toMatchObject({ error: 'The release time is before the arrival time.', code: 'release-before-arrival', issues: [{ path: 'releasedAt', message: 'The release time is before the arrival time.' }] })
    expect(spoken(res.body.code)).toBe(true)
    expect(catalog('es')['release-before-arrival']).toBe('La hora de entrega es anterior a la hora de llegada.')
  })

  it('a quote under a rule set that does not exist answers noSuchRuleSet with its name, and the field’s own code', async () => {
    const staff = await makeStaff(t_.db)
    const s = await signedIn(t_.app, staff.office)
    const res = await s.post('/api/quotes/storage', { ruleSetId: 'atlantis-sample', stay: { arrivedAt: '2026-03-02T09:00:00-08:00', vehicleClass: 'standard' }, asOf: '2026-03-04T12:00:00-08:00' })
    expect(res.status).toBe(400)
    expect(res.body).toMatchObject({ error: 'There is no rule set "atlantis-sample".', code: 'noSuchRuleSet', params: { slug: 'atlantis-sample' }, issues: [{ path: 'ruleSetId', code: 'quotes.noSuchRuleSet' }] })
    expect(String(catalog('es').noSuchRuleSet).replace('{slug}', res.body.params.slug)).toBe('No existen las reglas "atlantis-sample".')
  })
})

