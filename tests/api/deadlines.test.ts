import { createHash } from 'node:crypto'
import { Writable } from 'node:stream'
import { eq } from 'drizzle-orm'
import ICAL from 'ical.js'
import { pino } from 'pino'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import type { DeadlineEntry } from '@shared/schemas/deadlines'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { DAY, sampleVersion } from '../helpers/board'
import { makeStaff, makeVehicle } from '../helpers/factories'

// Every request line the app logs, as a log collector would read it: a feed token must never be in it.
const lines: string[] = []
const captured = new Writable({
  write(chunk, _encoding, done) {
    lines.push(...String(chunk).split('\n').filter(Boolean))
    done()
  },
})

let t_: TestApp
beforeAll(async () => {
  t_ = await makeTestApp({ log: pino({ level: 'info' }, captured) })
})
afterAll(() => t_.close())

const MIN = 60_000

/**
 * A Florida-sample yard: a 2018 car stored 3 days ago (its notice of lien due within 7 business days,
 * Fla. Stat. § 713.78(4) [S]; sale not before day 35 [M]), one stored 40 days ago (notice missed, sale
 * allowed since day 35) and a private-property tow 10 minutes ago (police within 30 minutes, § 715.07 [M]).
 */
async function floridaYard() {
  const staff = await makeStaff(t_.db)
  const ruleSetVersionId = await sampleVersion(t_.db, 'florida-sample')
  const fresh = await makeVehicle(t_.db, staff.yard.id, { state: 'storage', year: 2018, ruleSetVersionId, arrivedAt: new Date(Date.now() - 3 * DAY) })
  const old = await makeVehicle(t_.db, staff.yard.id, { state: 'storage', year: 2018, ruleSetVersionId, arrivedAt: new Date(Date.now() - 40 * DAY) })
  const arrivedAt = new Date(Date.now() - 10 * MIN)
  const towed = await makeVehicle(t_.db, staff.yard.id, { state: 'arrival', year: 2018, ruleSetVersionId, arrivedAt })
  await t_.db.insert(t.tows).values({ vehicleId: towed.id, reason: 'private_property', arrivedAt, requesterName: 'Lot manager' })
  return { staff, fresh, old, towed, arrivedAt }
}

const of = (entries: DeadlineEntry[], vehicleId: string) => entries.filter((e) => e.vehicleId === vehicleId)

describe('lien-sale eligibility on the vehicle page', () => {
  it('eligibility_gateOpenAndNoClaim_showsTheDateAndCitation', async () => {
    const { staff, old } = await floridaYard()
    const s = await signedIn(t_.app, staff.office)
    const summary = (await s.get(`/api/vehicles/${old.id}`).expect(200)).body.summary
    expect(summary.lienSale.open).toBe(true)
    expect(summary.eligible).toEqual({
      since: summary.lienSale.date,
      step: 'Earliest lien sale',
      citation: expect.stringContaining('713.78'),
      // The sample's Spanish beside it (server/rule-sets/samples/florida.json).
      es: { step: 'Primer día para la venta por gravamen', citation: expect.stringContaining('Fla. Stat. § 713.78') },
    })
  })

  it('eligibility_beforeTheDate_isNotEligible', async () => {
    const { staff, fresh } = await floridaYard()
    const s = await signedIn(t_.app, staff.office)
    expect((await s.get(`/api/vehicles/${fresh.id}`).expect(200)).body.summary.eligible).toBeNull()
  })

  it.each(['collect', 'repair'] as const)('eligibility_ownerChose%s_isAClaimAndNotEligible', async (choice) => {
    const { staff, old } = await floridaYard()
    await t_.db.update(t.vehicles).set({ ownerChoice: choice, ownerChoiceAt: new Date() }).where(eq(t.vehicles.id, old.id))
    const s = await signedIn(t_.app, staff.office)
    const summary = (await s.get(`/api/vehicles/${old.id}`).expect(200)).body.summary
    expect(summary.lienSale.open).toBe(true)
    expect(summary.eligible).toBeNull()
  })
})

