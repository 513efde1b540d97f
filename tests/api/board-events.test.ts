import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as tables from '@db/schema'
import { makeTestApp, type TestApp } from '../helpers/app'
import { DAY, sampleVersion, setHold } from '../helpers/board'
import { fetchSession, listening, openStream } from '../helpers/live'
import { makeStaff, makeVehicle } from '../helpers/factories'
import { DEMO_RATES, photo, towInBody } from '../helpers/tow-in'

let t: TestApp
let server: Awaited<ReturnType<typeof listening>>
beforeAll(async () => {
  t = await makeTestApp()
  server = await listening(t.app)
})
afterAll(async () => {
  await server.close()
  await t.close()
})

type Card = { id: string; state: string; version: number }
const cardEvent = (id: string, state: string) => (b: Record<string, unknown>) => b.type === 'card' && (b.card as Card).id === id && (b.card as Card).state === state

describe('GET /api/board/events', () => {
  it('events_aMoveByOnePerson_reachesASecondBoard', async () => {
    const staff = await makeStaff(t.db)
    const v = await makeVehicle(t.db, staff.yard.id)
    const [mover, watcher] = await Promise.all([fetchSession(server.url, staff.dispatcher), fetchSession(server.url, staff.office)])
    const stream = await openStream(server.url, watcher.cookie)
    expect(stream.status).toBe(200)
    expect(stream.contentType).toMatch(/^text\/event-stream/)
    expect((await stream.first())?.retry).toBeGreaterThan(0)
    expect((await mover.post(`/api/vehicles/${v.id}/moves`, { to: 'teardown', version: 1 })).status).toBe(200)
    const got = await stream.next(cardEvent(v.id, 'teardown'))
    expect(got.body.card).toMatchObject({ id: v.id, state: 'teardown', version: 2, stockNumber: v.stockNumber })
    expect(got.id).toMatch(/^\w+\.\d+$/)
    stream.close()
  })

  it('events_anotherCompanysMove_isNotSent', async () => {
    const ours = await makeStaff(t.db)
    const theirs = await makeStaff(t.db)
    const mine = await makeVehicle(t.db, ours.yard.id)
    const other = await makeVehicle(t.db, theirs.yard.id)
    const watcher = await fetchSession(server.url, ours.manager)
    const stream = await openStream(server.url, watcher.cookie)
    const them = await fetchSession(server.url, theirs.manager)
    const us = await fetchSession(server.url, ours.manager)
    // Both boards have been shown once, so both yards are live on this server.
    await them.get('/api/board')
    expect((await them.post(`/api/vehicles/${other.id}/moves`, { to: 'teardown', version: 1 })).status).toBe(200)
    expect((await us.post(`/api/vehicles/${mine.id}/moves`, { to: 'teardown', version: 1 })).status).toBe(200)
    // The first card event this board hears is its own yard's: the other yard's move came first and was not sent.
    const first = await stream.next((b) => b.type === 'card')
    expect((first.body.card as Card).id).toBe(mine.id)
    stream.close()
  })

  it('events_reconnectWithLastEventId_replaysWhatWasMissed', async () => {
    const staff = await makeStaff(t.db)
    const [a, b] = [await makeVehicle(t.db, staff.yard.id), await makeVehicle(t.db, staff.yard.id)]
    const s = await fetchSession(server.url, staff.manager)
    const board = (await (await s.get('/api/board')).json()) as { eventId: string }
    const firstStream = await openStream(server.url, s.cookie, { since: board.eventId })
    await s.post(`/api/vehicles/${a.id}/moves`, { to: 'teardown', version: 1 })
    const seen = await firstStream.next(cardEvent(a.id, 'teardown'))
    firstStream.close()
    // Gone for a moment: two changes happen meanwhile.
    await s.post(`/api/vehicles/${b.id}/moves`, { to: 'teardown', version: 1 })
    await s.post(`/api/vehicles/${a.id}/moves`, { to: 'arrival', version: 2, reason: 'logged into Teardown by mistake' })
    const again = await openStream(server.url, s.cookie, { lastEventId: seen.id })
    expect((await again.next((x) => x.type !== undefined)).body).toMatchObject({ type: 'card', card: { id: b.id, state: 'teardown' } })
    expect((await again.next((x) => x.type !== undefined)).body).toMatchObject({ type: 'card', card: { id: a.id, state: 'arrival' } })
    again.close()
  })

  it('events_lastEventIdFromAnotherServer_asksTheBoardToStartOver', async () => {
    const staff = await makeStaff(t.db)
    const s = await fetchSession(server.url, staff.manager)
    const stream = await openStream(server.url, s.cookie, { lastEventId: 'elsewhere.41' })
    expect((await stream.next()).body).toEqual({ type: 'resync' })
    stream.close()
  })

  it('events_closedVehicle_isSentAsRemoved', async () => {
    const staff = await makeStaff(t.db)
    const ruleSetVersionId = await sampleVersion(t.db, 'florida-sample')
    const v = await makeVehicle(t.db, staff.yard.id, { state: 'storage', ruleSetVersionId, year: 2009, arrivedAt: new Date(Date.now() - 60 * DAY) })
    const s = await fetchSession(server.url, staff.manager)
    const stream = await openStream(server.url, s.cookie)
    // Scrapped: the same lien-sale gate, and no bill of sale to record first.
    expect((await s.post(`/api/vehicles/${v.id}/moves`, { to: 'closed', version: 1, disposition: 'scrapped' })).status).toBe(200)
    expect((await stream.next((b) => b.type !== undefined)).body).toEqual({ type: 'removed', id: v.id })
    stream.close()
  })

  it('events_refusedMove_sendsNothing', async () => {
    const staff = await makeStaff(t.db)
    const held = await makeVehicle(t.db, staff.yard.id, { state: 'storage' })
    await setHold(t.db, held.id, 'lien')
    const free = await makeVehicle(t.db, staff.yard.id)
    const s = await fetchSession(server.url, staff.manager)
    const stream = await openStream(server.url, s.cookie)
    expect((await s.post(`/api/vehicles/${held.id}/moves`, { to: 'release', version: 1 })).status).toBe(422)
    expect((await s.post(`/api/vehicles/${free.id}/moves`, { to: 'teardown', version: 1 })).status).toBe(200)
    const first = await stream.next((b) => b.type !== undefined)
    expect((first.body.card as Card).id).toBe(free.id)
    stream.close()
  })

  it('events_aTowInLogged_appearsInArrivalOnAnotherBoard', async () => {
    const staff = await makeStaff(t.db)
    const [version] = await t.db.select().from(tables.ruleSetVersions).where(eq(tables.ruleSetVersions.id, await sampleVersion(t.db, 'california-sample')))
    await t.db.update(tables.yards).set({ towRates: DEMO_RATES, ruleSetId: version!.ruleSetId }).where(eq(tables.yards.id, staff.yard.id))
    const [dispatcher, watcher] = await Promise.all([fetchSession(server.url, staff.dispatcher), fetchSession(server.url, staff.office)])
    const stream = await openStream(server.url, watcher.cookie)
    const res = await dispatcher.post('/api/vehicles', towInBody(staff.dispatcher.id))
    expect(res.status).toBe(201)
    const { id } = (await res.json()) as { id: string }
    expect((await stream.next((b) => b.type === 'card')).body.card).toMatchObject({ id, state: 'arrival', make: 'Orlan', model: 'Sparrow' })
    stream.close()
  })

  it('events_aHoldSetAndLifted_updateTheCardOnAnotherBoard', async () => {
    const staff = await makeStaff(t.db)
    const v = await makeVehicle(t.db, staff.yard.id, { state: 'storage' })
    const [dispatcher, watcher] = await Promise.all([fetchSession(server.url, staff.dispatcher), fetchSession(server.url, staff.office)])
    const stream = await openStream(server.url, watcher.cookie)
    const set = await dispatcher.post(`/api/vehicles/${v.id}/holds`, { kind: 'law_enforcement', agency: 'Orrin Flats PD', caseNumber: 'OF-26-12001' })
    expect(set.status).toBe(201)
    const held = await stream.next((b) => b.type === 'card')
    expect(held.body.card).toMatchObject({ id: v.id, holds: [{ kind: 'law_enforcement', agency: 'Orrin Flats PD', caseNumber: 'OF-26-12001' }] })
    const { holds } = (await set.json()) as { holds: { id: string }[] }
    expect((await dispatcher.post(`/api/vehicles/${v.id}/holds/${holds[0]!.id}/lift`, { reason: 'Release letter from OFPD, signed Sgt. Imrie' })).status).toBe(200)
    expect((await stream.next((b) => b.type === 'card')).body.card).toMatchObject({ id: v.id, holds: [] })
    stream.close()
  })

  it('events_signOut_endsTheStreamAtOnceAndSendsNothingMore', async () => {
    const staff = await makeStaff(t.db)
    const v = await makeVehicle(t.db, staff.yard.id)
    const [mover, watcher] = await Promise.all([fetchSession(server.url, staff.dispatcher), fetchSession(server.url, staff.office)])
    const stream = await openStream(server.url, watcher.cookie)
    expect((await stream.first())?.retry).toBeGreaterThan(0)
    expect((await watcher.signOut()).status).toBe(204)
    expect((await mover.post(`/api/vehicles/${v.id}/moves`, { to: 'teardown', version: 1 })).status).toBe(200)
    // The stream ended with the session (heartbeats are 20 s apart here): the move is not delivered.
    expect(await stream.first()).toBeNull()
  })

  it('events_deactivatedOrNewPassword_endsTheStreamsAtOnce', async () => {
    const staff = await makeStaff(t.db)
    const v = await makeVehicle(t.db, staff.yard.id)
    const [manager, office, tech] = await Promise.all([fetchSession(server.url, staff.manager), fetchSession(server.url, staff.office), fetchSession(server.url, staff.technician)])
    const [officeStream, techStream] = await Promise.all([openStream(server.url, office.cookie), openStream(server.url, tech.cookie)])
    await Promise.all([officeStream.first(), techStream.first()])
    expect((await manager.patch(`/api/users/${staff.office.id}`, { active: false })).status).toBe(200)
    expect((await manager.post(`/api/users/${staff.technician.id}/password`, { password: 'a brand new passphrase' })).status).toBe(204)
    expect((await manager.post(`/api/vehicles/${v.id}/moves`, { to: 'teardown', version: 1 })).status).toBe(200)
    expect(await officeStream.first()).toBeNull()
    expect(await techStream.first()).toBeNull()
  })

  it('events_sixthStreamOfOneSession_isRefusedUntilOneCloses', async () => {
    const staff = await makeStaff(t.db)
    const s = await fetchSession(server.url, staff.office)
    const open = await Promise.all(Array.from({ length: 5 }, () => openStream(server.url, s.cookie)))
    expect(open.map((o) => o.status)).toEqual([200, 200, 200, 200, 200])
    const sixth = await fetch(`${server.url}/api/board/events`, { headers: { cookie: s.cookie } })
    expect(sixth.status).toBe(429)
    expect(((await sixth.json()) as { error: string }).error).toMatch(/5 live board connections/)
    // Another person's session has streams of its own.
    const other = await fetchSession(server.url, staff.dispatcher)
    const theirs = await openStream(server.url, other.cookie)
    expect(theirs.status).toBe(200)
    theirs.close()
    open[0]!.close()
    await expect.poll(async () => {
      const again = await openStream(server.url, s.cookie)
      again.close()
      return again.status
    }).toBe(200)
    open.slice(1).forEach((o) => o.close())
  })

  it('events_photosAddedToAVehicle_updateThePhotoCountOnAnotherBoard', async () => {
    const staff = await makeStaff(t.db)
    const v = await makeVehicle(t.db, staff.yard.id)
    const [dispatcher, watcher] = await Promise.all([fetchSession(server.url, staff.dispatcher), fetchSession(server.url, staff.office)])
    const stream = await openStream(server.url, watcher.cookie)
    const form = new FormData()
    form.append('kind', 'photo')
    form.append('files', new Blob([new Uint8Array(await photo())], { type: 'image/jpeg' }), 'front.jpg')
    form.append('files', new Blob([new Uint8Array(await photo(40, 64))], { type: 'image/jpeg' }), 'rear.jpg')
    expect((await dispatcher.postForm(`/api/vehicles/${v.id}/files`, form)).status).toBe(201)
    expect((await stream.next((b) => b.type === 'card')).body.card).toMatchObject({ id: v.id, photoCount: 2, version: 2 })
    stream.close()
  })

  it('events_signedOut_answers401', async () => {
    const res = await fetch(`${server.url}/api/board/events`)
    expect(res.status).toBe(401)
  })
})

