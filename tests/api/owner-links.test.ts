import { Writable } from 'node:stream'
import { eq, sql } from 'drizzle-orm'
import { pino } from 'pino'
import request from 'supertest'
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { historyOf } from '@db/history'
import * as t from '@db/schema'
import { CODE_ALPHABET, formatCode } from '@shared/schemas/owner'
import { browserSession, makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { makeStaff, makeVehicle } from '../helpers/factories'
import { DAY, historyCount, sampleVersion, vehicleRow } from '../helpers/board'
import { photo } from '../helpers/tow-in'

// The owner's page (issue 10): a link reaches one vehicle's owner view and its own choice — nothing
// else; its token and code are stored only as hashes, expire, can be withdrawn and never reach the log.
let lines: string[] = []
const captured = new Writable({
  write(chunk, _encoding, done) {
    lines.push(...String(chunk).split('\n').filter(Boolean))
    done()
  },
})

let app: TestApp
beforeAll(async () => {
  app = await makeTestApp({ log: pino({ level: 'info' }, captured), publicLimits: { perAddress: 1000, windowMs: 60_000 } })
})
afterAll(() => app.close())
beforeEach(() => {
  lines = []
})

/** A company's staff and two vehicles of its yard billed by the California sample, each with a photo. */
async function fixture() {
  const staff = await makeStaff(app.db)
  const ruleSetVersionId = await sampleVersion(app.db, 'california-sample')
  const arrivedAt = new Date(Date.now() - 3 * DAY)
  const a = await makeVehicle(app.db, staff.yard.id, { state: 'storage', ruleSetVersionId, arrivedAt, plate: '7KQM214', vin: '1G4AH59H45G118341', colour: 'Silver' })
  const b = await makeVehicle(app.db, staff.yard.id, { state: 'storage', ruleSetVersionId, arrivedAt, plate: '6WPL903' })
  const office = await signedIn(app.app, staff.office)
  // Photos and papers are the dispatcher's to add.
  const dispatcher = await signedIn(app.app, staff.dispatcher)
  const photoOf = async (vehicleId: string) => {
    const res = await dispatcher.agent.post(`/api/vehicles/${vehicleId}/files`).set('x-csrf-token', dispatcher.csrf).field('kind', 'photo').attach('files', await photo(), 'front.jpg')
    expect(res.status).toBe(201)
    return res.body.files[0].id as string
  }
  const idOf = async (vehicleId: string) => {
    const res = await dispatcher.agent.post(`/api/vehicles/${vehicleId}/files`).set('x-csrf-token', dispatcher.csrf).field('kind', 'id').attach('files', await photo(), 'licence.jpg')
    return res.body.files[0].id as string
  }
  return { staff, a, b, office, photoA: await photoOf(a.id), photoB: await photoOf(b.id), idA: await idOf(a.id) }
}

async function createLink(session: Awaited<ReturnType<typeof signedIn>>, vehicleId: string) {
  const res = await session.post(`/api/vehicles/${vehicleId}/owner-links`)
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  return res.body as { link: { id: string; expiresAt: string }; token: string; code: string; path: string }
}

const anonymous = () => browserSession(app.app)

describe('owner links: made by the office, stored as hashes', () => {
  it('a new link carries a 256-bit token and a 10-character code; neither is in the database or the history in the clear', async () => {
    const f = await fixture()
    const created = await createLink(f.office, f.a.id)
    expect(created.token).toMatch(/^[A-Za-z0-9_-]{43}$/)
    expect(created.code).toMatch(new RegExp(`^[${CODE_ALPHABET}]{10}$`))
    expect(created.path).toBe(`/o/${created.token}`)
    // 30 days by default (AppDeps.ownerLinkDays).
    expect(Date.parse(created.link.expiresAt) - Date.now()).toBeGreaterThan(29.9 * DAY)

    const dump = JSON.stringify(await app.db.execute(sql`select * from owner_links`)) + JSON.stringify(await historyOf(app.db, f.a.id))
    expect(dump).not.toContain(created.token)
    expect(dump).not.toContain(created.code)
    const events = (await historyOf(app.db, f.a.id)).map((e) => e.kind)
    expect(events).toContain('owner_link_created')
  })

  it.each(['dispatcher', 'technician'] as const)('a %s may not create or revoke a link (403), nothing written', async (role) => {
    const f = await fixture()
    const s = await signedIn(app.app, f.staff[role])
    const before = await historyCount(app.db, f.a.id)
    expect((await s.post(`/api/vehicles/${f.a.id}/owner-links`)).status).toBe(403)
    const link = await createLink(f.office, f.a.id)
    expect((await s.post(`/api/vehicles/${f.a.id}/owner-links/${link.link.id}/revoke`)).status).toBe(403)
    expect(await historyCount(app.db, f.a.id)).toBe(before + 1)
  })

  it("another company's office cannot see, create or revoke links on this vehicle (404)", async () => {
    const f = await fixture()
    const other = await makeStaff(app.db)
    const s = await signedIn(app.app, other.office)
    const link = await createLink(f.office, f.a.id)
    expect((await s.get(`/api/vehicles/${f.a.id}/owner-links`)).status).toBe(404)
    expect((await s.post(`/api/vehicles/${f.a.id}/owner-links`)).status).toBe(404)
    expect((await s.post(`/api/vehicles/${f.a.id}/owner-links/${link.link.id}/revoke`)).status).toBe(404)
    expect((await request(app.app).get(`/api/owner/${link.token}`)).status).toBe(200)
  })

  it('neither the token nor the code reaches the request log', async () => {
    const f = await fixture()
    const link = await createLink(f.office, f.a.id)
    await request(app.app).get(`/api/owner/${link.token}`).expect(200)
    await request(app.app).get(`/api/owner/${formatCode(link.code)}`).expect(200)
    await request(app.app).get(`/api/owner/${link.token}/files/${f.photoA}`).expect(200)
    await request(app.app).get(`/api/owner/${link.token}/quote?date=2099-01-01`)
    const log = lines.join('\n')
    expect(log).toContain('/api/owner/[Redacted]')
    expect(log).not.toContain(link.token)
    expect(log).not.toContain(link.code)
    expect(log).not.toContain(formatCode(link.code))
  })
})

describe("the owner's page", () => {
  it('opens by the token and by the code as typed from a letter (any case, with its dash)', async () => {
    const f = await fixture()
    const link = await createLink(f.office, f.a.id)
    const byToken = await request(app.app).get(`/api/owner/${link.token}`).expect(200)
    expect(byToken.body.vehicle).toMatchObject({ stockNumber: f.a.stockNumber, plate: '7KQM214', colour: 'Silver', year: 2013, make: 'Halvard' })
    expect(byToken.body.bill.balanceCents).toBeGreaterThan(0)
    expect(byToken.body.photos.map((p: { id: string }) => p.id)).toEqual([f.photoA])
    expect(byToken.headers['cache-control']).toBe('private, no-store')
    const byCode = await request(app.app).get(`/api/owner/${formatCode(link.code).toLowerCase()}`).expect(200)
    expect(byCode.body.vehicle.stockNumber).toBe(f.a.stockNumber)
  })

  it('shows no staff names, e-mail addresses, VIN, IDs or papers', async () => {
    const f = await fixture()
    const link = await createLink(f.office, f.a.id)
    const text = JSON.stringify((await request(app.app).get(`/api/owner/${link.token}`).expect(200)).body)
    for (const secret of [f.staff.office.name, f.staff.office.email, f.staff.manager.email, '1G4AH59H45G118341', f.idA, f.a.id]) expect(text).not.toContain(secret)
  })

  it('an expired link opens nothing (410) on every owner route', async () => {
    const f = await fixture()
    const link = await createLink(f.office, f.a.id)
    const past = new Date(Date.now() - 2 * DAY)
    await app.db.update(t.ownerLinks).set({ createdAt: new Date(past.getTime() - DAY), expiresAt: past }).where(eq(t.ownerLinks.id, link.link.id))
    const owner = await anonymous()
    for (const res of [
      await owner.get(`/api/owner/${link.token}`),
      await owner.get(`/api/owner/${link.code}`),
      await owner.get(`/api/owner/${link.token}/quote?date=2099-01-01`),
      await owner.get(`/api/owner/${link.token}/files/${f.photoA}`),
      await owner.post(`/api/owner/${link.token}/decision`, { choice: 'collect', fullName: 'Marisol Vantongeren' }),
    ]) {
      expect(res.status).toBe(410)
      expect(res.body.error).toMatch(/expired/)
    }
    expect(await app.db.$count(t.ownerDecisions, eq(t.ownerDecisions.vehicleId, f.a.id))).toBe(0)
  })

  it('a revoked link opens nothing (410) and the revocation is in the history', async () => {
    const f = await fixture()
    const link = await createLink(f.office, f.a.id)
    const revoked = await f.office.post(`/api/vehicles/${f.a.id}/owner-links/${link.link.id}/revoke`)
    expect(revoked.status).toBe(200)
    expect(revoked.body.links[0]).toMatchObject({ id: link.link.id, status: 'revoked', revokedBy: f.staff.office.name })
    const owner = await anonymous()
    expect((await owner.get(`/api/owner/${link.token}`)).status).toBe(410)
    expect((await owner.get(`/api/owner/${link.token}/files/${f.photoA}`)).status).toBe(410)
    expect((await owner.post(`/api/owner/${link.token}/decision`, { choice: 'collect', fullName: 'Marisol Vantongeren' })).status).toBe(410)
    expect((await historyOf(app.db, f.a.id)).map((e) => e.kind)).toContain('owner_link_revoked')
    // A second revoke changes nothing.
    const before = await historyCount(app.db, f.a.id)
    expect((await f.office.post(`/api/vehicles/${f.a.id}/owner-links/${link.link.id}/revoke`)).status).toBe(200)
    expect(await historyCount(app.db, f.a.id)).toBe(before)
  })

  it("a link for vehicle A never reaches vehicle B: B's photo is not found and A's ID is not a photo", async () => {
    const f = await fixture()
    const link = await createLink(f.office, f.a.id)
    const owner = await anonymous()
    expect((await owner.get(`/api/owner/${link.token}/files/${f.photoA}`)).status).toBe(200)
    expect((await owner.get(`/api/owner/${link.token}/files/${f.photoB}`)).status).toBe(404)
    expect((await owner.get(`/api/owner/${link.token}/files/${f.photoB}/thumb`)).status).toBe(404)
    expect((await owner.get(`/api/owner/${link.token}/files/${f.idA}`)).status).toBe(404)
    // Its choice lands on A only.
    const versionB = (await vehicleRow(app.db, f.b.id)).version
    expect((await owner.post(`/api/owner/${link.token}/decision`, { choice: 'collect', fullName: 'Marisol Vantongeren' })).status).toBe(201)
    expect((await vehicleRow(app.db, f.a.id)).ownerChoice).toBe('collect')
    expect(await vehicleRow(app.db, f.b.id)).toMatchObject({ ownerChoice: null, version: versionB })
  })

  it("the owner's browser reaches no staff route or data", async () => {
    const f = await fixture()
    const link = await createLink(f.office, f.a.id)
    const owner = await anonymous()
    expect((await owner.get(`/api/owner/${link.token}`)).status).toBe(200)
    for (const url of [`/api/vehicles/${f.a.id}`, `/api/vehicles/${f.a.id}/history`, `/api/vehicles/${f.a.id}/owner-links`, '/api/board', `/api/files/${f.photoA}`, '/api/users', '/api/map/settings']) {
      expect((await owner.get(url)).status, url).toBe(401)
    }
    const before = await vehicleRow(app.db, f.a.id)
    expect((await owner.post(`/api/vehicles/${f.a.id}/owner-links`)).status).toBe(401)
    expect((await owner.post(`/api/vehicles/${f.a.id}/owner-links/${link.link.id}/revoke`)).status).toBe(401)
    expect((await owner.post(`/api/vehicles/${f.a.id}/moves`, { to: 'release', version: before.version })).status).toBe(401)
    expect((await owner.patch(`/api/vehicles/${f.a.id}`, { plate: 'X' })).status).toBe(401)
    // The owner routes take no other writes.
    expect((await owner.patch(`/api/owner/${link.token}`, { plate: 'X' })).status).toBe(401)
    expect((await owner.del(`/api/owner/${link.token}/decision`)).status).toBe(401)
    expect((await owner.post(`/api/owner/${link.token}/quote`, { date: '2099-01-01' })).status).toBe(401)
    expect(await vehicleRow(app.db, f.a.id)).toEqual(before)
  })

  it('the cost on a date next week is at least the bill today, from the same engine; a past date is refused', async () => {
    const f = await fixture()
    const link = await createLink(f.office, f.a.id)
    const page = (await request(app.app).get(`/api/owner/${link.token}`).expect(200)).body
    const today: string = page.yard.today
    const nextWeek = new Date(Date.parse(`${today}T12:00:00Z`) + 7 * DAY).toISOString().slice(0, 10)
    const quote = await request(app.app).get(`/api/owner/${link.token}/quote?date=${nextWeek}`).expect(200)
    expect(quote.body.date).toBe(nextWeek)
    // California sample (Civil Code 3068.1(a)(1)): each calendar day or part of one; 7 more days cost 7 more days' storage.
    expect(quote.body.daysOnLot).toBe(page.bill.daysOnLot + 7)
    expect(quote.body.balanceCents).toBeGreaterThan(page.bill.balanceCents)
    const past = new Date(Date.parse(`${today}T12:00:00Z`) - DAY).toISOString().slice(0, 10)
    const refused = await request(app.app).get(`/api/owner/${link.token}/quote?date=${past}`)
    expect(refused.status).toBe(400)
    expect(refused.body.issues[0].path).toBe('date')
  })
})

describe("the owner's choice", () => {
  it.each(['', '   ', '\t\n'])('a blank name (%j) is refused naming the field; nothing is written', async (fullName) => {
    const f = await fixture()
    const link = await createLink(f.office, f.a.id)
    const before = await vehicleRow(app.db, f.a.id)
    const history = await historyCount(app.db, f.a.id)
    const owner = await anonymous()
    const res = await owner.post(`/api/owner/${link.token}/decision`, { choice: 'sign_over', signOverTo: 'yard', fullName })
    expect(res.status).toBe(400)
    expect(res.body.issues.map((i: { path: string }) => i.path)).toEqual(['fullName'])
    expect(await vehicleRow(app.db, f.a.id)).toEqual(before)
    expect(await historyCount(app.db, f.a.id)).toBe(history)
    expect(await app.db.$count(t.ownerDecisions)).toBe(await app.db.$count(t.ownerDecisions, sql`${t.ownerDecisions.vehicleId} <> ${f.a.id}`))
  })

  it('records the time, the address and the typed name, is a history event and shows on the board card and to the office', async () => {
    const f = await fixture()
    const link = await createLink(f.office, f.a.id)
    const owner = await anonymous()
    const res = await owner.post(`/api/owner/${link.token}/decision`, { choice: 'sign_over', signOverTo: 'salvage_buyer', fullName: '  Marisol Vantongeren ' })
    expect(res.status).toBe(201)
    expect(res.body.decision).toMatchObject({ choice: 'sign_over', signOverTo: 'salvage_buyer', fullName: 'Marisol Vantongeren' })

    const [row] = await app.db.select().from(t.ownerDecisions).where(eq(t.ownerDecisions.vehicleId, f.a.id))
    expect(row).toMatchObject({ choice: 'sign_over', fullName: 'Marisol Vantongeren', linkId: link.link.id })
    expect(row!.ip).toMatch(/127\.0\.0\.1|::1/)
    expect(Date.now() - row!.at.getTime()).toBeLessThan(60_000)

    const last = (await historyOf(app.db, f.a.id)).at(-1)!
    expect(last).toMatchObject({ kind: 'owner_decided', actorId: null, actorLabel: 'Marisol Vantongeren (owner, by link)' })
    expect(last.after).toMatchObject({ choice: 'sign_over', fullName: 'Marisol Vantongeren', ip: row!.ip })

    const board = (await f.office.get('/api/board').expect(200)).body
    const card = board.columns.flatMap((c: { cards: { id: string }[] }) => c.cards).find((c: { id: string }) => c.id === f.a.id)
    expect(card.ownerChoice).toEqual({ choice: 'sign_over', at: row!.at.toISOString() })
    const office = (await f.office.get(`/api/vehicles/${f.a.id}/owner-links`).expect(200)).body
    expect(office.decisions[0]).toMatchObject({ choice: 'sign_over', fullName: 'Marisol Vantongeren', ip: row!.ip })
  })

  it('"sign it over" needs whom to; "call me" needs a number', async () => {
    const f = await fixture()
    const link = await createLink(f.office, f.a.id)
    const owner = await anonymous()
    const signOver = await owner.post(`/api/owner/${link.token}/decision`, { choice: 'sign_over', fullName: 'Marisol Vantongeren' })
    expect(signOver.body.issues.map((i: { path: string }) => i.path)).toEqual(['signOverTo'])
    const call = await owner.post(`/api/owner/${link.token}/decision`, { choice: 'call', fullName: 'Marisol Vantongeren' })
    expect(call.body.issues.map((i: { path: string }) => i.path)).toEqual(['phone'])
    expect(await app.db.$count(t.ownerDecisions, eq(t.ownerDecisions.vehicleId, f.a.id))).toBe(0)
  })
})

describe('rate limits (per address, in the database)', () => {
  let limited: TestApp
  beforeAll(async () => {
    limited = await makeTestApp({ publicLimits: { perAddress: 3, windowMs: 60_000 } })
  })
  afterAll(() => limited.close())

  it('after 3 wrong codes from an address, even the right code waits (429 with Retry-After)', async () => {
    const staff = await makeStaff(limited.db)
    const v = await makeVehicle(limited.db, staff.yard.id, { state: 'storage' })
    const office = await signedIn(limited.app, staff.office)
    const link = (await office.post(`/api/vehicles/${v.id}/owner-links`).expect(201)).body
    for (const guess of ['ABCDE23456', 'ABCDE23457', 'ABCDE23458']) expect((await request(limited.app).get(`/api/owner/${guess}`)).status).toBe(404)
    const refused = await request(limited.app).get(`/api/owner/${link.code}`)
    expect(refused.status).toBe(429)
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0)
    expect(refused.body.vehicle).toBeUndefined()
    // The counter is a row in the shared table, not memory: what every app server sees.
    expect(await limited.db.$count(t.signInFailures, sql`${t.signInFailures.key} like 'owner-key:%'`)).toBe(1)
  })

  it('"is my vehicle here?" answers only found, where and what is owed, and is rate-limited', async () => {
    const staff = await makeStaff(limited.db)
    const ruleSetVersionId = await sampleVersion(limited.db, 'california-sample')
    await limited.db.update(t.yards).set({ hours: 'Mon–Fri 8–5' }).where(eq(t.yards.id, staff.yard.id))
    const plate = `L${Math.floor(Math.random() * 1e6)}`
    await makeVehicle(limited.db, staff.yard.id, { state: 'storage', plate, vin: '1M8GDM9AXKP042788', ruleSetVersionId, arrivedAt: new Date(Date.now() - 2 * DAY) })
    const s = await browserSession(limited.app)
    const found = await s.post('/api/vehicle-lookup', { plate: plate.toLowerCase(), vinTail: '042788' })
    expect(found.status).toBe(200)
    expect(Object.keys(found.body).sort()).toEqual(['asOf', 'balanceCents', 'found', 'yard'])
    expect(found.body).toMatchObject({ found: true, yard: { name: staff.yard.name, address: '1 Test Road', hours: 'Mon–Fri 8–5' } })
    expect(Object.keys(found.body.yard).sort()).toEqual(['address', 'hours', 'name', 'phone'])
    expect(found.body.balanceCents).toBeGreaterThan(0)
    expect((await s.post('/api/vehicle-lookup', { plate, vinTail: '2789' })).body).toEqual({ found: false })
    const tooShort = await s.post('/api/vehicle-lookup', { plate, vinTail: '788' })
    expect(tooShort.status).toBe(400)
    expect(tooShort.body.issues[0].path).toBe('vinTail')
    // Three counted tries (the refused one too, as every lookup is); the fourth waits, right answer or not.
    const waited = await s.post('/api/vehicle-lookup', { plate, vinTail: '042788' })
    expect(waited.status).toBe(429)
    expect(waited.body.found).toBeUndefined()
  })
})
