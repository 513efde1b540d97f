import { and, eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { historyOf } from '@db/history'
import { isoDate, localDay } from '@shared/domain/time'
import { makeTestApp, signedIn, type BrowserSession, type TestApp } from '../helpers/app'
import { DAY, sampleVersion, vehicleRow } from '../helpers/board'
import { makeStaff, makeVehicle } from '../helpers/factories'
import { signaturePng } from '../helpers/release'

// The lien-sale steps only the office can witness (issue 10): recorded through the route, read back by
// the clocks. Every date below is counted from California's sample (server/rule-sets/samples/california.json),
// whose steps cite Cal. Civ. Code §§ 3071 and 3072; the section is named beside each number.
let t_: TestApp
beforeAll(async () => {
  t_ = await makeTestApp()
})
afterAll(() => t_.close())

const ZONE = 'America/Los_Angeles' // the factories' yard
/** The yard's calendar day `offset` days from today. */
const day = (offset = 0) => isoDate(localDay(ZONE, Date.now()) + offset)
const base = (id: string) => `/api/vehicles/${id}/clock-events`

async function californian(valueCents: number, arrivedDaysAgo = 60) {
  const staff = await makeStaff(t_.db)
  const ruleSetVersionId = await sampleVersion(t_.db, 'california-sample')
  const v = await makeVehicle(t_.db, staff.yard.id, {
    state: 'storage',
    ruleSetVersionId,
    estimatedValueCents: valueCents,
    estimatedValueSource: 'test',
    arrivedAt: new Date(Date.now() - arrivedDaysAgo * DAY),
    year: 2016,
    odometer: 88_000,
    vin: '1G4AH59H45G118341',
  })
  const office = await signedIn(t_.app, staff.office)
  return { staff, v, office }
}

type Step = { event: string; recordedDay: string | null; deadlines: { code: string; role: string; status: string; dueDate: string | null }[] }
const stepOf = (page: { steps: Step[] }, event: string) => page.steps.find((s) => s.event === event)!
const deadline = (page: { steps: Step[] }, event: string, code: string) => stepOf(page, event).deadlines.find((d) => d.code === code)!
const eventsOf = (vehicleId: string, kind: 'lien-sale-application-filed' | 'state-notice-mailed' | 'sale-notice-posted') =>
  t_.db.select().from(t.clockEvents).where(and(eq(t.clockEvents.vehicleId, vehicleId), eq(t.clockEvents.kind, kind)))

describe('recording the steps only the office can witness', () => {
  it('records the application and the state notice (over $4,000) and the posting ($500–$4,000), each with its history event', async () => {
    const { v, office } = await californian(650_000)
    const listed = await office.get(base(v.id))
    expect(listed.status).toBe(200)
    // Over $4,000 the sample uses the application (§ 3071, 30 days from the lien) and the DMV's notice (§ 3071(b)–(c)), not the posting (§ 3072).
    expect(listed.body.steps.map((s: Step) => s.event)).toEqual(['lien-sale-application-filed', 'state-notice-mailed'])
    expect(deadline(listed.body, 'lien-sale-application-filed', 'lien-sale-application')).toMatchObject({ role: 'meets', status: 'missed', dueDate: day(-30) })
    expect(deadline(listed.body, 'state-notice-mailed', 'opposition-period')).toMatchObject({ role: 'starts', status: 'not-started', dueDate: null })

    const filed = await office.post(base(v.id), { event: 'lien-sale-application-filed', day: day(-40), note: 'DMV REG 656 sent' })
    expect(filed.status, JSON.stringify(filed.body)).toBe(201)
    // Filed 20 days after the lien arose: within § 3071's 30 days.
    expect(deadline(filed.body, 'lien-sale-application-filed', 'lien-sale-application')).toMatchObject({ status: 'met', dueDate: day(-30) })
    expect(stepOf(filed.body, 'lien-sale-application-filed').recordedDay).toBe(day(-40))

    const mailed = await office.post(base(v.id), { event: 'state-notice-mailed', day: day(-3) })
    expect(mailed.status).toBe(201)
    // § 3071(b)–(c): the owners have 10 days from the DMV's mailing.
    expect(deadline(mailed.body, 'state-notice-mailed', 'opposition-period')).toMatchObject({ status: 'upcoming', dueDate: day(7) })
    // The instant is the start of that day in the yard's zone.
    const [row] = await eventsOf(v.id, 'state-notice-mailed')
    expect(isoDate(localDay(ZONE, row!.at.getTime()))).toBe(day(-3))
    expect(localDay(ZONE, row!.at.getTime() - 1)).toBe(localDay(ZONE, row!.at.getTime()) - 1)
    expect(row).toMatchObject({ source: 'office-step' })

    const history = (await historyOf(t_.db, v.id)).filter((e) => e.kind === 'clock_step_recorded')
    expect(history.map((e) => [e.before, e.after])).toEqual([
      [null, { event: 'lien-sale-application-filed', day: day(-40), note: 'DMV REG 656 sent', replaced: false }],
      [null, { event: 'state-notice-mailed', day: day(-3), note: null, replaced: false }],
    ])

    const mid = await californian(250_000)
    expect((await mid.office.get(base(mid.v.id))).body.steps.map((s: Step) => s.event)).toEqual(['sale-notice-posted'])
    const posted = await mid.office.post(base(mid.v.id), { event: 'sale-notice-posted', day: day(), note: 'Posted on the office window' })
    expect(posted.status).toBe(201)
    // § 3072: posted at least 10 days before the sale, so the sale is not before the 10th day after.
    expect(deadline(posted.body, 'sale-notice-posted', 'sale-after-posting')).toMatchObject({ role: 'starts', dueDate: day(10) })
    expect((await historyOf(t_.db, mid.v.id)).at(-1)).toMatchObject({ kind: 'clock_step_recorded', after: { event: 'sale-notice-posted', day: day() } })
  })

  it('a second recording of the same step replaces the first, and the history says which day it replaced', async () => {
    const { v, office } = await californian(650_000)
    expect((await office.post(base(v.id), { event: 'state-notice-mailed', day: day(-5) })).status).toBe(201)
    const again = await office.post(base(v.id), { event: 'state-notice-mailed', day: day(-4), note: 'Date on the DMV letter' })
    expect(again.status).toBe(201)
    expect(stepOf(again.body, 'state-notice-mailed').recordedDay).toBe(day(-4))
    expect(await eventsOf(v.id, 'state-notice-mailed')).toHaveLength(1)
    expect((await historyOf(t_.db, v.id)).at(-1)).toMatchObject({
      kind: 'clock_step_recorded',
      before: { event: 'state-notice-mailed', day: day(-5) },
      after: { event: 'state-notice-mailed', day: day(-4), replaced: true },
    })
  })

  it('refuses naming the field — a future day, a day before arrival, a step the rule set does not use, bad input — and writes nothing', async () => {
    const { staff, v, office } = await californian(650_000, 20)
    const before = (await historyOf(t_.db, v.id)).length
    const cases: [object, string, string | undefined][] = [
      [{ event: 'state-notice-mailed', day: day(1) }, 'day', 'clockSteps.dayInFuture'],
      [{ event: 'state-notice-mailed', day: day(-21) }, 'day', 'clockSteps.dayBeforeArrival'],
      [{ event: 'sale-notice-posted', day: day() }, 'event', 'clockSteps.stepNotUsed'],
      [{ event: 'lien-notice-mailed', day: day() }, 'event', 'clockSteps.chooseStep'],
      [{ event: 'state-notice-mailed', day: 'last week' }, 'day', 'clockSteps.enterDay'],
      [{ event: 'state-notice-mailed', day: '2026-02-30' }, 'day', undefined],
      [{ event: 'state-notice-mailed', day: day(), note: 'x'.repeat(301) }, 'note', undefined],
    ]
    for (const [body, path, code] of cases) {
      const res = await office.post(base(v.id), body)
      expect(res.status, JSON.stringify(body)).toBe(400)
      expect(res.body.issues[0].path, JSON.stringify(res.body)).toBe(path)
      if (code) expect(res.body.issues[0].code).toBe(code)
    }
    expect((await office.post(base(v.id), { event: 'state-notice-mailed', day: day(-21) })).body.issues[0].params).toEqual({ date: day(-20) })
    expect(await eventsOf(v.id, 'state-notice-mailed')).toEqual([])
    expect((await historyOf(t_.db, v.id)).length).toBe(before)

    // The dispatcher cannot record them; a vehicle that has left the yard refuses them whole.
    const dispatcher = await signedIn(t_.app, staff.dispatcher)
    expect((await dispatcher.post(base(v.id), { event: 'state-notice-mailed', day: day() })).status).toBe(403)
    await t_.db.update(t.vehicles).set({ state: 'closed', closedAt: new Date(), disposition: 'returned_to_owner' }).where(eq(t.vehicles.id, v.id))
    const closed = await office.post(base(v.id), { event: 'state-notice-mailed', day: day() })
    expect(closed.status).toBe(409)
    expect(closed.body).toMatchObject({ code: 'closedClockStep', params: { stock: v.stockNumber } })
    expect(await eventsOf(v.id, 'state-notice-mailed')).toEqual([])
  })
})

const contact = { role: 'registered_owner', name: 'Ines Waterford', street: '12 Larkspur Ct', city: 'Orrin Flats', state: 'CA', zip: '93201', language: 'en', source: 'vehicle_papers' }
const LIEN_SALE = {
  kind: 'lien_sale',
  sellerName: 'Test Towing yard, lienholder',
  buyerKind: 'other',
  buyerName: 'Rosalind Vey',
  buyerAddress: '22 Kestrel Lane, Orrin Flats, CA 93201',
  buyerIdType: 'drivers_license',
  buyerIdNumber: 'V5521098',
  priceCents: 150_000,
  odometer: 88_100,
  date: day(),
}

/** The yard's notice of the sale (the "notice of pending lien sale"), made and mailed by certified mail through the notices routes. */
async function mailSaleNotice(office: BrowserSession, vehicleId: string, mailedOn: string) {
  expect((await office.post(`/api/vehicles/${vehicleId}/contacts`, contact)).status).toBe(201)
  const made = await office.post(`/api/vehicles/${vehicleId}/notices`, { kind: 'sale_notice' })
  expect(made.status, JSON.stringify(made.body)).toBe(201)
  const notice = made.body.notices[0]
  const sent = await office.post(`/api/vehicles/${vehicleId}/notices/${notice.id}/send`, { certifiedMail: true, trackingNumber: '9407111206201234567890', mailedOn })
  expect(sent.status, JSON.stringify(sent.body)).toBe(200)
}

async function sellAndClose(office: BrowserSession, manager: BrowserSession, vehicleId: string) {
  const sold = await manager.put(`/api/vehicles/${vehicleId}/transfer`, LIEN_SALE)
  expect(sold.status, JSON.stringify(sold.body)).toBe(200)
  expect((await manager.post(`/api/vehicles/${vehicleId}/transfer/signature`, { signerName: 'Pat Lindqvist, for the yard', image: await signaturePng() })).status).toBeLessThan(300)
  const closed = await office.post(`/api/vehicles/${vehicleId}/moves`, { to: 'closed', version: (await vehicleRow(t_.db, vehicleId)).version, disposition: 'lien_sale', reason: null })
  expect(closed.status, JSON.stringify(closed.body)).toBe(200)
}

describe('the whole California path, through the routes only', () => {
  it('valued $500–$4,000 (Cal. Civ. Code § 3072): notice, posting, sale date today → eligible, sold and closed as a lien sale', async () => {
    const { staff, v, office } = await californian(250_000)
    const manager = await signedIn(t_.app, staff.manager)
    // Notice of pending lien sale mailed 35 days before the sale: inside § 3072's 31–41 days.
    await mailSaleNotice(office, v.id, day(-35))
    // Not posted yet: the gate waits (§ 3072: posted at least 10 days before the sale).
    expect((await office.get(`/api/vehicles/${v.id}`)).body.summary.lienSale).toMatchObject({ open: false })
    // Posted 12 days before the sale.
    expect((await office.post(base(v.id), { event: 'sale-notice-posted', day: day(-12), note: 'Front gate board' })).status).toBe(201)
    // Sale date today: § 3072's 31 days from the mailing fell on day -4, § 3072's 10 days from the posting on day -2.
    const page = (await office.get(`/api/vehicles/${v.id}/sale-date`)).body
    expect(page).toMatchObject({ applies: true, earliest: day() })
    expect((await office.put(`/api/vehicles/${v.id}/sale-date`, { day: day() })).status).toBe(200)
    const steps = (await office.get(base(v.id))).body
    expect(deadline(steps, 'sale-notice-posted', 'sale-notice-posted')).toMatchObject({ role: 'meets', status: 'met', dueDate: day(-10) })
    expect(deadline(steps, 'sale-notice-posted', 'sale-after-posting')).toMatchObject({ role: 'starts', status: 'reached', dueDate: day(-2) })
    const summary = (await office.get(`/api/vehicles/${v.id}`)).body.summary
    expect(summary.lienSale).toMatchObject({ open: true, code: 'open', date: day() })
    expect(summary.eligible).not.toBeNull()
    await sellAndClose(office, manager, v.id)
    expect((await vehicleRow(t_.db, v.id)).state).toBe('closed')
  })

  it('valued over $4,000 (Cal. Civ. Code § 3071): application, state notice, notice of sale, advertisement, sale date today → closed as a lien sale', async () => {
    const { staff, v, office } = await californian(650_000)
    const manager = await signedIn(t_.app, staff.manager)
    // Applied 25 days after the lien arose (§ 3071: within 30 days).
    expect((await office.post(base(v.id), { event: 'lien-sale-application-filed', day: day(-35), note: 'DMV file 4471' })).status).toBe(201)
    await mailSaleNotice(office, v.id, day(-25))
    // The yard's notice is out but the DMV's is not: the owners' time to oppose has not started, so no sale yet.
    const waiting = (await office.get(`/api/vehicles/${v.id}`)).body.summary.lienSale
    expect(waiting).toMatchObject({ open: false })
    // The DMV mailed its notice 30 days ago: § 3071(b)–(c)'s 10 days to oppose ended day -20.
    const mailed = await office.post(base(v.id), { event: 'state-notice-mailed', day: day(-30), note: 'DMV ref 99-1208' })
    expect(deadline(mailed.body, 'state-notice-mailed', 'opposition-period')).toMatchObject({ status: 'reached', dueDate: day(-20) })
    // Advertised 10 days before the sale (§ 3071: 5 to 20 days before it).
    expect((await office.post(`/api/vehicles/${v.id}/publications`, { newspaper: 'Orrin Flats Ledger', days: [day(-10)] })).status).toBe(201)
    // § 3071: the notice of sale 20 days before it — mailed day -25, so today is allowed.
    expect((await office.get(`/api/vehicles/${v.id}/sale-date`)).body).toMatchObject({ applies: true, earliest: day() })
    expect((await office.put(`/api/vehicles/${v.id}/sale-date`, { day: day() })).status).toBe(200)
    const steps = (await office.get(base(v.id))).body
    expect(deadline(steps, 'lien-sale-application-filed', 'lien-sale-application')).toMatchObject({ status: 'met', dueDate: day(-30) })
    expect((await office.get(`/api/vehicles/${v.id}`)).body.summary.lienSale).toMatchObject({ open: true, code: 'open', date: day() })
    await sellAndClose(office, manager, v.id)
    expect((await vehicleRow(t_.db, v.id)).state).toBe('closed')
  })
})
