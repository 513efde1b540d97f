import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { makeTestApp, signedIn, type BrowserSession, type TestApp } from '../helpers/app'
import { makeStaff, makeVehicle } from '../helpers/factories'

// Issue 12, Settings → Yards: add, edit, spaces (add, retire), each change in the settings audit.
let app: TestApp
let staff: Awaited<ReturnType<typeof makeStaff>>
let m: BrowserSession
beforeAll(async () => {
  app = await makeTestApp()
  staff = await makeStaff(app.db)
  m = await signedIn(app.app, staff.manager)
}, 60_000)
afterAll(() => app.close())

const send = (method: 'post' | 'patch', path: string, body: object) => m.agent[method](path).set('x-csrf-token', m.csrf).send(body)
const audit = async () => (await m.get('/api/settings/audit?page=1&pageSize=50').expect(200)).body.changes as { action: string; before: unknown; after: unknown }[]
const code = () => `Q${staff.yard.code.slice(1)}`
const newYard = () => ({
  name: 'River lot',
  code: code(),
  address: '5 River Road',
  lat: 36.3,
  lng: -119.4,
  timeZone: 'America/Chicago',
  labourRateCents: 9_500,
  towRates: { hookUpCents: 15_000, perMileCents: 500 },
  spaces: { rows: 2, perRow: 3, size: 'standard' },
})

