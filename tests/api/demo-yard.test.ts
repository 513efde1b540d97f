// The demo yard is made by the real services under a simulated clock (issue 11, "The bill", last
// bullet): these checks hold because the same rules made it, not because the demo was written to fit.
import { readFileSync } from 'node:fs'
import { asc, eq, inArray } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { historyOf, verifyChain } from '@db/history'
import * as t from '@db/schema'
import { DEMO_PASSWORD } from '../../server/demo/scenario'
import { loadDemoIfEmpty } from '../../server/demo/index'
import { makeTestApp, signedIn, type BrowserSession, type TestApp, TEST_HISTORY_KEY } from '../helpers/app'

const ZONE = 'America/Los_Angeles'
const DAY = 86_400_000

let app: TestApp
let office: BrowserSession
let vehicles: (typeof t.vehicles.$inferSelect)[]
beforeAll(async () => {
  app = await makeTestApp()
  await loadDemoIfEmpty(app.db, TEST_HISTORY_KEY)
  office = await signedIn(app.app, { email: 'priya@tamsincreek.example', password: DEMO_PASSWORD })
  vehicles = await app.db.select().from(t.vehicles).orderBy(asc(t.vehicles.arrivedAt))
}, 180_000)
afterAll(() => app.close())

/** The wall-clock weekday and minute of an instant in the yard's zone, read by Intl here (not by the code under test). */
function yardClock(at: Date) {
  const parts = Object.fromEntries(
    new Intl.DateTimeFormat('en-US', { timeZone: ZONE, weekday: 'short', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }).formatToParts(at).map((p) => [p.type, p.value]),
  )
  return { weekday: parts.weekday!, minute: Number(parts.hour) * 60 + Number(parts.minute) }
}

// The demo yard's posted hours (server/demo/scenario.ts, DEMO_YARD.hours: "Mon–Fri 8:00–17:00 · Sat 9:00–12:00"), invented.
function withinPostedHours(at: Date): boolean {
  const { weekday, minute } = yardClock(at)
  if (['Mon', 'Tue', 'Wed', 'Thu', 'Fri'].includes(weekday)) return minute >= 8 * 60 && minute < 17 * 60
  if (weekday === 'Sat') return minute >= 9 * 60 && minute < 12 * 60
  return false
}

const calendarDay = (at: Date) => new Intl.DateTimeFormat('en-CA', { timeZone: ZONE, year: 'numeric', month: '2-digit', day: '2-digit' }).format(at)
const dayNumber = (iso: string) => Date.parse(`${iso}T00:00:00Z`) / DAY

