import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { historyOf } from '@db/history'
import * as t from '@db/schema'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { makeStaff, makeVehicle } from '../helpers/factories'
import { DAY, historyCount, sampleVersion } from '../helpers/board'

// Who to tell (issue 10): the office keeps each vehicle's owners, lienholders, insurer and others,
// every change a history event; a records request's sending day meets the rule set's deadline.
let app: TestApp
beforeAll(async () => {
  app = await makeTestApp()
})
afterAll(() => app.close())

const owner = {
  role: 'registered_owner',
  name: 'Marisol Quintero',
  street: '418 Alder Row',
  city: 'Orrin Flats',
  state: 'ca',
  zip: '93274',
  phone: '(559) 555-0142',
  email: 'marisol@example.test',
  language: 'es',
  source: 'records_request',
  sourceDate: '2026-11-20',
}

async function fixture() {
  const staff = await makeStaff(app.db)
  const ruleSetVersionId = await sampleVersion(app.db, 'california-sample')
  const vehicle = await makeVehicle(app.db, staff.yard.id, { state: 'storage', ruleSetVersionId, arrivedAt: new Date(Date.now() - 3 * DAY) })
  return { staff, vehicle, office: await signedIn(app.app, staff.office) }
}

const contactRows = (vehicleId: string) => app.db.select().from(t.vehicleContacts).where(eq(t.vehicleContacts.vehicleId, vehicleId))

describe('contacts', () => {
  it('adds, changes and removes a contact, each a history event, and everyone on the board reads them', async () => {
    const { staff, vehicle, office } = await fixture()
    const added = await office.post(`/api/vehicles/${vehicle.id}/contacts`, owner)
    expect(added.status, JSON.stringify(added.body)).toBe(201)
    expect(added.body.contacts).toHaveLength(1)
    const c = added.body.contacts[0]
    expect(c).toMatchObject({ name: 'Marisol Quintero', state: 'CA', language: 'es', source: 'records_request', sourceDate: '2026-11-20' })

    const changed = await office.put(`/api/vehicles/${vehicle.id}/contacts/${c.id}`, { ...owner, email: 'mq@example.test' })
    expect(changed.status, JSON.stringify(changed.body)).toBe(200)
    expect(changed.body.contacts[0].email).toBe('mq@example.test')

    const technician = await signedIn(app.app, staff.technician)
    const read = await technician.get(`/api/vehicles/${vehicle.id}/contacts`)
    expect(read.status).toBe(200)
    expect(read.body.contacts[0].email).toBe('mq@example.test')

    const removed = await office.del(`/api/vehicles/${vehicle.id}/contacts/${c.id}`)
    expect(removed.status).toBe(200)
    expect(removed.body.contacts).toEqual([])
    // Kept for the notices that name them, marked removed.
    expect((await contactRows(vehicle.id))[0]!.removedAt).not.toBeNull()

    const kinds = (await historyOf(app.db, vehicle.id)).map((e) => e.kind)
    expect(kinds).toEqual(['contact_added', 'contact_changed', 'contact_removed'])
    const events = await historyOf(app.db, vehicle.id)
    expect(events[1]!.before).toMatchObject({ email: 'marisol@example.test' })
    expect(events[1]!.after).toMatchObject({ email: 'mq@example.test' })
  })

  it('refuses bad input naming each field, and writes nothing', async () => {
    const { vehicle, office } = await fixture()
    const cases: [object, string][] = [
      [{ ...owner, name: '  ' }, 'name'],
      [{ ...owner, role: 'cousin' }, 'role'],
      [{ ...owner, email: 'not-an-address' }, 'email'],
      [{ ...owner, zip: '9327' }, 'zip'],
      [{ ...owner, state: 'California' }, 'state'],
      [{ ...owner, city: '' }, 'city'],
      [{ ...owner, sourceDate: null }, 'sourceDate'],
      [{ ...owner, language: 'fr' }, 'language'],
      [{ ...owner, source: 'other', sourceNote: null }, 'sourceNote'],
      [{ ...owner, phone: 'call me' }, 'phone'],
    ]
    for (const [body, field] of cases) {
      const res = await office.post(`/api/vehicles/${vehicle.id}/contacts`, body)
      expect(res.status, field).toBe(400)
      expect(res.body.issues.map((i: { path: string }) => i.path), field).toContain(field)
    }
    // A records request dated after today is refused by the server, on the yard's calendar.
    const future = await office.post(`/api/vehicles/${vehicle.id}/contacts`, { ...owner, sourceDate: '2999-01-01' })
    expect(future.status).toBe(400)
    expect(future.body.issues[0].path).toBe('sourceDate')
    expect(await contactRows(vehicle.id)).toEqual([])
    expect(await historyCount(app.db, vehicle.id)).toBe(0)
  })

  it('lets only the office and managers change contacts', async () => {
    const { staff, vehicle } = await fixture()
    for (const role of ['dispatcher', 'technician'] as const) {
      const s = await signedIn(app.app, staff[role])
      expect((await s.post(`/api/vehicles/${vehicle.id}/contacts`, owner)).status, role).toBe(403)
      expect((await s.post(`/api/vehicles/${vehicle.id}/records-requests`, { sentOn: '2026-11-20' })).status, role).toBe(403)
    }
    const manager = await signedIn(app.app, staff.manager)
    expect((await manager.post(`/api/vehicles/${vehicle.id}/contacts`, owner)).status).toBe(201)
    // Another company's office finds no such vehicle.
    const other = await makeStaff(app.db)
    const stranger = await signedIn(app.app, other.office)
    expect((await stranger.get(`/api/vehicles/${vehicle.id}/contacts`)).status).toBe(404)
    expect((await stranger.post(`/api/vehicles/${vehicle.id}/contacts`, owner)).status).toBe(404)
  })
})