describe('Settings → Yards', () => {
  it('a manager adds a yard with 2 rows × 3 spaces; it is listed and audited; the manager may choose it', async () => {
    const res = await send('post', '/api/settings/yards', newYard())
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    const list = (await m.get('/api/settings/yards').expect(200)).body.yards as { id: string; code: string; labourRateCents: number; spaces: { label: string }[] }[]
    const made = list.find((y) => y.id === res.body.id)!
    expect(made).toMatchObject({ code: code(), labourRateCents: 9_500, towRates: { hookUpCents: 15_000, perMileCents: 500 } })
    expect(made.spaces.map((s) => s.label)).toEqual(['A-1', 'A-2', 'A-3', 'B-1', 'B-2', 'B-3'])
    expect((await audit())[0]).toMatchObject({ action: 'yard-added', after: { name: 'River lot', spaces: 6 } })
    expect((await m.get('/api/yards/mine').expect(200)).body.yards.map((y: { id: string }) => y.id)).toContain(made.id)
  })

  it('a new yard starts from the rule set chosen: a sample or the company’s own copy', async () => {
    const copy = await send('post', '/api/settings/rule-sets/florida-sample/copy', { name: 'Our Florida' })
    expect(copy.status, JSON.stringify(copy.body)).toBe(201)
    for (const [ruleSet, yardCode] of [['ordinance-24h-template', 'QRA'], [copy.body.id, 'QRB']] as const) {
      const res = await send('post', '/api/settings/yards', { ...newYard(), code: yardCode, ruleSet })
      expect(res.status, JSON.stringify(res.body)).toBe(201)
      const [row] = await app.db.select({ slug: t.ruleSets.slug }).from(t.yards).innerJoin(t.ruleSets, eq(t.ruleSets.id, t.yards.ruleSetId)).where(eq(t.yards.id, res.body.id))
      expect(row!.slug).toBe(ruleSet)
    }
  })

  it('a rule set not offered — unknown, or another company’s own — is refused naming ruleSet, and nothing is written', async () => {
    const other = await makeStaff(app.db)
    const o = await signedIn(app.app, other.manager)
    const copy = await o.agent.post('/api/settings/rule-sets/california-sample/copy').set('x-csrf-token', o.csrf).send({ name: 'Their rates' })
    expect(copy.status, JSON.stringify(copy.body)).toBe(201)
    const yardsBefore = await app.db.$count(t.yards)
    const auditBefore = (await audit()).length
    for (const ruleSet of ['nevada-sample', copy.body.id]) {
      const res = await send('post', '/api/settings/yards', { ...newYard(), code: 'QRC', ruleSet })
      expect(res.status).toBe(400)
      expect(res.body.issues).toEqual([expect.objectContaining({ path: 'ruleSet', code: 'yardSettings.unknownRuleSet' })])
    }
    expect(await app.db.$count(t.yards)).toBe(yardsBefore)
    expect((await audit()).length).toBe(auditBefore)
  })

  it('an edit saves only what changed and audits before and after', async () => {
    const res = await send('patch', `/api/settings/yards/${staff.yard.id}`, { labourRateCents: 12_000, towRates: { hookUpCents: 17_500, perMileCents: 600, afterHoursCents: 5_000 } })
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    const [row] = await app.db.select().from(t.yards).where(eq(t.yards.id, staff.yard.id))
    expect(row).toMatchObject({ labourRateCents: 12_000, towRates: { hookUpCents: 17_500, perMileCents: 600, afterHoursCents: 5_000 } })
    const [last] = await audit()
    expect(last).toMatchObject({ action: 'yard-edited', before: { labourRateCents: 0 }, after: { labourRateCents: 12_000, 'towRates.hookUpCents': 17_500 } })
  })

  it.each([
    [{ labourRateCents: -1 }, 'labourRateCents'],
    [{ labourRateCents: 12.5 }, 'labourRateCents'],
    [{ towRates: { hookUpCents: -100, perMileCents: 0 } }, 'towRates.hookUpCents'],
    [{ timeZone: 'Mars/Olympus' }, 'timeZone'],
    [{ code: 'x1' }, 'code'],
    [{ name: '' }, 'name'],
  ])('a bad value %j is refused naming %s, and nothing is written', async (body, path) => {
    const before = await app.db.select().from(t.yards).where(eq(t.yards.id, staff.yard.id))
    const count = (await audit()).length
    const res = await send('patch', `/api/settings/yards/${staff.yard.id}`, body)
    expect(res.status).toBe(400)
    expect(res.body.issues.map((i: { path: string }) => i.path)).toContain(path)
    expect(await app.db.select().from(t.yards).where(eq(t.yards.id, staff.yard.id))).toEqual(before)
    expect((await audit()).length).toBe(count)
  })

  it('a prefix another yard uses is refused naming code', async () => {
    const res = await send('patch', `/api/settings/yards/${staff.yard.id}`, { code: code() })
    expect(res.status).toBe(409)
    expect(res.body.issues[0].path).toBe('code')
  })

  it('spaces are added by rows × numbers; an overlap is refused naming firstRow', async () => {
    const ok = await send('post', `/api/settings/yards/${staff.yard.id}/spaces`, { firstRow: 'M', rows: 1, perRow: 2, size: 'motorcycle' })
    expect(ok.status, JSON.stringify(ok.body)).toBe(201)
    const again = await send('post', `/api/settings/yards/${staff.yard.id}/spaces`, { firstRow: 'M', rows: 1, perRow: 4, size: 'standard' })
    expect(again.status).toBe(409)
    expect(again.body.issues).toEqual([{ path: 'firstRow', message: 'Space M-1 already exists. Start at another row.', code: 'yardSettings.spaceExists', params: { label: 'M-1' } }])
    expect((await audit())[0]).toMatchObject({ action: 'spaces-added', after: { rows: 'M–M', numbers: '1–2', size: 'motorcycle', spaces: 2 } })
  })

  it('a space with a vehicle on it cannot be retired (the reason names the vehicle); an empty one can', async () => {
    const spaces = await app.db.select().from(t.yardSpaces).where(eq(t.yardSpaces.yardId, staff.yard.id))
    const [held, empty] = spaces.filter((s) => s.row === 'M')
    const v = await makeVehicle(app.db, staff.yard.id, { spaceId: held!.id })
    const refused = await send('post', `/api/settings/yards/${staff.yard.id}/spaces/${held!.id}/retire`, {})
    expect(refused.status).toBe(409)
    expect(refused.body.issues).toEqual([{ path: 'spaceId', message: `Space M-1 holds ${v.stockNumber}: move the vehicle out before retiring the space.`, code: 'yardSettings.spaceHolds', params: { label: 'M-1', stock: v.stockNumber } }])
    expect((await app.db.select().from(t.yardSpaces).where(eq(t.yardSpaces.id, held!.id)))[0]!.retiredAt).toBeNull()
    await send('post', `/api/settings/yards/${staff.yard.id}/spaces/${empty!.id}/retire`, {}).expect(200)
    expect((await audit())[0]).toMatchObject({ action: 'space-retired', after: { space: 'M-2', retired: true } })
  })

  it('another company’s yard is 404 to edit, as one that does not exist', async () => {
    const other = await makeStaff(app.db)
    expect((await send('patch', `/api/settings/yards/${other.yard.id}`, { labourRateCents: 1 })).status).toBe(404)
    expect((await send('patch', '/api/settings/yards/00000000-0000-4000-8000-000000000000', { labourRateCents: 1 })).status).toBe(404)
    expect((await app.db.select().from(t.yards).where(eq(t.yards.id, other.yard.id)))[0]!.labourRateCents).toBe(0)
  })
})