describe('the demo yard, made by the services', () => {
  it('has its vehicles in every column, some of them closed', () => {
    const states = new Set(vehicles.map((v) => v.state))
    expect([...states].sort()).toEqual(['arrival', 'closed', 'decision', 'release', 'storage', 'teardown'])
  })

  it('every vehicle in Owner decision or later was inspected, the inspection finished before the move there', async () => {
    const later = vehicles.filter((v) => ['decision', 'storage', 'release', 'closed'].includes(v.state))
    expect(later.length).toBeGreaterThan(10)
    const done = await app.db.select().from(t.inspections).where(inArray(t.inspections.vehicleId, later.map((v) => v.id)))
    for (const v of later) {
      const inspection = done.find((i) => i.vehicleId === v.id)
      expect(inspection?.finishedAt, `${v.make} ${v.model}`).toBeTruthy()
      const events = await historyOf(app.db, v.id)
      const toDecision = events.find((e) => e.kind === 'moved' && e.toState === 'decision')!
      expect(inspection!.finishedAt!.getTime()).toBeLessThanOrEqual(toDecision.at.getTime())
    }
  })

  it('every history chain verifies', async () => {
    for (const v of vehicles) expect(verifyChain(TEST_HISTORY_KEY, await historyOf(app.db, v.id)).ok, `${v.make} ${v.model}`).toBe(true)
  })

  it('every staff action other than a tow-in falls within the yard’s posted hours', async () => {
    let checked = 0
    for (const v of vehicles) {
      const events = await historyOf(app.db, v.id)
      const towIn = events[0]!
      expect(towIn.kind).toBe('towed_in')
      for (const e of events) {
        // The tow-in (any hour) and what it recorded in the same change (a hold the officer placed).
        if (e.at.getTime() === towIn.at.getTime()) continue
        checked++
        expect(withinPostedHours(e.at), `${v.make} ${v.model}: ${e.kind} at ${e.at.toISOString()} (${JSON.stringify(yardClock(e.at))})`).toBe(true)
      }
    }
    expect(checked).toBeGreaterThan(200)
  })

  it('the archive’s dates are the history’s dates', async () => {
    const page = (await office.get('/api/vehicles/closed').expect(200)).body
    const closed = vehicles.filter((v) => v.state === 'closed')
    expect(page.rows).toHaveLength(closed.length)
    for (const row of page.rows as { id: string; arrivedAt: string; closedAt: string }[]) {
      const events = await historyOf(app.db, row.id)
      const out = events.find((e) => e.kind === 'moved' && e.toState === 'closed')!
      expect(row.closedAt).toBe(out.at.toISOString())
      const [tow] = await app.db.select().from(t.tows).where(eq(t.tows.vehicleId, row.id))
      expect(row.arrivedAt).toBe(tow!.arrivedAt.toISOString())
      expect(events[0]!.kind).toBe('towed_in')
      expect(events[0]!.at.getTime()).toBeGreaterThanOrEqual(tow!.arrivedAt.getTime())
    }
  })

  it('each closed lien-sale vehicle met its records request and passed its earliest disposal date', async () => {
    // The California sample rule set, as shipped: the records request within its days of the lien, disposal not before its days after the notice.
    const rules = JSON.parse(readFileSync('server/rule-sets/samples/california.json', 'utf8')) as { timeline: { code: string; days: number }[] }
    const requestDays = rules.timeline.find((s) => s.code === 'records-request')!.days
    const disposalDays = rules.timeline.find((s) => s.code === 'low-value-disposal')!.days
    const sold = vehicles.filter((v) => v.disposition === 'lien_sale')
    expect(sold.length).toBeGreaterThan(0)
    for (const v of sold) {
      const [request] = await app.db.select().from(t.recordsRequests).where(eq(t.recordsRequests.vehicleId, v.id))
      expect(dayNumber(request!.sentOn) - dayNumber(calendarDay(v.arrivedAt))).toBeLessThanOrEqual(requestDays)
      const mailed = (await app.db.select().from(t.clockEvents).where(eq(t.clockEvents.vehicleId, v.id))).filter((e) => e.kind === 'disposal-notice-mailed')
      expect(mailed).toHaveLength(1)
      expect(dayNumber(calendarDay(v.closedAt!)) - dayNumber(calendarDay(mailed[0]!.at))).toBeGreaterThanOrEqual(disposalDays)
      expect(v.estimatedValueCents).toBeLessThanOrEqual(50_000)
      const deadline = (await office.get(`/api/vehicles/${v.id}/contacts`).expect(200)).body.recordsDeadline
      expect(deadline.status, JSON.stringify(deadline)).toBe('met')
    }
  })

  it('a few records requests went out late on purpose, and their clocks say so', async () => {
    const requests = await app.db.select().from(t.recordsRequests)
    const late = requests.filter((r) => {
      const v = vehicles.find((x) => x.id === r.vehicleId)!
      return dayNumber(r.sentOn) - dayNumber(calendarDay(v.arrivedAt)) > 15
    })
    expect(late.length).toBeGreaterThanOrEqual(2)
    for (const r of late) {
      const page = (await office.get(`/api/vehicles/${r.vehicleId}/contacts`).expect(200)).body
      expect(page.recordsDeadline.doneAt > page.recordsDeadline.dueDate, JSON.stringify(page.recordsDeadline)).toBe(true)
      expect(page.recordsDeadline.status).toBe('missed')
    }
  })

  it('what the demo took at the counter equals the closed vehicles’ frozen invoices', async () => {
    const paid = vehicles.filter((v) => v.state === 'closed' && v.disposition !== 'lien_sale')
    expect(paid.length).toBeGreaterThan(0)
    for (const v of paid) {
      const { invoice } = (await office.get(`/api/vehicles/${v.id}/invoice`).expect(200)).body
      const payments = await app.db.select().from(t.payments).where(eq(t.payments.vehicleId, v.id))
      expect(invoice.frozen).toBe(true)
      expect(invoice.endsAt).toBe(v.closedAt!.toISOString())
      expect(payments.reduce((s, p) => s + p.amountCents, 0)).toBe(invoice.totalCents)
      expect(invoice.dueCents).toBe(0)
    }
  })
})
