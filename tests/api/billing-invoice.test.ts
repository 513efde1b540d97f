import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { formatCents } from '@shared/domain/billing'
import { isoDate, localDay } from '@shared/domain/time'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { billedVehicle, key } from '../helpers/billing'
import { DAY } from '../helpers/board'
import { makeStaff } from '../helpers/factories'
import { pdfText, renderFirstPage } from '../helpers/pdf'

let app: TestApp
beforeAll(async () => {
  app = await makeTestApp()
})
afterAll(() => app.close())

const binary = (req: ReturnType<Awaited<ReturnType<typeof signedIn>>['get']>) =>
  req.buffer(true).parse((res, done) => {
    const chunks: Buffer[] = []
    res.on('data', (c: Buffer) => chunks.push(c))
    res.on('end', () => done(null, Buffer.concat(chunks)))
  })

describe('the invoice', () => {
  it('invoice_ofAVehicleOnTheLot_addsUpToTheBalanceTheBoardShows', async () => {
    const staff = await makeStaff(app.db)
    const v = await billedVehicle(app.db, staff.yard.id, { sample: 'florida-sample', days: 3 })
    const s = await signedIn(app.app, staff.office)
    const inv = (await s.get(`/api/vehicles/${v.id}/invoice`).expect(200)).body.invoice
    const page = (await s.get(`/api/vehicles/${v.id}`).expect(200)).body
    expect(inv.totalCents).toBe(page.summary.balanceCents)
    expect(inv.lines.map((l: { code: string }) => l.code)).toEqual(['tow', 'storage', 'impound'])
    const sum = inv.lines.reduce((n: number, l: { amountCents: number; taxCents: number }) => n + l.amountCents + l.taxCents, 0)
    expect(sum).toBe(inv.totalCents)
    expect(inv).toMatchObject({ frozen: false, storageDays: 4, paidCents: 0, dueCents: inv.totalCents })
  })

  it('invoice_asOfALaterDate_billsTheStorageToThen', async () => {
    const staff = await makeStaff(app.db)
    const v = await billedVehicle(app.db, staff.yard.id, { sample: 'florida-sample', days: 3 })
    const s = await signedIn(app.app, staff.office)
    const later = new Date(v.arrivedAt.getTime() + 10 * DAY - 3_600_000).toISOString()
    const inv = (await s.get(`/api/vehicles/${v.id}/invoice?asOf=${encodeURIComponent(later)}`).expect(200)).body.invoice
    expect(inv.storageDays).toBe(10)
    expect(inv.endsAt).toBe(later)
  })

  it('invoice_asOfBeforeArrival_isRefusedNamingAsOf', async () => {
    const staff = await makeStaff(app.db)
    const v = await billedVehicle(app.db, staff.yard.id)
    const s = await signedIn(app.app, staff.office)
    const res = await s.get(`/api/vehicles/${v.id}/invoice?asOf=${encodeURIComponent(new Date(v.arrivedAt.getTime() - DAY).toISOString())}`)
    expect(res.status).toBe(400)
    expect(res.body.issues[0].path).toBe('asOf')
    expect((await s.get(`/api/vehicles/${v.id}/invoice?asOf=tomorrow`)).body.issues[0].path).toBe('asOf')
  })

  it('invoice_ofAClosedVehicle_isFrozenAtTheMomentItLeft', async () => {
    const staff = await makeStaff(app.db)
    const v = await billedVehicle(app.db, staff.yard.id, { days: 9 })
    const left = new Date(v.arrivedAt.getTime() + 2 * DAY + 3_600_000)
    await app.db.update(t.vehicles).set({ state: 'closed', disposition: 'returned_to_owner', closedAt: left }).where(eq(t.vehicles.id, v.id))
    const s = await signedIn(app.app, staff.office)
    const inv = (await s.get(`/api/vehicles/${v.id}/invoice?asOf=${encodeURIComponent(new Date().toISOString())}`).expect(200)).body.invoice
    expect(inv).toMatchObject({ frozen: true, endsAt: left.toISOString(), storageDays: 3 })
    const page = (await s.get(`/api/vehicles/${v.id}`).expect(200)).body
    expect(page.summary).toMatchObject({ daysOnLot: 3, balanceCents: inv.totalCents, nextDeadline: null, clockAlerts: [] })
  })
})