describe('GET /api/deadlines', () => {
  it('deadlines_floridaYard_listsEveryOpenDeadlineOverdueFirstThenByDay', async () => {
    const { staff, fresh, old, towed, arrivedAt } = await floridaYard()
    const s = await signedIn(t_.app, staff.office)
    const list = (await s.get('/api/deadlines').expect(200)).body
    expect(list.timeZone).toBe('America/Los_Angeles')
    const entries: DeadlineEntry[] = list.entries
    expect(of(entries, old.id).map((e) => [e.kind, e.code, e.status])).toEqual([
      ['notice', 'notice-of-lien', 'overdue'],
      ['lien-sale', 'lien-sale', 'eligible'],
    ])
    expect(of(entries, old.id)[1]).toMatchObject({ day: list.today, since: expect.any(String), citation: expect.stringContaining('713.78') })
    expect(of(entries, fresh.id).map((e) => [e.kind, e.status])).toEqual([
      ['notice', 'due'],
      ['lien-sale', 'due'],
    ])
    expect(of(entries, towed.id)[0]).toMatchObject({ kind: 'police', status: 'due', dueAt: new Date(arrivedAt.getTime() + 30 * MIN).toISOString(), citation: expect.stringContaining('715.07') })
    // Overdue first; after them, day by day.
    const firstDue = entries.findIndex((e) => e.status !== 'overdue')
    expect(entries.slice(0, firstDue).every((e) => e.status === 'overdue')).toBe(true)
    const days = entries.slice(firstDue).map((e) => e.day)
    expect(days).toEqual([...days].sort())
  })

  // Issue 10: a Florida date counted in business days shows the rule it was counted by, beside its citation: a
  // business day is skipped only when every calendar the rule set names closes it, and a mailing due on a closed
  // post-office day is due the day before (the sample's `businessDays` and `mailDeadlines`, each with its source).
  it('nextDeadline_floridaNoticeOfLien_showsTheCountingRulesItFollowed', async () => {
    const { staff, fresh } = await floridaYard()
    const s = await signedIn(t_.app, staff.office)
    const next = (await s.get(`/api/vehicles/${fresh.id}`).expect(200)).body.summary.nextDeadline
    expect(next).toMatchObject({ code: 'notice-of-lien', status: 'upcoming' })
    const rules = new Map((next.rules as { code: string; calendars?: string; citation: string }[]).map((r) => [r.code, r]))
    expect([...rules.keys()].sort()).toEqual(['business-days', 'mailing-day'])
    expect(rules.get('business-days')!.calendars!.split(', ').sort()).toEqual(['US', 'US-FL'])
    expect(rules.get('business-days')!.citation).not.toBe('')
    expect(rules.get('mailing-day')!.citation).not.toBe('')
  })

  it('deadlines_filteredByKind_listsOnlyThatKind', async () => {
    const { staff, towed } = await floridaYard()
    const s = await signedIn(t_.app, staff.manager)
    const entries: DeadlineEntry[] = (await s.get('/api/deadlines?kind=police').expect(200)).body.entries
    expect(entries.map((e) => [e.vehicleId, e.kind])).toEqual([[towed.id, 'police']])
  })

  it('deadlines_unknownKind_isRefusedNamingTheField', async () => {
    const { staff } = await floridaYard()
    const s = await signedIn(t_.app, staff.manager)
    const res = await s.get('/api/deadlines?kind=parking')
    expect(res.status).toBe(400)
    expect(res.body.issues[0].path).toBe('kind')
  })

  it('deadlines_policeNotified_leavesTheList', async () => {
    const { staff, towed } = await floridaYard()
    const d = await signedIn(t_.app, staff.dispatcher)
    await d.post(`/api/vehicles/${towed.id}/police-notice`, { agency: 'Orrin Flats PD', notifiedAt: new Date().toISOString(), reportNumber: 'R-1' }).expect(201)
    const s = await signedIn(t_.app, staff.office)
    expect(of((await s.get('/api/deadlines').expect(200)).body.entries, towed.id).map((e) => e.kind)).not.toContain('police')
  })

  it('deadlines_anotherCompanysYard_isNotListed', async () => {
    const { old } = await floridaYard()
    const other = await makeStaff(t_.db)
    const s = await signedIn(t_.app, other.office)
    expect(of((await s.get('/api/deadlines').expect(200)).body.entries, old.id)).toEqual([])
  })

  it.each(['dispatcher', 'technician'] as const)('deadlines_%s_isForbidden', async (role) => {
    const { staff } = await floridaYard()
    const s = await signedIn(t_.app, staff[role])
    expect((await s.get('/api/deadlines')).status).toBe(403)
    expect((await s.get('/api/deadlines.ics')).status).toBe(403)
    expect((await s.post('/api/deadlines/feed', {})).status).toBe(403)
  })

  it('deadlines_signedOut_is401', async () => {
    expect((await request(t_.app).get('/api/deadlines')).status).toBe(401)
    expect((await request(t_.app).get('/api/deadlines.ics')).status).toBe(401)
  })
})