describe('GET /api/board/events for an account that is changed while it listens', () => {
  let quick: TestApp
  let quickServer: Awaited<ReturnType<typeof listening>>
  beforeAll(async () => {
    quick = await makeTestApp({ boardStream: { heartbeatMs: 50, lifetimeMs: 60_000 } })
    quickServer = await listening(quick.app)
  })
  afterAll(async () => {
    await quickServer.close()
    await quick.close()
  })

  it('events_listenerDeactivated_streamEndsAtTheNextHeartbeat', async () => {
    const staff = await makeStaff(quick.db)
    const [manager, watcher] = await Promise.all([fetchSession(quickServer.url, staff.manager), fetchSession(quickServer.url, staff.office)])
    const stream = await openStream(quickServer.url, watcher.cookie)
    expect((await stream.first())?.retry).toBeGreaterThan(0)
    expect((await manager.patch(`/api/users/${staff.office.id}`, { active: false })).status).toBe(200)
    // The stream ends (no further message) instead of running on for its five-minute lifetime.
    expect(await stream.first()).toBeNull()
  })

  it('events_listenerStillSignedIn_streamStaysOpenAcrossHeartbeats', async () => {
    const staff = await makeStaff(quick.db)
    const [mover, watcher] = await Promise.all([fetchSession(quickServer.url, staff.dispatcher), fetchSession(quickServer.url, staff.office)])
    const v = await makeVehicle(quick.db, staff.yard.id)
    const stream = await openStream(quickServer.url, watcher.cookie)
    await new Promise((r) => setTimeout(r, 300))
    expect((await mover.post(`/api/vehicles/${v.id}/moves`, { to: 'teardown', version: 1 })).status).toBe(200)
    expect((await stream.next(cardEvent(v.id, 'teardown'))).body.card).toMatchObject({ id: v.id })
    stream.close()
  })
})
