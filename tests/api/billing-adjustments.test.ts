import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { historyOf } from '@db/history'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { billedVehicle, key } from '../helpers/billing'
import { historyCount } from '../helpers/board'
import { makeStaff, makeUser } from '../helpers/factories'

let app: TestApp
beforeAll(async () => {
  app = await makeTestApp()
})
afterAll(() => app.close())

const invoice = async (s: Awaited<ReturnType<typeof signedIn>>, id: string) => (await s.get(`/api/vehicles/${id}/invoice`).expect(200)).body.invoice

async function yard() {
  const staff = await makeStaff(app.db)
  const second = await makeUser(app.db, staff.company.id, 'manager')
  const v = await billedVehicle(app.db, staff.yard.id)
  return { staff, v, manager: await signedIn(app.app, staff.manager), other: await signedIn(app.app, second), office: await signedIn(app.app, staff.office) }
}

describe('waivers and discounts', () => {
  it('adjustment_upToTheLimit_countsAtOnceWithItsReasonInTheHistory', async () => {
    const { v, manager } = await yard()
    const before = await invoice(manager, v.id)
    const res = await manager.post(`/api/vehicles/${v.id}/adjustments`, { kind: 'discount', amountCents: 10_000, reason: 'Regular customer: goodwill' })
    expect(res.status).toBe(201)
    expect(res.body.adjustment).toMatchObject({ status: 'approved', amountCents: 10_000 })
    expect(res.body.invoice).toMatchObject({ creditedCents: 10_000, dueCents: before.dueCents - 10_000 })
    const [event] = (await historyOf(app.db, v.id)).filter((e) => e.kind === 'charges_adjusted')
    expect(event).toMatchObject({ reason: 'Regular customer: goodwill', after: { kind: 'discount', amountCents: 10_000 } })
  })

  it('adjustment_aboveTheLimit_waitsForASecondManagerAndCountsForNothingUntilThen', async () => {
    const { v, manager, other } = await yard()
    const due = (await invoice(manager, v.id)).dueCents
    const asked = await manager.post(`/api/vehicles/${v.id}/adjustments`, { kind: 'waiver', amountCents: 10_001, reason: 'Towed in error: wrong plate on the request' })
    expect(asked.body.adjustment.status).toBe('pending')
    expect(asked.body.invoice.dueCents).toBe(due)

    const self = await manager.post(`/api/vehicles/${v.id}/adjustments/${asked.body.adjustment.id}/approve`)
    expect(self.status).toBe(403)
    expect(self.body.error).toMatch(/second manager/)

    const approved = await other.post(`/api/vehicles/${v.id}/adjustments/${asked.body.adjustment.id}/approve`)
    expect(approved.status).toBe(200)
    expect(approved.body.adjustment).toMatchObject({ status: 'approved', decidedBy: expect.any(String) })
    expect(approved.body.invoice.dueCents).toBe(due - 10_001)
    expect((await historyOf(app.db, v.id)).map((e) => e.kind)).toEqual(['adjustment_requested', 'charges_adjusted'])

    const twice = await other.post(`/api/vehicles/${v.id}/adjustments/${asked.body.adjustment.id}/approve`)
    expect(twice.status).toBe(409)
  })

  it('adjustment_limitIsTheCompanysOwn', async () => {
    const { staff, v, manager } = await yard()
    await app.db.update(t.companies).set({ waiverApprovalLimitCents: 2_000 }).where(eq(t.companies.id, staff.company.id))
    const res = await manager.post(`/api/vehicles/${v.id}/adjustments`, { kind: 'discount', amountCents: 2_001, reason: 'Goodwill' })
    expect(res.body.adjustment.status).toBe('pending')
    expect(res.body.invoice.approvalLimitCents).toBe(2_000)
  })

  it('adjustment_declinedBySecondManager_keepsTheReasonAndCountsForNothing', async () => {
    const { v, manager, other } = await yard()
    const due = (await invoice(manager, v.id)).dueCents
    const asked = await manager.post(`/api/vehicles/${v.id}/adjustments`, { kind: 'waiver', amountCents: 15_000, reason: 'Owner complained' })
    const noReason = await other.post(`/api/vehicles/${v.id}/adjustments/${asked.body.adjustment.id}/decline`, { reason: ' ' })
    expect(noReason.status).toBe(400)
    expect(noReason.body.issues[0].path).toBe('reason')
    const declined = await other.post(`/api/vehicles/${v.id}/adjustments/${asked.body.adjustment.id}/decline`, { reason: 'The tow was lawful' })
    expect(declined.body.adjustment).toMatchObject({ status: 'declined', declineReason: 'The tow was lawful' })
    expect(declined.body.invoice.dueCents).toBe(due)
  })

  it.each([
    { why: 'no reason', body: { kind: 'waiver', amountCents: 500, reason: '' }, path: 'reason' },
    { why: 'no amount', body: { kind: 'waiver', reason: 'Goodwill' }, path: 'amountCents' },
    { why: 'an unknown kind', body: { kind: 'gift', amountCents: 500, reason: 'Goodwill' }, path: 'kind' },
  ])('adjustment_with $why — refused naming the field', async ({ body, path }) => {
    const { v, manager } = await yard()
    const res = await manager.post(`/api/vehicles/${v.id}/adjustments`, body)
    expect(res.status).toBe(400)
    expect(res.body.issues.map((i: { path: string }) => i.path)).toContain(path)
    expect(await historyCount(app.db, v.id)).toBe(0)
  })

  it('adjustment_moreThanIsOwed_isRefused', async () => {
    const { v, manager } = await yard()
    const due = (await invoice(manager, v.id)).dueCents
    const res = await manager.post(`/api/vehicles/${v.id}/adjustments`, { kind: 'waiver', amountCents: due + 1, reason: 'Everything' })
    expect(res.status).toBe(400)
    expect(res.body.issues[0].path).toBe('amountCents')
  })

  it('adjustment_waivingTheRest_letsTheHandOverPassTheBalanceGuard', async () => {
    const { staff, v, manager } = await yard()
    await app.db.update(t.companies).set({ waiverApprovalLimitCents: 1_000_000 }).where(eq(t.companies.id, staff.company.id))
    const due = (await invoice(manager, v.id)).dueCents
    const res = await manager.post(`/api/vehicles/${v.id}/adjustments`, { kind: 'waiver', amountCents: due, reason: 'Police asked to release at no charge' })
    expect(res.body.invoice).toMatchObject({ dueCents: 0, waived: true })
    const move = await manager.post(`/api/vehicles/${v.id}/moves`, { to: 'closed', version: 2, disposition: 'returned_to_owner' })
    expect(move.body.reasons.map((r: { code: string }) => r.code)).not.toContain('balance')
  })

  it('adjustment_byTheOffice_isForbidden', async () => {
    const { v, office } = await yard()
    expect((await office.post(`/api/vehicles/${v.id}/adjustments`, { kind: 'discount', amountCents: 100, reason: 'x' })).status).toBe(403)
    expect((await office.post(`/api/vehicles/${v.id}/refunds`, { idempotencyKey: key(), method: 'cash', amountCents: 100, reason: 'x' })).status).toBe(403)
  })
})