/** The calendar read back by ical.js, a general-purpose iCalendar (RFC 5545) parser, as the oracle. */
function parseCalendar(text: string) {
  const calendar = new ICAL.Component(ICAL.parse(text))
  return { calendar, events: calendar.getAllSubcomponents('vevent').map((v) => new ICAL.Event(v)) }
}

describe('GET /api/deadlines.ics', () => {
  it('deadlinesIcs_parsedByIcalJs_holdsEveryDeadlineOnItsDayAndThePoliceClockAtItsMinute', async () => {
    const { staff, fresh, towed, arrivedAt } = await floridaYard()
    const s = await signedIn(t_.app, staff.office)
    const list = (await s.get('/api/deadlines').expect(200)).body
    const res = await s.get('/api/deadlines.ics').expect(200)
    expect(res.headers['content-type']).toMatch(/^text\/calendar/)
    expect(res.headers['cache-control']).toBe('private, no-store')
    const { calendar, events } = parseCalendar(res.text)
    expect(calendar.getFirstPropertyValue('version')).toBe('2.0')
    expect(events).toHaveLength(list.entries.length)
    const police = events.find((e) => e.uid === `${towed.id}.police-notice@holdfast`)!
    expect(police.startDate.isDate).toBe(false)
    // iCalendar times are whole seconds (RFC 5545 § 3.3.5).
    expect(police.startDate.toJSDate().getTime()).toBe(Math.floor((arrivedAt.getTime() + 30 * MIN) / 1000) * 1000)
    const notice = events.find((e) => e.uid === `${fresh.id}.notice-of-lien@holdfast`)!
    const entry = of(list.entries, fresh.id).find((e) => e.code === 'notice-of-lien')!
    expect(notice.startDate.isDate).toBe(true)
    expect(notice.startDate.toString()).toBe(entry.day)
    expect(notice.summary).toBe(`${fresh.stockNumber} · Send the notice of lien by certified mail`)
    expect(notice.description).toContain('713.78')
  })
})

