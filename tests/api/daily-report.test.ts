import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { isoDate, localDay, startOfLocalDay } from '@shared/domain/time'
import { dailyReportSchema } from '@shared/schemas/reports'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { key } from '../helpers/billing'
import { DAY, sampleVersion } from '../helpers/board'
import { makeStaff, makeVehicle } from '../helpers/factories'
import { pdfText, renderFirstPage } from '../helpers/pdf'

// Issue 12, "Daily report": one yard day's arrivals, releases, payments by method, storage earned and
// drawer. Rates are the California sample's placeholders ($65.00 a day for a car, a $95.00 impound fee
// once per stay, no tax: server/rule-sets/samples/california.json), counted by calendar day or part of
// one (Cal. Civ. Code § 3068.1(a)(1)).

let app: TestApp
beforeAll(async () => {
  app = await makeTestApp()
})
afterAll(() => app.close())

const ZONE = 'America/Los_Angeles'

async function day() {
  const staff = await makeStaff(app.db)
  const office = await signedIn(app.app, staff.office)
  const ruleSetVersionId = await sampleVersion(app.db, 'california-sample')
  const todayNum = localDay(ZONE, Date.now())
  const startOfToday = startOfLocalDay(ZONE, todayNum)
  // A: on the lot since three days before today; B: arrived in the first second of today.
  const a = await makeVehicle(app.db, staff.yard.id, { state: 'storage', ruleSetVersionId, arrivedAt: new Date(startOfToday - 3 * DAY + 3_600_000) })
  const b = await makeVehicle(app.db, staff.yard.id, { state: 'arrival', ruleSetVersionId, arrivedAt: new Date(startOfToday + 1000) })
  await app.db.insert(t.tows).values({ vehicleId: b.id, reason: 'private_property', arrivedAt: b.arrivedAt, chargeCents: 0 })
  return { staff, office, a, b, today: isoDate(todayNum), yesterday: isoDate(todayNum - 1) }
}

describe('daily report', () => {
  it('daily_today_listsTheArrivalThePaymentsByMethodAndTheStorageEarned', async () => {
    const { office, b, a, today } = await day()
    await office.post(`/api/vehicles/${a.id}/payments`, { idempotencyKey: key(), method: 'cash', amountCents: 5_000, tenderedCents: 6_000 }).expect(201)
    await office.post(`/api/vehicles/${a.id}/payments`, { idempotencyKey: key(), method: 'check', amountCents: 3_000, checkNumber: '2210' }).expect(201)
    const r = dailyReportSchema.parse((await office.get('/api/reports/daily').expect(200)).body)
    expect(r.date).toBe(today)
    expect(r.arrivals.map((x) => [x.vehicleId, x.towReason])).toEqual([[b.id, 'private_property']])
    expect(r.releases).toEqual([])
    expect(r.payments).toEqual([
      { method: 'cash', count: 1, paymentsCents: 5_000, refundsCents: 0, netCents: 5_000 },
      { method: 'check', count: 1, paymentsCents: 3_000, refundsCents: 0, netCents: 3_000 },
    ])
    expect(r.paymentsNetCents).toBe(8_000)
    expect(r.cashRecordedCents).toBe(5_000)
    expect(r.closeout).toBeNull()
    // A: today's calendar day, $65.00. B: its first day and the impound fee, $65.00 + $95.00.
    expect(r.storageEarnedCents).toBe(6_500 + 6_500 + 9_500)
    expect(r.storageVehicles).toBe(2)
  })

  it('daily_yesterday_countsOneFullDayOfTheVehicleThatWasThere_andNotTheOneThatCameLater', async () => {
    const { office, yesterday } = await day()
    const r = dailyReportSchema.parse((await office.get(`/api/reports/daily?date=${yesterday}`).expect(200)).body)
    expect(r.arrivals).toEqual([])
    expect(r.payments).toEqual([])
    expect(r.storageEarnedCents).toBe(6_500)
    expect(r.storageVehicles).toBe(1)
  })

  it('daily_badDay_isRefusedNamingTheField', async () => {
    const { office } = await day()
    for (const q of ['date=2026-13-01', 'date=yesterday', 'lang=fr']) {
      const res = await office.get(`/api/reports/daily?${q}`)
      expect(res.status, q).toBe(400)
      expect(res.body.issues[0].path, q).toBe(q.split('=')[0])
    }
  })

  it('dailyPdf_inSpanish_readsBackWithTheDayTheMoneyAndTheDrawer', async () => {
    const { office, a, today } = await day()
    await office.post(`/api/vehicles/${a.id}/payments`, { idempotencyKey: key(), method: 'cash', amountCents: 5_000, tenderedCents: 5_000 }).expect(201)
    const res = await office.get(`/api/reports/daily.pdf?lang=es&date=${today}`).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = []
      r.on('data', (c: Buffer) => chunks.push(c))
      r.on('end', () => cb(null, Buffer.concat(chunks)))
    })
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toBe('application/pdf')
    const pdf = res.body as Buffer
    const text = await pdfText(pdf)
    expect(text).toContain(`REPORTE DEL DÍA — ${today}`)
    expect(text).toContain('Ingresos (1)')
    expect(text).toMatch(/Efectivo \(1 movimientos\)\s+\$50\.00/)
    expect(text).toContain('$225.00')
    expect(text).toContain('La caja de este día no está cerrada.')
    await renderFirstPage(pdf, 'daily-report-es')
  })

  it('daily_dispatcherAndTechnician_areRefused', async () => {
    const { staff } = await day()
    for (const role of ['dispatcher', 'technician'] as const) {
      const s = await signedIn(app.app, staff[role])
      await s.get('/api/reports/daily').expect(403)
      await s.get('/api/reports/daily.pdf').expect(403)
    }
  })
})