describe('refunds', () => {
  it('refund_neverMoreThanWasPaid_andThenTheRestOwedAgain', async () => {
    const { v, manager, office } = await yard()
    await office.post(`/api/vehicles/${v.id}/payments`, { idempotencyKey: key(), method: 'cash', amountCents: 6_000 }).expect(201)
    const tooMuch = await manager.post(`/api/vehicles/${v.id}/refunds`, { idempotencyKey: key(), method: 'cash', amountCents: 6_001, reason: 'Overcharged' })
    expect(tooMuch.status).toBe(400)
    expect(tooMuch.body.issues[0]).toMatchObject({ path: 'amountCents', message: 'At most $60.00 can be refunded.' })

    const ok = await manager.post(`/api/vehicles/${v.id}/refunds`, { idempotencyKey: key(), method: 'cash', amountCents: 4_000, reason: 'Charged the wrong class' })
    expect(ok.status).toBe(201)
    expect(ok.body.invoice).toMatchObject({ paidCents: 6_000, refundedCents: 4_000, netPaidCents: 2_000 })
    const again = await manager.post(`/api/vehicles/${v.id}/refunds`, { idempotencyKey: key(), method: 'cash', amountCents: 2_001, reason: 'More' })
    expect(again.status).toBe(400)
    const [event] = (await historyOf(app.db, v.id)).filter((e) => e.kind === 'payment_refunded')
    expect(event).toMatchObject({ reason: 'Charged the wrong class', after: { amountCents: 4_000, method: 'cash' } })
  })

  it('refund_withoutAReason_isRefusedNamingIt', async () => {
    const { v, manager } = await yard()
    const res = await manager.post(`/api/vehicles/${v.id}/refunds`, { idempotencyKey: key(), method: 'cash', amountCents: 100 })
    expect(res.status).toBe(400)
    expect(res.body.issues.map((i: { path: string }) => i.path)).toContain('reason')
  })
})
