import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { agedSchema, receivablesSchema } from '@shared/schemas/reports'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { billedVehicle, key } from '../helpers/billing'
import { makeStaff } from '../helpers/factories'

// Issue 12, "Office": the receivables (totals against the invoices, paging, CSV escaping) and the
// aged inventory, each for the office of one company only.

let app: TestApp
beforeAll(async () => {
  app = await makeTestApp()
})
afterAll(() => app.close())

const invoiceOf = async (s: Awaited<ReturnType<typeof signedIn>>, id: string) => (await s.get(`/api/vehicles/${id}/invoice`).expect(200)).body.invoice

async function yardWithBalances() {
  const staff = await makeStaff(app.db)
  const office = await signedIn(app.app, staff.office)
  const manager = await signedIn(app.app, staff.manager)
  const a = await billedVehicle(app.db, staff.yard.id, { days: 2, state: 'storage' })
  const b = await billedVehicle(app.db, staff.yard.id, { days: 9, state: 'storage' })
  const c = await billedVehicle(app.db, staff.yard.id, { days: 40, state: 'storage' })
  const settled = await billedVehicle(app.db, staff.yard.id, { days: 1 })
  // Part paid, part discounted, all paid: three ways the due differs from the charges.
  await office.post(`/api/vehicles/${b.id}/payments`, { idempotencyKey: key(), method: 'cash', amountCents: 5_000, tenderedCents: 5_000 }).expect(201)
  await manager.post(`/api/vehicles/${c.id}/adjustments`, { kind: 'discount', amountCents: 2_500, reason: 'Regular customer: goodwill' }).expect(201)
  const all = (await invoiceOf(office, settled.id)).dueCents as number
  await office.post(`/api/vehicles/${settled.id}/payments`, { idempotencyKey: key(), method: 'check', amountCents: all, checkNumber: '1001' }).expect(201)
  return { staff, office, manager, owing: [a, b, c], settled }
}

