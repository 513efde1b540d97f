import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { countDrawer, invoiceCharges, settle, storageBill } from '@shared/domain/billing'
import { ruleSetSchema } from '@shared/schemas/rule-sets'

const sample = (name: string) => ruleSetSchema.parse(JSON.parse(readFileSync(`server/rule-sets/samples/${name}.json`, 'utf8')))
const florida = sample('florida')
const california = sample('california')
const rate = (rs: typeof florida, code: string) => rs.vehicleClasses.find((c) => c.code === code)!.dailyRateCents
const fee = (rs: typeof florida, code: string) => rs.fees.find((f) => f.code === code)!.amountCents

describe('an invoice to the cent, against the core', () => {
  // Florida sample: "each 24-hour period or fraction thereof" (common city-ordinance wording [S], REFERENCES.md);
  // Fla. Stat. § 212.03(6) taxes renting storage space for motor vehicles at 6 % [M]; the impound fee untaxed.
  // Arrived Mon 2 Mar 2026 10:00 EST, as of Thu 5 Mar 11:00 EST: 73 hours → 4 periods [C].
  // With the sample's $50.00 a day: storage $200.00, tax $12.00, impound $75.00, tow $185.00 → $472.00 [C].
  it('Florida sample, 73 hours: four 24-hour periods, 6 % tax on storage only, impound and tow untaxed', () => {
    const bill = storageBill({ arrivedAt: '2026-03-02T10:00:00-05:00', vehicleClass: 'standard' }, florida, '2026-03-05T11:00:00-05:00')
    const inv = invoiceCharges(bill, 18_500)
    expect(rate(florida, 'standard')).toBe(5_000)
    expect(inv.lines.map((l) => [l.code, l.quantity, l.amountCents, l.taxCents])).toEqual([
      ['tow', 1, 18_500, 0],
      ['storage', 4, 20_000, 1_200],
      ['impound', 1, fee(florida, 'impound'), 0],
    ])
    expect(inv).toMatchObject({ subtotalCents: 46_000, taxCents: 1_200, totalCents: 47_200 })
  })

  // Cal. Civ. Code § 3068.1(a)(1) [V]: released 24 hours or less after storage → no more than one day's storage.
  // Arrived 2 Mar 2026 10:00 PST, left 3 Mar 09:59 PST (23 h 59 min) → 1 day at $65.00 + impound $95.00 + tow → no tax (rate 0 in the sample).
  it('California sample, released within 24 hours: one day, frozen at the release whatever the as-of date', () => {
    const bill = storageBill({ arrivedAt: '2026-03-02T10:00:00-08:00', releasedAt: '2026-03-03T09:59:00-08:00', vehicleClass: 'standard' }, california, '2026-04-30T12:00:00-07:00')
    const inv = invoiceCharges(bill, 24_500)
    expect(bill.endedBy).toBe('release')
    expect(bill.days).toBe(1)
    expect(inv.totalCents).toBe(24_500 + rate(california, 'standard') + fee(california, 'impound'))
    expect(inv.totalCents).toBe(24_500 + 6_500 + 9_500)
  })

  // Holdfast's own settlement rule [C]: charges − approved credits − (payments − refunds); pending credits count for nothing.
  it('settles $472.00 less a $20.00 discount, $200.00 paid and $10.00 refunded: $262.00 due; a pending $50.00 waiver does not count', () => {
    const s = settle(
      47_200,
      [
        { amountCents: 2_000, status: 'approved' },
        { amountCents: 5_000, status: 'pending' },
        { amountCents: 9_000, status: 'declined' },
      ],
      [
        { kind: 'payment', method: 'cash', amountCents: 20_000 },
        { kind: 'refund', method: 'cash', amountCents: 1_000 },
      ],
    )
    expect(s).toEqual({ chargesCents: 47_200, creditedCents: 2_000, paidCents: 20_000, refundedCents: 1_000, netPaidCents: 19_000, dueCents: 26_200, waived: false })
  })

  // Drawer close-out, common counter practice (no published source): expected = opening float + cash in − cash out;
  // over/short = counted − expected. Float $100.00; cash $120.00 and $50.00 in, $20.00 refunded; a $90.00 check
  // is not in the drawer → recorded $150.00, expected $250.00; counted $249.50 → 50 cents short [C].
  it('closes the drawer: float plus cash in less cash out, checks and cards left out; counted less expected is over/short', () => {
    const count = countDrawer(
      [
        { kind: 'payment', method: 'cash', amountCents: 12_000 },
        { kind: 'payment', method: 'cash', amountCents: 5_000 },
        { kind: 'refund', method: 'cash', amountCents: 2_000 },
        { kind: 'payment', method: 'check', amountCents: 9_000 },
        { kind: 'payment', method: 'card', amountCents: 4_000 },
      ],
      10_000,
      24_950,
    )
    expect(count).toEqual({ recordedCents: 15_000, expectedCents: 25_000, countedCents: 24_950, overShortCents: -50 })
  })
})