describe('the calendar feed', () => {
  const feedPath = (url: string) => new URL(url).pathname

  it('calendarFeed_made_answersTheUrlOnceAndStoresOnlyTheTokensHash', async () => {
    const { staff } = await floridaYard()
    const s = await signedIn(t_.app, staff.office)
    expect((await s.get('/api/deadlines/feed').expect(200)).body).toEqual({ active: false, createdAt: null, expiresAt: null })
    const made = (await s.post('/api/deadlines/feed', {}).expect(201)).body
    const token = /\/api\/calendar\/([^/]+)\/deadlines\.ics$/.exec(made.url)![1]!
    // 32 random bytes: 43 base64url characters, 256 bits.
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/)
    const [row] = await t_.db.select().from(t.calendarFeeds).where(eq(t.calendarFeeds.userId, staff.office.id))
    expect(row!.tokenHash).toBe(createHash('sha256').update(`holdfast:calendar-feed:${token}`).digest('hex'))
    expect(JSON.stringify(row)).not.toContain(token)
    const again = (await s.get('/api/deadlines/feed').expect(200)).body
    expect(again).toMatchObject({ active: true })
    expect(again.url).toBeUndefined()
  })

  it('calendarFeed_signedOutWithTheUrl_getsThatPersonsCalendarAndNothingElse', async () => {
    const { staff, old } = await floridaYard()
    const s = await signedIn(t_.app, staff.office)
    const { url } = (await s.post('/api/deadlines/feed', {}).expect(201)).body
    const res = await request(t_.app).get(feedPath(url)).expect(200)
    expect(parseCalendar(res.text).events.map((e) => e.uid)).toContain(`${old.id}.notice-of-lien@holdfast`)
    // The token opens the feed, not the staff API.
    const token = feedPath(url).split('/')[3]!
    expect((await request(t_.app).get('/api/deadlines').set('authorization', `Bearer ${token}`)).status).toBe(401)
    expect((await request(t_.app).get(`/api/calendar/${token}/deadlines`)).status).not.toBe(200)
  })

  it('calendarFeed_anotherPersonsFeed_showsOnlyTheirOwnYard', async () => {
    const mine = await floridaYard()
    const theirs = await floridaYard()
    const s = await signedIn(t_.app, theirs.staff.office)
    const { url } = (await s.post('/api/deadlines/feed', {}).expect(201)).body
    const uids = parseCalendar((await request(t_.app).get(feedPath(url)).expect(200)).text).events.map((e) => e.uid)
    expect(uids.some((u) => u.startsWith(mine.old.id))).toBe(false)
    expect(uids.some((u) => u.startsWith(theirs.old.id))).toBe(true)
  })

  it('calendarFeed_renewed_theOldUrlStopsWorking', async () => {
    const { staff } = await floridaYard()
    const s = await signedIn(t_.app, staff.office)
    const first = (await s.post('/api/deadlines/feed', {}).expect(201)).body.url
    const second = (await s.post('/api/deadlines/feed', {}).expect(201)).body.url
    expect(second).not.toBe(first)
    expect((await request(t_.app).get(feedPath(first))).status).toBe(404)
    expect((await request(t_.app).get(feedPath(second))).status).toBe(200)
  })

  it('calendarFeed_withdrawn_answers404', async () => {
    const { staff } = await floridaYard()
    const s = await signedIn(t_.app, staff.office)
    const { url } = (await s.post('/api/deadlines/feed', {}).expect(201)).body
    await s.del('/api/deadlines/feed').expect(204)
    expect((await request(t_.app).get(feedPath(url))).status).toBe(404)
    expect((await s.get('/api/deadlines/feed').expect(200)).body.active).toBe(false)
  })

  it.each([
    { what: 'deactivated', change: { active: false } },
    { what: 'now a dispatcher', change: { role: 'dispatcher' as const } },
  ])('calendarFeed_personNoLongerAllowed_answers404 ($what)', async ({ change }) => {
    const { staff } = await floridaYard()
    const s = await signedIn(t_.app, staff.office)
    const { url } = (await s.post('/api/deadlines/feed', {}).expect(201)).body
    await t_.db.update(t.users).set(change).where(eq(t.users.id, staff.office.id))
    expect((await request(t_.app).get(feedPath(url))).status).toBe(404)
  })

  it('calendarFeed_expired_answers404', async () => {
    const { staff } = await floridaYard()
    const s = await signedIn(t_.app, staff.office)
    const { url } = (await s.post('/api/deadlines/feed', {}).expect(201)).body
    await t_.db.update(t.calendarFeeds).set({ createdAt: new Date(Date.now() - 2 * DAY), expiresAt: new Date(Date.now() - DAY) }).where(eq(t.calendarFeeds.userId, staff.office.id))
    expect((await request(t_.app).get(feedPath(url))).status).toBe(404)
  })

  it.each(['made-up-token', 'A'.repeat(43)])('calendarFeed_wrongToken_%s_answers404', async (token) => {
    expect((await request(t_.app).get(`/api/calendar/${token}/deadlines.ics`)).status).toBe(404)
  })

  // OWASP ASVS 5.0 V16: the log shows that a feed was read, never the token that opens it.
  it('calendarFeed_readAndMade_neverPutsTheTokenInTheLog', async () => {
    const { staff } = await floridaYard()
    const s = await signedIn(t_.app, staff.office)
    const { url } = (await s.post('/api/deadlines/feed', {}).expect(201)).body
    const token = feedPath(url).split('/')[3]!
    lines.length = 0
    await request(t_.app).get(feedPath(url)).expect(200)
    await request(t_.app).get(`${feedPath(url)}?token=${token}`).expect(200)
    const text = lines.join('\n')
    expect(lines.length).toBeGreaterThan(0)
    expect(text).not.toContain(token)
    expect(text).toContain('/api/calendar/[Redacted]/deadlines.ics')
  })
})
