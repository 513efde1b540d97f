import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { sampleVersion } from '../helpers/board'
import { makeStaff, makeVehicle } from '../helpers/factories'
import { CLAIMANT, vehicleInRelease } from '../helpers/release'
import { anotherVehicle, counts, DEMO_RATES, sampleRuleSet, towInBody } from '../helpers/tow-in'

// A refused field carries its code and parameters beside its English message (issue 14), so the client
// says it in the reader's language (shared/messages/<locale>/fields.json); the English stays as it was.
let app: TestApp
beforeAll(async () => {
  app = await makeTestApp()
})
afterAll(() => app.close())

const catalog = (locale: string) => JSON.parse(readFileSync(join(import.meta.dirname, `../../shared/messages/${locale}/fields.json`), 'utf8')).fields as Record<string, Record<string, string>>
const spoken = (code: string) => ['en', 'es'].every((l) => typeof catalog(l)[code.split('.')[0]!]?.[code.split('.')[1]!] === 'string')
// The Spanish catalog's words with the answer's parameters put in as they came (the client words dates and `what` further).
const spanish = (issue: { code: string; params?: Record<string, string | number> }) =>
  catalog('es')[issue.code.split('.')[0]!]![issue.code.split('.')[1]!]!.replace(/\{(\w+)\}/g, (_, name: string) => String(issue.params?.[name]))