describe('receipts', () => {
  it('receipt_ofACashPayment_printsTheAmountChangeAndWhatIsStillOwed', async () => {
    const staff = await makeStaff(app.db)
    const v = await billedVehicle(app.db, staff.yard.id)
    const s = await signedIn(app.app, staff.office)
    const paid = (await s.post(`/api/vehicles/${v.id}/payments`, { idempotencyKey: key(), method: 'cash', amountCents: 15_000, tenderedCents: 20_000 }).expect(201)).body
    const res = await binary(s.get(`/api/vehicles/${v.id}/payments/${paid.payment.id}/receipt`))
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toBe('application/pdf')
    expect(res.headers['cache-control']).toBe('private, no-store')
    const text = await pdfText(res.body, { layout: true })
    expect(text).toContain(v.stockNumber)
    expect(text).toMatch(/Paid by\s+Cash/)
    expect(text).toMatch(/Cash handed over\s+\$200\.00/)
    expect(text).toMatch(/Change given\s+\$50\.00/)
    expect(text).toMatch(new RegExp(`Still owed\\s+\\${formatCents(paid.invoice.dueCents)}`))
    await renderFirstPage(res.body, 'receipt-cash')

    const es = await binary(s.get(`/api/vehicles/${v.id}/payments/${paid.payment.id}/receipt?lang=es`))
    const textEs = await pdfText(es.body, { layout: true })
    expect(textEs).toMatch(/Forma de pago\s+Efectivo/)
    expect(textEs).toMatch(/Cambio entregado\s+\$50\.00/)
    await renderFirstPage(es.body, 'receipt-cash-es')
  })

  it('receipt_ofAnotherVehiclesPayment_isNotFound', async () => {
    const staff = await makeStaff(app.db)
    const a = await billedVehicle(app.db, staff.yard.id)
    const b = await billedVehicle(app.db, staff.yard.id)
    const s = await signedIn(app.app, staff.office)
    const paid = (await s.post(`/api/vehicles/${a.id}/payments`, { idempotencyKey: key(), method: 'cash', amountCents: 100 }).expect(201)).body
    expect((await s.get(`/api/vehicles/${b.id}/payments/${paid.payment.id}/receipt`)).status).toBe(404)
  })
})

describe('the cash drawer close-out', () => {
  it('closeout_countsCashInLessCashOutAgainstTheCountAndRecordsWhoAndWhen', async () => {
    const staff = await makeStaff(app.db)
    const v = await billedVehicle(app.db, staff.yard.id, { days: 6 })
    const office = await signedIn(app.app, staff.office)
    const manager = await signedIn(app.app, staff.manager)
    await office.post(`/api/vehicles/${v.id}/payments`, { idempotencyKey: key(), method: 'cash', amountCents: 12_000, tenderedCents: 15_000 }).expect(201)
    await office.post(`/api/vehicles/${v.id}/payments`, { idempotencyKey: key(), method: 'cash', amountCents: 5_000 }).expect(201)
    await office.post(`/api/vehicles/${v.id}/payments`, { idempotencyKey: key(), method: 'check', amountCents: 1_000, checkNumber: '12' }).expect(201)
    await manager.post(`/api/vehicles/${v.id}/refunds`, { idempotencyKey: key(), method: 'cash', amountCents: 2_000, reason: 'Wrong class' }).expect(201)

    const drawer = (await office.get('/api/cash-drawer').expect(200)).body.drawer
    const today = isoDate(localDay(staff.yard.timeZone, Date.now()))
    expect(drawer).toMatchObject({ businessDate: today, recordedCents: 15_000, closeout: null })
    expect(drawer.movements.map((m: { kind: string; amountCents: number }) => [m.kind, m.amountCents])).toEqual([
      ['payment', 12_000],
      ['payment', 5_000],
      ['refund', 2_000],
    ])

    const closed = await office.post('/api/cash-drawer/closeout', { businessDate: today, openingFloatCents: 10_000, countedCents: 24_950, note: 'Counted twice' })
    expect(closed.status).toBe(201)
    expect(closed.body.drawer.closeout).toMatchObject({ recordedCents: 15_000, expectedCents: 25_000, countedCents: 24_950, overShortCents: -50, closedBy: staff.office.name, note: 'Counted twice' })
    expect(Date.now() - Date.parse(closed.body.drawer.closeout.closedAt)).toBeLessThan(60_000)

    const again = await manager.post('/api/cash-drawer/closeout', { businessDate: today, openingFloatCents: 0, countedCents: 0 })
    expect(again.status).toBe(409)
  })

  it.each([
    { why: 'a day still to come', body: { businessDate: '2999-01-01', openingFloatCents: 0, countedCents: 0 }, status: 400, path: 'businessDate' },
    { why: 'no count', body: { businessDate: '2026-01-05', openingFloatCents: 0 }, status: 400, path: 'countedCents' },
    { why: 'a negative float', body: { businessDate: '2026-01-05', openingFloatCents: -1, countedCents: 0 }, status: 400, path: 'openingFloatCents' },
    { why: 'a date that is no date', body: { businessDate: '2026-02-30', openingFloatCents: 0, countedCents: 0 }, status: 400, path: 'businessDate' },
  ])('closeout_with $why — refused naming the field', async ({ body, status, path }) => {
    const staff = await makeStaff(app.db)
    const s = await signedIn(app.app, staff.office)
    const res = await s.post('/api/cash-drawer/closeout', body)
    expect(res.status).toBe(status)
    expect(res.body.issues.map((i: { path: string }) => i.path)).toContain(path)
    expect(await app.db.select().from(t.cashCloseouts).where(eq(t.cashCloseouts.yardId, staff.yard.id))).toHaveLength(0)
  })
})