describe('receivables', () => {
  it('receivables_totalsAndRows_equalTheInvoicesOfTheVehiclesThatOweMoney', async () => {
    const { office, owing, settled } = await yardWithBalances()
    const page = receivablesSchema.parse((await office.get('/api/reports/receivables').expect(200)).body)
    const invoices = await Promise.all(owing.map((v) => invoiceOf(office, v.id)))
    expect(page.rows.map((r) => r.vehicleId).sort()).toEqual(owing.map((v) => v.id).sort())
    expect(page.rows.some((r) => r.vehicleId === settled.id)).toBe(false)
    for (const [i, v] of owing.entries()) {
      const row = page.rows.find((r) => r.vehicleId === v.id)!
      expect(row).toMatchObject({ chargesCents: invoices[i].totalCents, paidCents: invoices[i].netPaidCents, creditedCents: invoices[i].creditedCents, dueCents: invoices[i].dueCents })
    }
    const sum = (f: string) => invoices.reduce((n, inv) => n + inv[f], 0)
    expect(page.totals).toEqual({
      count: 3,
      chargesCents: sum('totalCents'),
      storageCents: page.rows.reduce((n, r) => n + r.storageCents, 0),
      creditedCents: sum('creditedCents'),
      paidCents: sum('netPaidCents'),
      dueCents: sum('dueCents'),
    })
    expect(page.totals.paidCents).toBe(5_000)
    expect(page.totals.creditedCents).toBe(2_500)
  })

  it('receivables_pagedAndSorted_splitTheRowsAndKeepTheTotalsOfAll', async () => {
    const { office } = await yardWithBalances()
    const first = receivablesSchema.parse((await office.get('/api/reports/receivables?pageSize=2&sort=daysOnLot&order=desc').expect(200)).body)
    const second = receivablesSchema.parse((await office.get('/api/reports/receivables?pageSize=2&page=2&sort=daysOnLot&order=desc').expect(200)).body)
    expect(first.rows).toHaveLength(2)
    expect(second.rows).toHaveLength(1)
    const days = [...first.rows, ...second.rows].map((r) => r.daysOnLot)
    expect(days).toEqual([...days].sort((x, y) => y - x))
    expect(second.totals).toEqual(first.totals)
    const old = receivablesSchema.parse((await office.get('/api/reports/receivables?minDays=30').expect(200)).body)
    expect(old.rows.every((r) => r.daysOnLot >= 30)).toBe(true)
    expect(old.totals.count).toBe(1)
  })

  it('receivables_badFilters_areRefusedNamingTheField', async () => {
    const { office } = await yardWithBalances()
    for (const [query, field] of [['pageSize=0', 'pageSize'], ['pageSize=500', 'pageSize'], ['page=1.5', 'page'], ['sort=owner', 'sort'], ['column=closed', 'column']] as const) {
      const res = await office.get(`/api/reports/receivables?${query}`)
      expect(res.status, query).toBe(400)
      expect(res.body.issues.map((i: { path: string }) => i.path).join(), query).toContain(field)
    }
  })

  it('receivablesCsv_cellsThatASpreadsheetWouldRunAsFormulas_areEscapedWithAnApostrophe', async () => {
    const staff = await makeStaff(app.db)
    const office = await signedIn(app.app, staff.office)
    const v = await billedVehicle(app.db, staff.yard.id, { days: 3, state: 'storage' })
    // OWASP "CSV Injection" (https://owasp.org/www-community/attacks/CSV_Injection): = + - @ tab and CR lead a formula.
    const { eq } = await import('drizzle-orm')
    const t = await import('@db/schema')
    await app.db.update(t.vehicles).set({ make: '=HYPERLINK("http://x.test","y")', model: '@SUM(A1)', plate: '+1-2' }).where(eq(t.vehicles.id, v.id))
    const w = await billedVehicle(app.db, staff.yard.id, { days: 3, state: 'storage' })
    await app.db.update(t.vehicles).set({ make: '-3', model: 'Tab\tin', plate: '\tTAB' }).where(eq(t.vehicles.id, w.id))
    const res = await office.get('/api/reports/receivables.csv?sort=stockNumber&order=asc').expect(200)
    expect(res.headers['content-type']).toMatch(/^text\/csv/)
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="receivables-\d{4}-\d{2}-\d{2}\.csv"$/)
    const lines = res.text.split('\r\n').filter(Boolean)
    expect(lines[0]).toBe('Stock number,Vehicle,Plate,Column,Arrived,Storage days,Tow,Storage,Charged,Credited,Paid,Due,Next deadline,Next deadline date')
    expect(lines).toHaveLength(3)
    const rowV = lines.find((l) => l.startsWith(v.stockNumber))!
    // The vehicle's name starts with its year, so only the plate leads with a formula character here.
    expect(rowV).toContain(',"2013 =HYPERLINK(""http://x.test"",""y"") @SUM(A1)",\'+1-2,storage,')
    const rowW = lines.find((l) => l.startsWith(w.stockNumber))!
    expect(rowW).toContain(",2013 -3 Tab\tin,'\tTAB,storage,")
    const invoice = await invoiceOf(office, v.id)
    const due = rowV.split(',').at(-3)
    expect(due).toBe((invoice.dueCents / 100).toFixed(2))
  })

  it('receivables_anotherCompanysVehicles_areNeverListed', async () => {
    const { office } = await yardWithBalances()
    const other = await yardWithBalances()
    const mine = receivablesSchema.parse((await office.get('/api/reports/receivables').expect(200)).body)
    expect(mine.rows.some((r) => other.owing.some((v) => v.id === r.vehicleId))).toBe(false)
    const csv = (await office.get('/api/reports/receivables.csv').expect(200)).text
    for (const v of other.owing) expect(csv).not.toContain(v.stockNumber)
  })

  it('reports_onlyTheOfficeAndManagers_mayReadThem', async () => {
    const { staff } = await yardWithBalances()
    for (const role of ['dispatcher', 'technician'] as const) {
      const s = await signedIn(app.app, staff[role])
      await s.get('/api/reports/receivables').expect(403)
      await s.get('/api/reports/receivables.csv').expect(403)
      await s.get('/api/reports/aged').expect(403)
    }
    const manager = await signedIn(app.app, staff.manager)
    await manager.get('/api/reports/receivables').expect(200)
  })
})

describe('aged inventory', () => {
  it('aged_vehiclesOverThirtySixtyNinetyDays_areCountedAndListedOldestFirst', async () => {
    const staff = await makeStaff(app.db)
    const office = await signedIn(app.app, staff.office)
    const ids: Record<number, string> = {}
    for (const days of [5, 31, 45, 61, 95]) ids[days] = (await billedVehicle(app.db, staff.yard.id, { days, state: 'storage' })).id
    const aged = agedSchema.parse((await office.get('/api/reports/aged').expect(200)).body)
    expect(aged.counts).toMatchObject({ over30: 4, over60: 2, over90: 1, onLot: 5 })
    expect(aged.rows.map((r) => r.vehicleId)).toEqual([ids[95], ids[61], ids[45], ids[31]])
    expect(aged.rows.map((r) => r.over)).toEqual([90, 60, 30, 30])
    // Each row says whether the sale is allowed yet: eligible with its day and rule, or the gate's reason.
    for (const r of aged.rows) expect(r.eligible !== null || r.lienSale !== null).toBe(true)
  })
})