describe('records request', () => {
  it('meets the rule set deadline to request the records, on the vehicle page and the card', async () => {
    const { staff, vehicle, office } = await fixture()
    // Cal. Civ. Code § 3072 (the California sample): request the records within 15 days of the lien arising.
    const before = await office.get(`/api/vehicles/${vehicle.id}/contacts`)
    expect(before.body.recordsDeadline).toMatchObject({ status: 'upcoming' })
    const page = await office.get(`/api/vehicles/${vehicle.id}`)
    expect(page.body.summary.nextDeadline.code).toBe('records-request')

    const today = new Date().toLocaleDateString('en-CA', { timeZone: staff.yard.timeZone })
    const sent = await office.post(`/api/vehicles/${vehicle.id}/records-requests`, { agency: 'DMV', sentOn: today })
    expect(sent.status, JSON.stringify(sent.body)).toBe(201)
    expect(sent.body.recordsDeadline).toMatchObject({ status: 'met' })
    expect(sent.body.recordsRequests).toMatchObject([{ agency: 'DMV', sentOn: today, answeredOn: null, outcome: null }])

    const after = await office.get(`/api/vehicles/${vehicle.id}`)
    expect(after.body.summary.nextDeadline?.code).not.toBe('records-request')
    const board = await office.get('/api/board')
    const card = board.body.columns.flatMap((c: { cards: { id: string }[] }) => c.cards).find((c: { id: string }) => c.id === vehicle.id)
    expect(card.summary.nextDeadline?.code ?? null).not.toBe('records-request')

    const answered = await office.put(`/api/vehicles/${vehicle.id}/records-requests/${sent.body.recordsRequests[0].id}/answer`, { answeredOn: today, outcome: 'no_record' })
    expect(answered.status, JSON.stringify(answered.body)).toBe(200)
    expect(answered.body.recordsRequests[0]).toMatchObject({ answeredOn: today, outcome: 'no_record' })
    expect((await historyOf(app.db, vehicle.id)).map((e) => e.kind)).toEqual(['records_requested', 'records_answered'])
  })

  it('shows the deadline missed when the request went out late', async () => {
    const { staff, office } = await fixture()
    const ruleSetVersionId = await sampleVersion(app.db, 'california-sample')
    const old = await makeVehicle(app.db, staff.yard.id, { state: 'storage', ruleSetVersionId, arrivedAt: new Date(Date.now() - 40 * DAY) })
    const today = new Date().toLocaleDateString('en-CA', { timeZone: staff.yard.timeZone })
    const sent = await office.post(`/api/vehicles/${old.id}/records-requests`, { sentOn: today })
    expect(sent.body.recordsDeadline).toMatchObject({ status: 'missed' })
  })

  it('refuses a future day, an answer before the request, and half an answer — nothing written', async () => {
    const { vehicle, office } = await fixture()
    const cases: [object, string][] = [
      [{ sentOn: '2999-01-01' }, 'sentOn'],
      [{ sentOn: '' }, 'sentOn'],
      [{ sentOn: '2026-11-20', answeredOn: '2026-11-19', outcome: 'found' }, 'answeredOn'],
      [{ sentOn: '2026-11-20', answeredOn: '2026-11-21' }, 'outcome'],
      [{ sentOn: '2026-11-20', outcome: 'found' }, 'answeredOn'],
    ]
    for (const [body, field] of cases) {
      const res = await office.post(`/api/vehicles/${vehicle.id}/records-requests`, body)
      expect(res.status, field).toBe(400)
      expect(res.body.issues.map((i: { path: string }) => i.path), field).toContain(field)
    }
    expect(await app.db.select().from(t.recordsRequests).where(eq(t.recordsRequests.vehicleId, vehicle.id))).toEqual([])
    expect(await app.db.select().from(t.clockEvents).where(eq(t.clockEvents.vehicleId, vehicle.id))).toEqual([])
    expect(await historyCount(app.db, vehicle.id)).toBe(0)
  })
})