describe('field codes in a 400 answer', () => {
  it('a schema check answers its English message with its code', async () => {
    const staff = await makeStaff(app.db)
    const m = await signedIn(app.app, staff.manager)
    const res = await m.post('/api/users', { email: 'not an address', name: 'New clerk', role: 'office', password: 'gravel-lantern-harbor' })
    expect(res.status).toBe(400)
    expect(res.body.issues).toEqual([{ path: 'email', message: 'Enter a valid e-mail address.', code: 'users.enterValidMailAddress' }])
    expect(res.body.error).toBe('Enter a valid e-mail address.')
    expect(spoken(res.body.issues[0].code)).toBe(true)
  })

  it('a message with a parameter answers the parameter too, and the same English as before', async () => {
    const staff = await makeStaff(app.db)
    const d = await signedIn(app.app, staff.dispatcher)
    const before = await counts(app.db)
    const res = await d.post('/api/vehicles', towInBody(staff.dispatcher.id, (b) => (b.vehicle.odometer = 3_000_001)))
    expect(res.status).toBe(400)
    expect(res.body.issues).toEqual([
      { path: 'vehicle.odometer', message: 'The odometer reading cannot be above 3,000,000.', code: 'common.cannotBeAbove', params: { what: 'odometer', max: '3,000,000' } },
    ])
    expect(spoken(res.body.issues[0].code)).toBe(true)
    expect(await counts(app.db)).toEqual(before)
  })

  it('zod’s own message (no schema wrote it) has no code', async () => {
    const staff = await makeStaff(app.db)
    const m = await signedIn(app.app, staff.manager)
    const res = await m.post('/api/users', { email: 'new@example.test', name: 42, role: 'office', password: 'gravel-lantern-harbor' })
    expect(res.status).toBe(400)
    expect(res.body.issues).toEqual([{ path: 'name', message: expect.stringMatching(/expected string/i) }])
  })

  it('a field only the server can judge (a space already taken) answers a code with the space and the vehicle', async () => {
    const staff = await makeStaff(app.db)
    await app.db.update(t.yards).set({ towRates: DEMO_RATES, ruleSetId: await sampleRuleSet(app.db) }).where(eq(t.yards.id, staff.yard.id))
    const [space] = await app.db.insert(t.yardSpaces).values({ yardId: staff.yard.id, row: 'D', number: 7 }).returning()
    const d = await signedIn(app.app, staff.dispatcher)
    const first = await d.post('/api/vehicles', towInBody(staff.dispatcher.id, (b) => (b.spaceId = space!.id))).expect(201)
    const before = await counts(app.db)
    const second = await d.post('/api/vehicles', towInBody(staff.dispatcher.id, (b) => (anotherVehicle(b), (b.spaceId = space!.id))))
    expect(second.status).toBe(409)
    expect(second.body.issues).toEqual([
      { path: 'spaceId', message: `Space D-7 already holds ${first.body.stockNumber}. Choose another space.`, code: 'spaces.takenBy', params: { label: 'D-7', stock: first.body.stockNumber } },
    ])
    expect(spoken(second.body.issues[0].code)).toBe(true)
    expect(await counts(app.db)).toEqual(before)
  })

  it('an expired ID at the release answers releases.idExpired with the day it expired', async () => {
    const staff = await makeStaff(app.db)
    const { vehicle } = await vehicleInRelease(app.db, staff.yard.id)
    const o = await signedIn(app.app, staff.office)
    const res = await o.put(`/api/vehicles/${vehicle.id}/release/claimant`, { ...CLAIMANT, idExpiry: '2024-01-31' })
    expect(res.status).toBe(400)
    const [issue] = res.body.issues
    expect(issue).toEqual({ path: 'idExpiry', message: 'This ID expired on 2024-01-31: an expired ID cannot be accepted. Ask for a current one.', code: 'releases.idExpired', params: { date: '2024-01-31' } })
    expect(spanish(issue)).toBe('Esta identificación venció el 2024-01-31: no se puede aceptar una identificación vencida. Pida una vigente.')
  })

  it('a space too small for the vehicle answers spaces.tooSmall with the space, its size and the size needed', async () => {
    const staff = await makeStaff(app.db)
    const [version] = await app.db.select().from(t.ruleSetVersions).where(eq(t.ruleSetVersions.id, await sampleVersion(app.db, 'california-sample')))
    await app.db.update(t.yards).set({ towRates: DEMO_RATES, ruleSetId: version!.ruleSetId }).where(eq(t.yards.id, staff.yard.id))
    const [bay] = await app.db.insert(t.yardSpaces).values({ yardId: staff.yard.id, row: 'M', number: 2, size: 'motorcycle' }).returning()
    const d = await signedIn(app.app, staff.dispatcher)
    const before = await counts(app.db)
    const res = await d.post('/api/vehicles', towInBody(staff.dispatcher.id, (b) => (b.spaceId = bay!.id)))
    expect(res.status).toBe(422)
    const [issue] = res.body.issues
    expect(issue).toMatchObject({ path: 'spaceId', code: 'spaces.tooSmall', params: { label: 'M-2', fitCode: 'tooSmall', needs: 'standard', size: 'motorcycle' } })
    expect(issue.message).toBe(`Space M-2: ${issue.params.reason}`)
    expect(spanish(issue)).toBe(`Espacio M-2: ${issue.params.reason}`)
    expect(await counts(app.db)).toEqual(before)
  })

  it('an upload refused for what the file is answers its code with the file’s name', async () => {
    const staff = await makeStaff(app.db)
    const { vehicle } = await vehicleInRelease(app.db, staff.yard.id)
    const o = await signedIn(app.app, staff.dispatcher)
    const svg = Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>')
    const res = await o.agent.post(`/api/vehicles/${vehicle.id}/files`).set('x-csrf-token', o.csrf).field('kind', 'photo').attach('files', svg, 'dent.jpg')
    expect(res.status).toBe(400)
    const [issue] = res.body.issues
    expect(issue).toEqual({
      path: 'files.0',
      message: 'dent.jpg: SVG drawings are not accepted (they can carry scripts). Use JPEG, PNG, WebP or HEIC photos.',
      code: 'files.svg',
      params: { name: 'dent.jpg', what: 'photoTypes' },
    })
    expect(spanish(issue)).toBe('dent.jpg: No se aceptan dibujos SVG (pueden llevar scripts). Use photoTypes.')
    expect(catalog('es').what!.photoTypes).toBe('fotos JPEG, PNG, WebP o HEIC')
  })

  it('a day the server finds in the future (a records request sent tomorrow) answers common.cannotBeInFuture with what it is about', async () => {
    const staff = await makeStaff(app.db)
    const v = await makeVehicle(app.db, staff.yard.id, { state: 'storage' })
    const tomorrow = new Date(Date.now() + 2 * 86_400_000).toISOString().slice(0, 10)
    const res = await (await signedIn(app.app, staff.office)).post(`/api/vehicles/${v.id}/records-requests`, { agency: 'DMV', sentOn: tomorrow })
    expect(res.status).toBe(400)
    expect(res.body.issues).toEqual([{ path: 'sentOn', message: 'The day the request was sent cannot be in the future.', code: 'common.cannotBeInFuture', params: { what: 'requestSentOn' } }])
    expect(catalog('es').common!.cannotBeInFuture).toBe('{What} no puede ser posterior a hoy.')
    expect(catalog('es').what!.requestSentOn).toBe('el día en que se envió la solicitud')
  })

  it('a notice the rule set does not ask for answers notices.ruleAsksNoLetter with the kind as a code', async () => {
    const staff = await makeStaff(app.db)
    const [version] = await app.db.select().from(t.ruleSetVersions).where(eq(t.ruleSetVersions.ruleSetId, await sampleRuleSet(app.db)))
    const v = await makeVehicle(app.db, staff.yard.id, { state: 'storage', ruleSetVersionId: version!.id, estimatedValueCents: 650_000, estimatedValueSource: 'test' })
    const res = await (await signedIn(app.app, staff.office)).post(`/api/vehicles/${v.id}/notices`, { kind: 'disposal_notice' })
    expect(res.status).toBe(400)
    expect(res.body.issues).toEqual([{ path: 'kind', message: 'The rule set asks for no "Notice of intent to dispose" for this vehicle.', code: 'notices.ruleAsksNoLetter', params: { noticeKind: 'disposal_notice' } }])
    expect(spoken(res.body.issues[0].code)).toBe(true)
  })
})
